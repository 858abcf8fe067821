import { describe, expect, it } from "vitest";
import { decodePathSegment, findBadText, isCleanText } from "@/lib/validation/text";

describe("bad text", () => {
  it("finds NUL and lone surrogates, and lets every well-formed string through", () => {
    expect(isCleanText("Gauge — Ω 😀 \n\t")).toBe(true);
    expect(isCleanText("a\u0000b")).toBe(false);
    expect(isCleanText("\ud800")).toBe(false);
    expect(isCleanText("x\udc00")).toBe(false);
    expect(isCleanText("\ud83d\ude00")).toBe(true);
  });

  it("names the path of the first bad string or key", () => {
    expect(findBadText({ a: [1, "ok", { b: "x\u0000" }] })).toBe("a.2.b");
    expect(findBadText({ ["k\ud800"]: 1 })).toBe("_");
    expect(findBadText("\udfff")).toBe("_");
    expect(findBadText({ a: ["fine"], n: 3, z: null })).toBeNull();
  });

  it("refuses path segments that do not decode to clean text", () => {
    expect(decodePathSegment("abc-123")).toBe("abc-123");
    expect(decodePathSegment("%E2%82%AC")).toBe("€");
    expect(decodePathSegment("%00")).toBeNull();
    expect(decodePathSegment("%C0%AF")).toBeNull();
    expect(decodePathSegment("%ud800")).toBeNull();
    expect(decodePathSegment("%ED%A0%80")).toBeNull();
  });
});
