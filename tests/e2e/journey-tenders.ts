// The tender of each browser journey: tests/e2e/prepare.ts writes them into the browser tests' own
// database before the server starts, each in its journey's starting state, and the journeys find
// them by reference. Copies of the demo gauges tender (RC-2027-001) under invented titles; the
// demo data itself has none of them.
export const JOURNEY_TENDERS = {
  /** Technical evaluation, as the demo's gauges tender: the engineer has not declared. */
  review: { reference: "RC-E2E-REVIEW", title: "Canal-lock gauge radios" },
  /** Commercial evaluation: technical evaluation signed, envelopes sealed. */
  comparison: { reference: "RC-E2E-COMPARISON", title: "Reservoir-level gauge radios" },
  /** Approval: envelopes open, a 250,000 EUR recommendation of the top offer awaiting approval. */
  deadlock: { reference: "RC-E2E-DEADLOCK", title: "Estuary gauge radios" },
  /** Approval, as the deadlock tender starts. */
  award: { reference: "RC-E2E-AWARD", title: "Tributary gauge radios" },
  /** Awarded: both approvers approved the 250,000 EUR recommendation, the memo is issued. */
  ledger: { reference: "RC-E2E-LEDGER", title: "Spring-line gauge radios" },
} as const;

export type Journey = keyof typeof JOURNEY_TENDERS;

/** 4,000 radios with installation and support: the band from 250,000 EUR needs two approvals. */
export const AWARD_VALUE = 250_000;
export const AWARD_VALUE_REASON = "Installation at every gauge site and five years of support.";
