// Numbers as people type them in forms and lab files. One reading everywhere, so a form and a CSV
// row say the same thing: "0,00001" is a decimal comma, "2,000,000" groups thousands.

const SPACES = /[\s_\u00a0\u202f]/g;

/**
 * A decimal: "1e-5", "0.00001", "0,00001" (one comma and no point: a decimal comma),
 * "1,250.50" or "2,000,000" (commas with a point, or several commas: thousands). null when
 * empty, NaN when it is not a number at all.
 */
export function parseDecimal(raw: string): number | null {
  let text = raw.replace(SPACES, "");
  if (text === "") return null;
  const commas = (text.match(/,/g) ?? []).length;
  text = commas === 1 && !text.includes(".") ? text.replace(",", ".") : text.replace(/,/g, "");
  const value = Number(text);
  return Number.isFinite(value) ? value : NaN;
}

/** A count: "200000", "200,000", "200 000", "2e5"; every comma groups thousands. */
export function parseCount(raw: string): number | null {
  const text = raw.replace(SPACES, "").replace(/,/g, "");
  if (text === "") return null;
  const value = Number(text);
  return Number.isFinite(value) ? value : NaN;
}

const blank = (v: unknown) => v === "" || v === null || v === undefined;

/** For react-hook-form's setValueAs: a decimal field, undefined when left empty (the schema says it is required). */
export const formDecimal = (v: unknown): number | undefined => (blank(v) ? undefined : typeof v === "number" ? v : (parseDecimal(String(v)) ?? undefined));
/** A decimal field that may stay empty (null). */
export const formOptionalDecimal = (v: unknown): number | null => (blank(v) ? null : typeof v === "number" ? v : parseDecimal(String(v)));
/** A count field, undefined when left empty. */
export const formCount = (v: unknown): number | undefined => (blank(v) ? undefined : typeof v === "number" ? v : (parseCount(String(v)) ?? undefined));
/** A count field that may stay empty (null). */
export const formOptionalCount = (v: unknown): number | null => (blank(v) ? null : typeof v === "number" ? v : parseCount(String(v)));
