/** An honest offer for the demo weirs tender RC-2027-003 (one point, p = 2e-3), with a sealed envelope. */
export const weirsOffer = (moduleName = "Test module", over: Record<string, unknown> = {}) => ({
  moduleName,
  partNumber: "TM-1",
  code: { family: "LDPC", decision: "hard", n: 2048, k: 1536 },
  claims: [{ pointIndex: 0, metric: "bler", value: 1e-5 }],
  envelope: { unitPrice: 52.5, currency: "EUR", leadTimeWeeks: 8, warrantyMonths: 24, priceBreaks: [] },
  ...over,
});
