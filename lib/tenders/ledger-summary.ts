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
 * A ledger entry's details for the Ledger tab, one line each ("reason: …"). Long values are cut;
 * the full entry stays in the ledger (and in its hash).
 */
export function ledgerDetails(data: Record<string, unknown>): { key: string; text: string }[] {
  return (
    Object.entries(data)
      // The reference is in the sentence; ids are for machines (names sit beside them).
      .filter(([key]) => key !== "reference" && !key.endsWith("Ids") && !key.endsWith("Id"))
      .map(([key, value]) => {
        const text = short(value);
        return { key, text: text.length > MAX_LENGTH ? `${text.slice(0, MAX_LENGTH - 1)}…` : text };
      })
  );
}
