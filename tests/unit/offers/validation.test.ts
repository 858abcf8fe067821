import { describe, expect, it } from "vitest";
import { fieldErrorsOf } from "@/lib/validation/messages";
import { offerSchema } from "@/lib/validation/offer";

const valid = {
  moduleName: "Module",
  partNumber: "P-1",
  code: { family: "LDPC", decision: "hard", n: 2048, k: 1536, rate: null, overhead: null },
  claims: [{ pointIndex: 0, metric: "bler", value: 1e-5, ncgOutputBer: null }],
  envelope: { unitPrice: 38.5, currency: "eur", leadTimeWeeks: 14, warrantyMonths: 24, priceBreaks: [{ minQuantity: 1000, unitPrice: 37.2 }] },
};
const errorsOf = (value: unknown) => {
  const parsed = offerSchema.safeParse(value);
  return parsed.success ? {} : fieldErrorsOf(parsed.error);
};

describe("the offer schema shared by the form and the API", () => {
  it("accepts a complete offer and normalises the currency", () => {
    const parsed = offerSchema.parse(valid);
    expect(parsed.envelope.currency).toBe("EUR");
  });

  it("names k when k exceeds n, and n when k comes without it", () => {
    expect(errorsOf({ ...valid, code: { ...valid.code, k: 4096 } })["code.k"][0]).toMatch(/at most n \(2048\)/);
    expect(errorsOf({ ...valid, code: { ...valid.code, n: null } })["code.n"]).toBeTruthy();
  });

  it("wants exactly one of k, rate and overhead", () => {
    expect(errorsOf({ ...valid, code: { ...valid.code, rate: 0.75 } })["code.k"][0]).toMatch(/exactly one/);
    expect(errorsOf({ ...valid, code: { ...valid.code, k: null } })["code.k"][0]).toMatch(/exactly one/);
    expect(errorsOf({ ...valid, code: { ...valid.code, k: null, rate: 0.75 } })).toEqual({});
  });

  it("holds BER and BLER strictly inside (0, 1) and a gain to dB with its output BER", () => {
    for (const value of [0, 1, -1e-3, 2]) expect(errorsOf({ ...valid, claims: [{ ...valid.claims[0], value }] })["claims.0.value"]).toBeTruthy();
    const ncg = { pointIndex: 0, metric: "ncg", value: 8.5, ncgOutputBer: null };
    expect(errorsOf({ ...valid, claims: [ncg] })["claims.0.ncgOutputBer"]).toBeTruthy();
    expect(errorsOf({ ...valid, claims: [{ ...ncg, ncgOutputBer: 1e-15 }] })).toEqual({});
  });

  it("wants a positive price, whole weeks and months, and ascending price breaks", () => {
    const errors = errorsOf({
      ...valid,
      envelope: {
        unitPrice: 0,
        currency: "E",
        leadTimeWeeks: 1.5,
        warrantyMonths: -1,
        priceBreaks: [
          { minQuantity: 500, unitPrice: 9 },
          { minQuantity: 500, unitPrice: 8 },
        ],
      },
    });
    expect(Object.keys(errors).sort()).toEqual([
      "envelope.currency",
      "envelope.leadTimeWeeks",
      "envelope.priceBreaks.1.minQuantity",
      "envelope.unitPrice",
      "envelope.warrantyMonths",
    ]);
  });
});
