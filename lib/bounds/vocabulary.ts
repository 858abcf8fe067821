// The engine's own words, written once: every schema, column check, form and type takes them from
// here (types as `(typeof X)[number]`, zod as `z.enum(X)`).

/** The channel models: hard decision (BSC), erasures (BEC), soft decision (BI-AWGN). */
export const CHANNEL_MODELS = ["bsc", "bec", "biawgn"] as const;
export type ChannelModel = (typeof CHANNEL_MODELS)[number];

/** What the engine says of a claim. */
export const VERDICTS = ["impossible", "needs-evidence", "plausible"] as const;
export type Verdict = (typeof VERDICTS)[number];

/** The verdicts as people read them. */
export const VERDICT_LABELS: Record<Verdict, string> = {
  impossible: "Impossible",
  "needs-evidence": "Needs evidence",
  plausible: "Plausible",
};

/** The models as a phrase for messages: "bsc", "bec" or "biawgn". */
export const channelModelList = (last = " or "): string => {
  const quoted = CHANNEL_MODELS.map((m) => `"${m}"`);
  return `${quoted.slice(0, -1).join(", ")}${last}${quoted.at(-1)}`;
};
