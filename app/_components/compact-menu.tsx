"use client";

import { useEffect, useId, useState } from "react";
import { usePathname } from "next/navigation";

/**
 * The header's navigation and account block: inline from the md breakpoint up; below it folded
 * behind a Menu button (a disclosure: aria-expanded on the button, the panel shown or hidden).
 * The children stay server-rendered; only the open/closed state lives here. The menu closes on
 * navigation and on Escape.
 */
export function CompactMenu({ children }: { children: React.ReactNode }) {
  const [open, setOpen] = useState(false);
  const [openedAt, setOpenedAt] = useState<string | null>(null);
  const pathname = usePathname();
  const panelId = useId();
  // Navigating closes the menu: it counts as open only on the page where it was opened.
  const shown = open && openedAt === pathname;

  useEffect(() => {
    if (!shown) return;
    const onKey = (e: KeyboardEvent) => e.key === "Escape" && setOpen(false);
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [shown]);

  return (
    <>
      <button
        type="button"
        className="btn-quiet ml-auto md:hidden print:hidden"
        aria-expanded={shown}
        aria-controls={panelId}
        onClick={() => {
          setOpen(!shown);
          setOpenedAt(pathname);
        }}
      >
        <svg width="16" height="16" viewBox="0 0 16 16" aria-hidden>
          {shown ? (
            <path d="M3.5 3.5l9 9M12.5 3.5l-9 9" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
          ) : (
            <path d="M2.5 4h11M2.5 8h11M2.5 12h11" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
          )}
        </svg>
        Menu
      </button>
      <div
        id={panelId}
        className={`${shown ? "flex" : "hidden"} w-full flex-col gap-3 border-t border-ink-faint/20 pt-3 md:flex md:w-auto md:flex-1 md:flex-row md:items-center md:gap-6 md:border-0 md:pt-0 print:hidden`}
      >
        {children}
      </div>
    </>
  );
}
