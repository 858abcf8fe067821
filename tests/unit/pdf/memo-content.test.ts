import { describe, expect, it } from "vitest";
import { memoDocument, type MemoFacts } from "@/lib/approvals/memo-content";

const AT = new Date("2027-03-04T10:15:00.000Z");
const claim = (over: Partial<MemoFacts["offers"][number]["claims"][number]> = {}): MemoFacts["offers"][number]["claims"][number] => ({
  pointLabel: "Storm fade",
  channelValue: 5e-3,
  metric: "bler",
  value: 1e-6,
  ncgOutputBer: null,
  verdict: "plausible",
  mark: "accepted",
  markComment: "",
  runs: [],
  ...over,
});

function facts(over: Partial<MemoFacts> = {}): MemoFacts {
  return {
    identifier: "RC-2099-001-M1",
    draft: false,
    issuedAt: AT,
    zone: "UTC",
    buyerOrganisation: "Example Water",
    tender: {
      reference: "RC-2099-001",
      title: "Weir radios",
      description: "",
      channelModel: "bsc",
      operatingPoints: [{ label: "Storm fade", value: 5e-3 }],
      targetMetric: "bler",
      targetValue: 1e-4,
      maxFrameBits: null,
      quantity: 10,
      currency: "EUR",
    },
    offers: [{ vendorName: "Alder", moduleName: "A1", partNumber: "A-1", codeFamily: "LDPC", decision: "hard", n: 1024, k: 512, rate: 0.5, claims: [claim()] }],
    scoreSheet: null,
    recommendation: {
      vendorName: "Alder",
      moduleName: "A1",
      value: 1000,
      computedValue: 1000,
      valueReason: null,
      quantityReason: null,
      currency: "EUR",
      quantity: 10,
      justification: "Best.",
      preparedBy: "Pat",
      preparedAt: AT,
    },
    approvals: [],
    approvalsNeeded: 1,
    safetyRelevant: false,
    technical: {
      signatures: [{ name: "Sam Engineer", signedAt: AT, statement: "All reviewed." }],
      declarations: [{ name: "Sam Engineer", createdAt: AT, statement: "No ties.", conflicts: 1 }],
    },
    cautions: "Verdicts judge coding claims against mathematical limits.",
    ...over,
  };
}

describe("the memo's words", () => {
  it("lists the technical sign-off, the declarations and the lab evidence behind each verdict", () => {
    const run = { channelValue: 5e-3, unit: "frames" as const, trials: 3_000_000, errors: 0, confidence: 0.95, upper: 9.99e-7, status: "verified" as const };
    const doc = memoDocument(facts({ offers: [{ ...facts().offers[0], claims: [claim({ runs: [run] })] }] }));
    expect(doc.technical.signatures[0]).toMatchObject({ name: "Sam Engineer", statement: "All reviewed.", at: "4 Mar 2027, 10:15 UTC" });
    expect(doc.technical.declarations[0].conflicts).toMatch(/a conflict with 1 vendor/);
    expect(doc.offers[0].claims[0].evidence).toBe("Verified: 0 errors in 3,000,000 frames at p = 5e-3 (upper bound 9.99e-7 at 95 %)");
  });

  it("flags an acceptance against an impossible verdict with its justification", () => {
    const doc = memoDocument(
      facts({ offers: [{ ...facts().offers[0], claims: [claim({ verdict: "impossible", markComment: "The lab report outweighs the bound." })] }] }),
    );
    expect(doc.offers[0].claims[0].review).toBe("FLAG: accepted although the engine found it impossible. Justification: The lab report outweighs the bound.");
  });

  it("carries the stronger caution on a safety-relevant tender only", () => {
    expect(memoDocument(facts()).cautions).not.toMatch(/Safety-relevant/);
    expect(memoDocument(facts({ safetyRelevant: true })).cautions).toMatch(
      /^Safety-relevant tender: .*qualification testing, the local codes and licensed professional practice decide it/,
    );
  });
});
