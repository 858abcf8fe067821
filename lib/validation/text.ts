// Text that no field may hold: the NUL character (PostgreSQL cannot store it) and lone UTF-16
// surrogates (they have no UTF-8 form). Checked once where input enters: JSON bodies, form values,
// URL parameters.

// oxlint-disable-next-line no-control-regex -- NUL is what this refuses
const BAD = /\u0000|[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

export const BAD_TEXT_MESSAGE = "contains a NUL character or a broken Unicode character; remove it and send the text again.";

export const isCleanText = (text: string) => !BAD.test(text);

/** The path ("claims.0.label", or "_" for the top) of the first string or key holding bad text, else null. */
export function findBadText(value: unknown, path: string[] = []): string | null {
  const here = () => (path.length ? path.join(".") : "_");
  if (typeof value === "string") return isCleanText(value) ? null : here();
  if (Array.isArray(value)) {
    for (const [i, item] of value.entries()) {
      const found = findBadText(item, [...path, String(i)]);
      if (found) return found;
    }
    return null;
  }
  if (value && typeof value === "object") {
    for (const [key, item] of Object.entries(value)) {
      if (!isCleanText(key)) return here();
      const found = findBadText(item, [...path, key]);
      if (found) return found;
    }
  }
  return null;
}

/**
 * A path segment as the app would use it: percent-decoded, or null when it cannot be decoded
 * ("%C0%AF", "%ud800") or decodes to bad text ("%00").
 */
export function decodePathSegment(segment: string): string | null {
  try {
    const decoded = decodeURIComponent(segment);
    return isCleanText(decoded) ? decoded : null;
  } catch {
    return null;
  }
}

/** A URL parameter as a route receives it: clean text, with no percent escape left that failed to decode. */
export const isCleanParam = (value: string) => isCleanText(value) && !/%(?:[0-9a-f]{2}|u[0-9a-f]{4})/i.test(value);
