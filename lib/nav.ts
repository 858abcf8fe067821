import type { AppAbility } from "@/policies";

export interface NavItem {
  href: string;
  label: string;
}

/** The main navigation, from the same abilities the server enforces (hiding only; the server still checks). */
export function navFor(ability: AppAbility, roles: readonly string[], options: { mailroom: boolean }): NavItem[] {
  const items: NavItem[] = [{ href: "/desk", label: "Desk" }];
  if (ability.can("read", "Tender")) items.push({ href: "/tenders", label: "Tenders" });
  // Engineers reach their bench before declaring on any tender; the bench asks for the declaration.
  if (roles.includes("engineer")) items.push({ href: "/review", label: "Review bench" });
  if (ability.can("list", "Thread")) items.push({ href: "/threads", label: "Clarifications" });
  if (ability.can("use", "Bounds")) items.push({ href: "/explorer", label: "Bound explorer" });
  if (ability.can("manage", "User")) items.push({ href: "/people", label: "People" });
  if (ability.can("read", "ApprovalLimit")) items.push({ href: "/approval-limits", label: "Approval limits" });
  if (ability.can("verify", "Ledger")) items.push({ href: "/ledger-check", label: "Ledger check" });
  if (options.mailroom && ability.can("use", "Mailroom")) items.push({ href: "/mailroom", label: "Mailroom" });
  items.push({ href: "/memo-check", label: "Memo check" });
  return items;
}

/**
 * The item the page at `pathname` belongs to: the one whose path is the page's or its longest
 * prefix ("/tenders/abc/review" belongs to "/tenders"), or null.
 */
export function currentNavHref(items: readonly NavItem[], pathname: string): string | null {
  const within = items.filter((i) => pathname === i.href || pathname.startsWith(`${i.href}/`));
  return within.sort((a, b) => b.href.length - a.href.length)[0]?.href ?? null;
}
