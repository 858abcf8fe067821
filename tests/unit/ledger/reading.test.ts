import { describe, expect, it } from "vitest";
import { asSubject, defineAbilityFor, type SubjectRecords, type SubjectType } from "@/policies";
import { ledgerSentence, readableDetails, type EntryContext, type LedgerEntryIn } from "@/lib/ledger/reading";
import { actorFor, T1, VENDOR_A, VENDOR_B } from "../policies/fixtures";

const context: EntryContext = {
  tenderId: T1,
  tenderState: "commercial",
  tenderCreatedBy: "user-buyer",
  envelopeOpened: true,
  invitedOrgIds: [VENDOR_A, VENDOR_B],
  vendorOrgId: VENDOR_A,
};
const entry = (action: string, data: Record<string, unknown>, actorLabel = "Ravi Okonjo"): LedgerEntryIn => ({
  seq: 1,
  at: "2027-01-01T00:00:00.000Z",
  actorId: "user-engineer",
  actorLabel,
  action,
  subjectType: "Claim",
  subjectId: "claim-a",
  data,
  hash: "h",
});
const readerFor = (roles: Parameters<typeof actorFor>[0], over: Parameters<typeof actorFor>[1] = {}) => {
  const ability = defineAbilityFor(actorFor(roles, over));
  return <S extends SubjectType>(subject: S, record: SubjectRecords[S]) => ability.can("read", asSubject(subject, record));
};

describe("ledger details by reading rights", () => {
  const marked = entry("claim.marked", { reference: "RC-1", mark: "accepted", comment: "Matches the lab run.", vendor: "Kestrelink Radio" });

  it("keeps a mark whole for a declared approver, and masks it for one conflicted with that vendor", () => {
    expect(readableDetails(marked, context, readerFor("approver"))).toEqual({ data: marked.data, masked: [] });
    const conflicted = readerFor("approver", { declarations: [{ tenderId: T1, conflictedVendorOrgIds: [VENDOR_A] }] });
    expect(readableDetails(marked, context, conflicted)).toEqual({ data: { reference: "RC-1" }, masked: ["mark", "comment", "vendor"] });
  });

  it("masks an award's value for an admin but keeps its public memo fingerprint", () => {
    const awarded = entry("tender.awarded", { from: "approval", to: "awarded", value: 120000, currency: "EUR", memo: "RC-1-M1", sha256: "ab" });
    expect(readableDetails(awarded, context, readerFor("admin"))).toEqual({
      data: { from: "approval", to: "awarded", memo: "RC-1-M1", sha256: "ab" },
      masked: ["value", "currency"],
    });
  });

  it("leaves entries without a guarded record whole", () => {
    const opened = entry("tender.opened", { invited: ["Kestrelink Radio"] });
    expect(readableDetails(opened, context, readerFor("admin")).masked).toEqual([]);
  });
});

describe("ledger sentences", () => {
  it("say who did what to which tender", () => {
    expect(ledgerSentence(entry("claim.marked", {}), "RC-2027-001")).toBe("Ravi Okonjo marked a claim in RC-2027-001.");
    expect(ledgerSentence(entry("tender.closed", {}, "system"), "RC-2027-001")).toBe("RC-2027-001 closed for offers at its closing time.");
    expect(ledgerSentence(entry("something.new", {}), "RC-2027-001")).toBe('Ravi Okonjo recorded "something.new" on RC-2027-001.');
  });

  it("says whether a cancelled tender's offers stay sealed", () => {
    expect(ledgerSentence(entry("tender.cancelled", { offersSealed: true }, "Ines Calloway"), "RC-2027-003")).toBe(
      "Ines Calloway cancelled RC-2027-003 before its closing time; its offers stay sealed to the buying side.",
    );
    expect(ledgerSentence(entry("tender.cancelled", { offersSealed: false }, "Ines Calloway"), "RC-2027-001")).toMatch(
      /after its closing time; its offers stay as unsealed at closing/,
    );
    expect(ledgerSentence(entry("tender.cancelled", {}, "Ines Calloway"), "RC-2027-001")).toBe("Ines Calloway cancelled RC-2027-001.");
  });
});
