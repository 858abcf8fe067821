import type { EvidenceStatus, MarkKind } from "@/db/schema/evaluation";

// Words for the review's states, kept apart from the rules so client components import no engine code.

export const MARK_LABELS: Record<MarkKind, string> = {
  accepted: "Accepted",
  "rejected-impossible": "Rejected as impossible",
  "evidence-requested": "Evidence requested",
  "clarification-requested": "Clarification requested",
};

export type EvidenceSummary = EvidenceStatus | "none";

export const EVIDENCE_LABELS: Record<EvidenceSummary, string> = {
  none: "No lab run",
  verified: "Verified",
  contradicted: "Contradicted",
  inconclusive: "Inconclusive",
};
