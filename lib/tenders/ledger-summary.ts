const MAX_LENGTH = 160;

function short(value: unknown): string {
  if (value === null || value === undefined) return "none";
  if (Array.isArray(value)) return value.every((v) => typeof v !== "object") ? value.join(", ") || "none" : `${value.length} items`;
  if (typeof value === "object") {
    const { from, to } = value as { from?: unknown; to?: unknown };
    if ("from" in value && "to" in value) return `${short(from)} → ${short(to)}`;
    const entries = Object.entries(value);
    // A map of changes ({ quantity: { from, to } }) reads as "quantity 250 → 300".
    if (entries.length > 0 && entries.every(([, v]) => v && typeof v === "object" && "from" in v && "to" in v)) {
      return entries.map(([k, v]) => `${k} ${short(v)}`).join(", ");
    }
    return entries.map(([k, v]) => `${k} ${typeof v === "object" && v !== null ? "…" : String(v)}`).join(", ");
  }
  return String(value);
}

/**
 * One line of a ledger entry's data for the Ledger tab: "reason: …; from: open". Long values are
 * cut; the full entry stays in the ledger (and in its hash).
 */
export function summariseLedgerData(data: Record<string, unknown>): string {
  const parts = Object.entries(data)
    // The reference is in the page's header; ids are for machines (names sit beside them).
    .filter(([key]) => key !== "reference" && !key.endsWith("Ids"))
    .map(([key, value]) => `${key}: ${short(value)}`);
  const line = parts.join("; ");
  return line.length > MAX_LENGTH ? `${line.slice(0, MAX_LENGTH - 1)}…` : line;
}
