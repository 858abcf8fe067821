"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

/** The tender page's tabs as links; the current one is marked for the eye and for screen readers. */
export function TenderTabs({ tabs }: { tabs: { href: string; label: string }[] }) {
  const pathname = usePathname();
  // The longest matching link wins, so /tenders/x/offers/y still marks Offers and not Requirements.
  const current = tabs.filter((t) => pathname === t.href || pathname.startsWith(`${t.href}/`)).sort((a, b) => b.href.length - a.href.length)[0]?.href;
  return (
    <nav aria-label="Tender sections" className="flex gap-1 overflow-x-auto border-b border-ink-faint/25 text-sm print:hidden">
      {tabs.map((tab) => {
        const active = tab.href === current;
        return (
          <Link
            key={tab.href}
            href={tab.href}
            aria-current={active ? "page" : undefined}
            className={`-mb-px shrink-0 whitespace-nowrap border-b-2 px-3 py-1.5 no-underline hover:no-underline ${active ? "border-accent font-medium text-ink" : "border-transparent text-ink-soft hover:text-ink"}`}
          >
            {tab.label}
          </Link>
        );
      })}
    </nav>
  );
}
