/** Probabilities in scientific notation the trade reads at a glance: 1.2e-6, 5e-3, 0.5 stays 0.5 above 0.01. */
export function formatSci(value: number, digits = 2): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return "0";
  const abs = Math.abs(value);
  if (abs >= 0.01 && abs < 1e4) return String(Number(value.toPrecision(digits + 1)));
  const [mantissa, exponent] = value.toExponential(digits).split("e");
  const m = mantissa.replace(/\.?0+$/, "");
  return `${m}e${Number(exponent)}`;
}

// Building an Intl.NumberFormat costs about 0.15 ms; score sheets format every line of every offer.
const moneyFormats = new Map<string, Intl.NumberFormat>();

/** A money amount with its currency, tabular. */
export function formatMoney(value: number, currency: string): string {
  let format = moneyFormats.get(currency);
  if (!format) moneyFormats.set(currency, (format = new Intl.NumberFormat("en-GB", { style: "currency", currency, maximumFractionDigits: 2 })));
  return format.format(value);
}

export const CHANNEL_LABELS = {
  bsc: { name: "Hard decision (binary symmetric channel)", parameter: "raw BER p", unit: "" },
  bec: { name: "Erasures (binary erasure channel)", parameter: "erasure probability e", unit: "" },
  biawgn: { name: "Soft decision (binary-input AWGN)", parameter: "Eb/N0", unit: "dB" },
} as const;

/** An operating point's channel condition in its unit. */
export function formatCondition(model: keyof typeof CHANNEL_LABELS, value: number): string {
  return model === "biawgn" ? `Eb/N0 ${value} dB` : `${model === "bsc" ? "p" : "e"} = ${formatSci(value)}`;
}

/** An operating point in words: its channel condition, or its input level with bit rate, payload and packet error rate. */
export function formatPoint(
  model: keyof typeof CHANNEL_LABELS,
  point: { value: number; sensitivity?: { bitRate: number; payloadBits: number; targetPer: number } | null },
): string {
  const s = point.sensitivity;
  if (!s) return formatCondition(model, point.value);
  return `input level ${point.value} dBm at ${s.bitRate.toLocaleString("en-GB")} bit/s, ${s.payloadBits.toLocaleString("en-GB")}-bit payload, PER ≤ ${formatSci(s.targetPer)}`;
}
