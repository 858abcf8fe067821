/** The score weights every fixture tender uses. */
export const FIXTURE_WEIGHTS = { technical: 40, evidence: 15, price: 30, leadTime: 10, warranty: 5 };

/** A complete tender draft as a buyer sends it (the API body, the form's values), with `over` on top. */
export const tenderInput = <T extends Record<string, unknown>>(over: T = {} as T) => ({
  title: "Culvert sensor radios",
  description: "Radios for culvert water-level sensors.",
  channelModel: "bsc",
  operatingPoints: [
    { label: "Clear", value: 1e-3 },
    { label: "Fade", value: 4e-3 },
  ],
  targetMetric: "bler",
  targetValue: 1e-4,
  maxFrameBits: 1024,
  quantity: 250,
  currency: "EUR",
  weights: FIXTURE_WEIGHTS,
  impossibleRule: "disqualify",
  closesLocal: "2027-05-03T12:00",
  closesZone: "Europe/Berlin",
  invitedOrgIds: [] as string[],
  ...over,
});
