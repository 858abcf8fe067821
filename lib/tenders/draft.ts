import type { tenders } from "@/db/schema";
import { DEFAULT_ASSUMED_NF_DB, DEFAULT_STANDSTILL_DAYS, type TenderInput } from "@/lib/validation/tender";
import { canonicalJson } from "@/lib/ledger/chain";
import { closingInstant, closingLocal, DEFAULT_ZONE } from "./closing";

type TenderRow = typeof tenders.$inferSelect;
/** The columns a buyer writes in a draft. */
export type DraftValues = Pick<
  TenderRow,
  | "title"
  | "description"
  | "channelModel"
  | "operatingPoints"
  | "targetMetric"
  | "targetValue"
  | "maxFrameBits"
  | "assumedNoiseFigureDb"
  | "quantity"
  | "currency"
  | "weights"
  | "impossibleRule"
  | "impossiblePenalty"
  | "safetyRelevant"
  | "closesAt"
  | "closesZone"
  | "noticeDisclosure"
  | "standstillDays"
>;

type Shared = Omit<DraftValues, "maxFrameBits" | "impossiblePenalty" | "closesAt" | "closesZone">;

/** The fields the form and the columns hold alike, copied so that neither shares arrays with the other. */
function shared(from: Shared): Shared {
  return {
    title: from.title,
    description: from.description,
    channelModel: from.channelModel,
    operatingPoints: from.operatingPoints.map((p) =>
      p.sensitivity ? { label: p.label, value: p.value, sensitivity: { ...p.sensitivity } } : { label: p.label, value: p.value },
    ),
    targetMetric: from.targetMetric,
    targetValue: from.targetValue,
    assumedNoiseFigureDb: from.assumedNoiseFigureDb,
    quantity: from.quantity,
    currency: from.currency,
    weights: { ...from.weights },
    impossibleRule: from.impossibleRule,
    safetyRelevant: from.safetyRelevant,
    noticeDisclosure: from.noticeDisclosure,
    standstillDays: from.standstillDays,
  };
}

/** The columns of a draft from the form's values; the closing time becomes a UTC instant. */
export function draftValues(input: TenderInput): DraftValues {
  return {
    ...shared(input),
    maxFrameBits: input.maxFrameBits ?? null,
    impossiblePenalty: input.impossibleRule === "penalty" ? input.impossiblePenalty : 0,
    closesAt: closingInstant(input.closesLocal, input.closesZone),
    closesZone: input.closesZone,
  };
}

/** The form's values for a stored tender (to edit it, or to merge a partial change into it). */
export function draftInput(row: DraftValues & { invitedOrgIds: string[] }): TenderInput {
  return {
    ...shared(row),
    maxFrameBits: row.maxFrameBits,
    impossiblePenalty: row.impossiblePenalty,
    closesLocal: closingLocal(row.closesAt, row.closesZone),
    closesZone: row.closesZone,
    invitedOrgIds: [...row.invitedOrgIds],
  };
}

/** A new form's starting values: one week ahead at noon, the usual weights. */
export function blankDraftInput(now: Date): TenderInput {
  const inAWeek = closingLocal(new Date(now.getTime() + 7 * 86_400_000), DEFAULT_ZONE).slice(0, 10);
  return {
    title: "",
    description: "",
    channelModel: "bsc",
    operatingPoints: [{ label: "", value: 1e-3 }],
    targetMetric: "bler",
    targetValue: 1e-4,
    maxFrameBits: null,
    assumedNoiseFigureDb: DEFAULT_ASSUMED_NF_DB,
    quantity: 1,
    currency: "EUR",
    weights: { technical: 40, evidence: 15, price: 30, leadTime: 10, warranty: 5 },
    impossibleRule: "disqualify",
    impossiblePenalty: 0,
    safetyRelevant: false,
    noticeDisclosure: "rank",
    standstillDays: DEFAULT_STANDSTILL_DAYS,
    closesLocal: `${inAWeek}T12:00`,
    closesZone: DEFAULT_ZONE,
    invitedOrgIds: [],
  };
}

// Invitations are a set; jsonb reorders object keys: neither counts as a change.
const isStringList = (value: unknown): value is string[] => Array.isArray(value) && value.every((v) => typeof v === "string");
const comparable = (value: unknown): string => (value instanceof Date ? value.toISOString() : canonicalJson(isStringList(value) ? [...value].sort() : value));

/** The fields whose value differs, each with its old and new value, for the ledger. */
export function changedFields<T extends object>(before: T, after: T): Partial<Record<keyof T, { from: unknown; to: unknown }>> {
  const changes: Partial<Record<keyof T, { from: unknown; to: unknown }>> = {};
  for (const key of Object.keys(after) as (keyof T)[]) {
    if (comparable(before[key]) !== comparable(after[key])) changes[key] = { from: before[key], to: after[key] };
  }
  return changes;
}
