// Whether the people who exist can give a recommendation the approvals its band needs.
import { formatMoney } from "@/lib/format";
import { describeBand, type Band, type BandRule } from "./bands";
import { limitCovers } from "./routing";

export interface ApproverCandidate {
  id: string;
  name: string;
  /** Active and holding the approver role: only such people are candidates at all. */
  approvalLimit: number | null;
}

export interface CoverageFacts {
  value: number;
  currency: string;
  rule: BandRule;
  /** Who may not approve this one: the preparer, the tender's creator, anyone who declared a conflict. */
  excluded: ReadonlySet<string>;
  /** Who already approved it. */
  approvedBy: readonly string[];
}

export interface Coverage<C extends ApproverCandidate> {
  /** Everyone who may approve it (some may already have). */
  eligible: C[];
  /** Approvals still needed. */
  missing: number;
  /** Eligible people who have not yet approved. */
  remaining: C[];
  /** How many approvals nobody left can give (0 when it can be approved). */
  shortfall: number;
}

export function coverage<C extends ApproverCandidate>(candidates: readonly C[], f: CoverageFacts): Coverage<C> {
  const eligible = candidates
    .filter((c) => limitCovers(c.approvalLimit, f.value, f.rule) && !f.excluded.has(c.id))
    .sort((a, b) => a.name.localeCompare(b.name));
  const missing = Math.max(0, f.rule.approvalsNeeded - f.approvedBy.length);
  const remaining = eligible.filter((c) => !f.approvedBy.includes(c.id));
  return { eligible, missing, remaining, shortfall: Math.max(0, missing - remaining.length) };
}

const people = (n: number) => `${n} approver${n === 1 ? "" : "s"}`;
const approvalsWord = (n: number) => `${n} approval${n === 1 ? "" : "s"}`;
/** "no active approver holds", "only 1 approver holds", "only 2 approvers hold". */
const holders = (n: number) => (n === 0 ? "no active approver holds" : `only ${people(n)} hold${n === 1 ? "s" : ""}`);
const names = (list: readonly ApproverCandidate[]) => (list.length ? ` (${list.map((c) => c.name).join(", ")})` : "");

/** The least limit an approver needs for this value under its rule. */
export const limitNeeded = (value: number, rule: BandRule) => Math.max(value, rule.minApproverLimit);

/** Why a new recommendation cannot be approved by the people who exist, or null. */
export function submissionShortfall(c: Coverage<ApproverCandidate>, f: CoverageFacts): string | null {
  if (c.shortfall === 0) return null;
  const limit = formatMoney(limitNeeded(f.value, f.rule), f.currency);
  return (
    `This award of ${formatMoney(f.value, f.currency)} needs ${approvalsWord(f.rule.approvalsNeeded)} from different approvers with a limit of at least ${limit}, ` +
    `who neither prepared it nor created the tender nor declared a conflict on it; ${c.eligible.length === 0 ? "nobody" : `only ${people(c.eligible.length)}`} can give one${names(c.eligible)}. ` +
    `Nothing was submitted: ask an admin to raise an approver's limit or add an approver on the People page, or recommend an award those approvers can cover.`
  );
}

/** Why a pending recommendation is stuck (no value named: admins read this too), or null. */
export function pendingShortfall(c: Coverage<ApproverCandidate>): string | null {
  if (c.shortfall === 0) return null;
  return (
    `It still needs ${approvalsWord(c.missing)}, and ${c.remaining.length === 0 ? "no approver" : `only ${people(c.remaining.length)}`} who has not yet approved can give one. ` +
    `The buyer can withdraw it from the Sign-off tab, or an admin can raise an approver's limit on the People page.`
  );
}

/**
 * The highest award value in a band that the active approvers can approve today, or null when
 * none: the band's n-th largest qualifying limit, n being the approvals it needs.
 */
export function bandReach(band: Band, limits: readonly (number | null)[]): number | null {
  const qualifying = limits.filter((l): l is number => l !== null && l >= band.minApproverLimit).sort((a, b) => b - a);
  const reach = qualifying[band.approvalsNeeded - 1];
  return reach === undefined || reach < band.minValue ? null : reach;
}

/** A warning for the Approval limits page when today's approvers cannot meet a band (or all of it), or null. */
export function bandWarning(band: Band, limits: readonly (number | null)[]): string | null {
  const reach = bandReach(band, limits);
  const money = (v: number) => formatMoney(v, band.currency);
  const needs = `needs ${approvalsWord(band.approvalsNeeded)} from different approvers`;
  if (reach === null) {
    const floor = Math.max(band.minApproverLimit, band.minValue);
    const count = limits.filter((l) => l !== null && l >= floor).length;
    return `No award in the band ${describeBand(band)} can be approved today: it ${needs} with a limit of at least ${money(floor)}, and ${holders(count)} one.`;
  }
  if (band.maxValue !== null && reach >= band.maxValue - 0.01) return null;
  const above = limits.filter((l) => l !== null && l > reach).length;
  return `Awards above ${money(reach)} in the band ${describeBand(band)} cannot be approved today: the band ${needs}, and ${holders(above)} a limit above ${money(reach)}.`;
}
