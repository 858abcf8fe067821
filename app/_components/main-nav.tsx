"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { currentNavHref, type NavItem } from "@/lib/nav";

/** The main navigation, with the section of the page in view marked as current (aria-current and a bar under it). */
export function MainNav({ items }: { items: NavItem[] }) {
  const current = currentNavHref(items, usePathname() ?? "");
  return (
    <nav aria-label="Main" className="flex flex-1 flex-col gap-1 text-sm md:flex-row md:flex-wrap">
      {items.map((item) => (
        <Link
          key={item.href}
          href={item.href}
          aria-current={item.href === current ? "page" : undefined}
          className="rounded-md border-b-2 border-transparent px-2.5 py-1 text-ink-soft no-underline hover:bg-paper-sunk hover:text-ink hover:no-underline aria-[current=page]:border-accent aria-[current=page]:font-semibold aria-[current=page]:text-ink"
        >
          {item.label}
        </Link>
      ))}
    </nav>
  );
}
