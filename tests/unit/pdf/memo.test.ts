import { createHash } from "node:crypto";
import { PDFDocument } from "pdf-lib";
import { describe, expect, it } from "vitest";
import { MEMO_PRODUCER, renderMemo, type MemoDocument } from "@/lib/pdf/memo";
import { pdfPageTexts, pdfText } from "./pdf-text";

const AT = new Date("2027-03-04T10:15:00.000Z");

function sample(overrides: Partial<MemoDocument> = {}): MemoDocument {
  const claims = (verdict: "impossible" | "needs-evidence" | "plausible") => [
    { point: "Clear weather (p = 1e-3)", claim: "BLER 1e-6", verdict, review: "Accepted", evidence: "Verified: 0 errors in 3,000,000 frames at p = 1e-3" },
    { point: "Storm fade (p = 5e-3)", claim: "BLER 1e-4", verdict, review: "No mark", evidence: "No lab run." },
  ];
  return {
    identifier: "RC-2099-001-M1",
    draft: false,
    issuedAt: AT,
    issuedAtText: "4 Mar 2027, 10:15 UTC",
    ledgerLine: "Ledger head when issued: entry #41, hash 0123456789ab.",
    tender: {
      reference: "RC-2099-001",
      title: "Harbour buoy radios",
      buyerOrganisation: "Example Port Authority",
      description: "Radios for buoys.",
      facts: [{ label: "Residual error required", value: "BLER at most 1e-4" }],
      operatingPoints: ["Clear weather: p = 1e-3", "Storm fade: p = 5e-3"],
    },
    offers: [
      { vendorName: "Alder Links", module: "AL-9", code: "LDPC (1944, 1620), hard decision", claims: claims("plausible") },
      { vendorName: "Birch Radio", module: "BR-2", code: "Polar (1024, 512), hard decision", claims: claims("impossible") },
      { vendorName: "Cedar RF", module: "CR-1", code: "BCH (2047, 1816), hard decision", claims: claims("needs-evidence") },
    ],
    scores: [
      { rank: "1", vendorName: "Alder Links", total: "81.2", note: "" },
      { rank: "-", vendorName: "Birch Radio", total: "0.0", note: "Disqualified: impossible claim" },
    ],
    recommendation: {
      vendorName: "Alder Links",
      module: "AL-9",
      value: "€300,000.00",
      quantity: "4,000 units",
      deviations: [],
      justification: "Best score.",
      prepared: "Prepared by Pat Buyer",
    },
    approvals: [
      { name: "Quinn Approver", at: "4 Mar 2027, 09:00 UTC", comment: "Fine." },
      { name: "Rowan Director", at: "4 Mar 2027, 10:15 UTC", comment: "" },
    ],
    approvalsNeeded: 2,
    technical: {
      signatures: [{ name: "Sam Engineer", at: "1 Mar 2027, 16:00 UTC", statement: "Every claim reviewed against the bounds." }],
      declarations: [{ name: "Sam Engineer", at: "20 Feb 2027, 09:00 UTC", statement: "No ties to any vendor.", conflicts: "no conflict" }],
    },
    cautions: "Verdicts judge coding claims against mathematical limits.",
    ...overrides,
  };
}

const sha = (bytes: Uint8Array) => createHash("sha256").update(bytes).digest("hex");

describe("the award memo PDF", () => {
  it("parses back and carries the tender, every vendor's verdicts, the approvers and the cautions", async () => {
    const bytes = await renderMemo(sample());
    const doc = await PDFDocument.load(bytes, { updateMetadata: false });
    expect(doc.getTitle()).toContain("Harbour buoy radios");
    expect(doc.getProducer()).toBe(MEMO_PRODUCER);
    expect(doc.getCreationDate()?.toISOString()).toBe(AT.toISOString());
    const text = await pdfText(bytes);
    expect(text).toContain("RC-2099-001: Harbour buoy radios");
    expect(text).toContain("Example Port Authority");
    expect(text).toContain("Ledger head when issued: entry #41, hash 0123456789ab.");
    for (const vendor of ["Alder Links: AL-9", "Birch Radio: BR-2", "Cedar RF: CR-1"]) expect(text).toContain(vendor);
    for (const word of ["Plausible", "Impossible", "Needs evidence"]) expect(text).toContain(word);
    expect(text).toContain("Approved by Quinn Approver, 4 Mar 2027, 09:00 UTC");
    expect(text).toContain("Approved by Rowan Director");
    expect(text).toContain("Verdicts judge coding claims against mathematical limits.");
    expect(text).toContain("€300,000.00");
    expect(text).toContain("Signed by Sam Engineer, 1 Mar 2027, 16:00 UTC");
    expect(text).toContain("Every claim reviewed against the bounds.");
    expect(text).toContain("Sam Engineer, 20 Feb 2027, 09:00 UTC: no conflict.");
    expect(text).toContain("Lab evidence: Verified: 0 errors in 3,000,000 frames at p = 1e-3");
  });

  it("prints each departure from the offer beside the computed value, with its reason", async () => {
    const deviations = ["Stated value €300,000.00; the offer's prices give €143,600.00 for 4,000 units. Reason: Fitting."];
    const text = await pdfText(await renderMemo(sample({ recommendation: { ...sample().recommendation, deviations } })));
    expect(text).toContain("the offer's prices give €143,600.00 for 4,000 units");
    expect(text).toContain("Reason: Fitting.");
  });

  it("prints the memo identifier in the footer of every page", async () => {
    const many = sample({ offers: Array.from({ length: 14 }, (_, i) => ({ ...sample().offers[i % 3], vendorName: `Vendor ${i + 1}` })) });
    const pages = await pdfPageTexts(await renderMemo(many));
    expect(pages.length).toBeGreaterThan(1);
    pages.forEach((page, i) => {
      expect(page).toContain("Ratecourt award memo RC-2099-001-M1");
      expect(page).toContain(`page ${i + 1} of ${pages.length}`);
    });
  });

  it("gives the same bytes for the same input and different bytes for a different one", async () => {
    const a = await renderMemo(sample());
    const b = await renderMemo(sample());
    expect(sha(a)).toBe(sha(b));
    const c = await renderMemo(sample({ approvals: sample().approvals.slice(0, 1) }));
    expect(sha(c)).not.toBe(sha(a));
  });

  it("marks a preview as such on every page", async () => {
    const text = await pdfText(await renderMemo(sample({ draft: true, identifier: "RC-2099-001-PREVIEW" })));
    expect(text).toContain("PREVIEW");
    expect(text).toContain("not approved, not an award");
  });
});
