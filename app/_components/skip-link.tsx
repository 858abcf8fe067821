import { MAIN_ID } from "./main";

/** The first thing a keyboard reaches on every page: hidden until focused, it jumps past the header. */
export function SkipLink() {
  return (
    <a
      href={`#${MAIN_ID}`}
      className="sr-only focus:not-sr-only focus:fixed focus:left-3 focus:top-3 focus:z-50 focus:rounded-md focus:border focus:border-accent focus:bg-paper-raised focus:px-3 focus:py-2 focus:text-sm focus:font-medium focus:text-accent focus:shadow"
    >
      Skip to the main content
    </a>
  );
}
