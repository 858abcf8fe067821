import Link from "next/link";
import type { PageInfo } from "@/lib/validation/paging";

/** The address of the same list with another page and the same filters. */
export function pageHref(path: string, params: Record<string, string | number | undefined>, page: number): string {
  const query = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) if (value !== undefined && value !== "" && key !== "page") query.set(key, String(value));
  if (page > 1) query.set("page", String(page));
  return query.size ? `${path}?${query}` : path;
}

/**
 * Paging controls under a server-paged list: where this page sits, and links to the pages before
 * and after (plain links, so the page and filters stay in the address and work without scripts).
 */
export function Pager({ info, href, noun }: { info: PageInfo; href: (page: number) => string; noun: [string, string] }) {
  const first = info.total === 0 ? 0 : (info.page - 1) * info.pageSize + 1;
  const last = Math.min(info.total, info.page * info.pageSize);
  return (
    <nav aria-label={`${noun[1][0].toUpperCase()}${noun[1].slice(1)} pages`} className="flex flex-wrap items-center gap-3 text-sm">
      <span data-testid="pager-summary">
        {info.total === 0
          ? `No ${noun[1]}`
          : `${first.toLocaleString("en-GB")}–${last.toLocaleString("en-GB")} of ${info.total.toLocaleString("en-GB")} ${info.total === 1 ? noun[0] : noun[1]}`}
        {info.pages > 1 ? ` · page ${info.page} of ${info.pages}` : ""}
      </span>
      {info.page > 1 ? (
        <Link href={href(1)} aria-label="First page">
          First
        </Link>
      ) : null}
      {info.page > 1 ? (
        <Link href={href(info.page - 1)} rel="prev">
          Previous page
        </Link>
      ) : null}
      {info.hasMore ? (
        <Link href={href(info.page + 1)} rel="next">
          Next page
        </Link>
      ) : null}
    </nav>
  );
}
