import { CANCELLABLE_STATES, type TenderState } from "@/policies/vocabulary";

/**
 * The life of a tender. Each state lists where it may go next; "cancelled" is reachable from
 * every state before the award and is kept apart because it needs a reason.
 */
export const NEXT_STATES: Readonly<Record<TenderState, readonly TenderState[]>> = {
  draft: ["open"],
  open: ["technical"],
  technical: ["commercial"],
  commercial: ["approval"],
  approval: ["awarded", "commercial"],
  awarded: [],
  cancelled: [],
};

export const STATE_NAMES: Readonly<Record<TenderState, string>> = {
  draft: "draft",
  open: "open for offers",
  technical: "in technical evaluation",
  commercial: "in commercial evaluation",
  approval: "in approval",
  awarded: "awarded",
  cancelled: "cancelled",
};

export function isCancellable(state: TenderState): boolean {
  return (CANCELLABLE_STATES as readonly TenderState[]).includes(state);
}

export function canMove(from: TenderState, to: TenderState): boolean {
  if (to === "cancelled") return isCancellable(from);
  return NEXT_STATES[from].includes(to);
}

/** Why a tender may not move from one state to another, or null when it may. */
export function moveProblem(from: TenderState, to: TenderState): string | null {
  if (canMove(from, to)) return null;
  if (to === "cancelled") return `The tender is ${STATE_NAMES[from]} and can no longer be cancelled.`;
  return `A tender ${STATE_NAMES[from]} cannot become ${STATE_NAMES[to]}.`;
}

/** Requirements, weights and invitations change only while the tender is a draft. */
export function isEditable(state: TenderState): boolean {
  return state === "draft";
}

export function editProblem(state: TenderState): string | null {
  return isEditable(state) ? null : `The tender is ${STATE_NAMES[state]}: requirements and weights are locked.`;
}

export interface OpeningFacts {
  state: TenderState;
  operatingPoints: readonly unknown[];
  invitedOrgIds: readonly string[];
  closesAt: Date;
}

/** Everything that stops a draft from opening, in words for the buyer; empty when it may open. */
export function openingProblems(tender: OpeningFacts, now: Date): string[] {
  const moving = moveProblem(tender.state, "open");
  if (moving) return [moving];
  const problems: string[] = [];
  if (tender.operatingPoints.length === 0) problems.push("Add at least one operating point.");
  if (tender.invitedOrgIds.length === 0) problems.push("Invite at least one vendor organisation.");
  if (tender.closesAt.getTime() <= now.getTime()) problems.push("Set a closing time in the future.");
  return problems;
}

/** An open tender whose closing time has come moves to technical evaluation. */
export function isDueToClose(tender: { state: TenderState; closesAt: Date }, now: Date): boolean {
  return tender.state === "open" && tender.closesAt.getTime() <= now.getTime();
}
