import { z } from "zod";

export const EXPLORER_DEFAULTS = {
  bsc: { x: 5e-3, n: 2048, k: 1640 },
  bec: { x: 0.05, n: 1024, k: 900 },
  biawgn: { x: 2, n: 1944, k: 972 },
} as const;

/** The Bound explorer's view, as it lives in the URL's search parameters. */
export const explorerSchema = z
  .object({
    model: z.enum(["bsc", "bec", "biawgn"]).default("bsc"),
    x: z.coerce.number().optional(),
    n: z.coerce.number().int("n must be a whole number").min(2, "n must be at least 2").max(1_000_000, "n must be at most 1,000,000 here").optional(),
    k: z.coerce.number().int("k must be a whole number").min(1, "k must be at least 1").optional(),
    target: z.coerce.number().gt(0, "target must be above 0").lt(0.5, "target must be below 0.5").default(1e-4),
  })
  .transform((v) => {
    const d = EXPLORER_DEFAULTS[v.model];
    return { model: v.model, x: v.x ?? d.x, n: v.n ?? d.n, k: v.k ?? d.k, target: v.target };
  })
  .superRefine((v, ctx) => {
    if (v.k > v.n) ctx.addIssue({ code: "custom", path: ["k"], message: `k must be at most n (${v.n})` });
    if (v.model === "bsc" && !(v.x > 0 && v.x <= 0.5)) ctx.addIssue({ code: "custom", path: ["x"], message: "p must be above 0 and at most 0.5" });
    if (v.model === "bec" && !(v.x > 0 && v.x < 1)) ctx.addIssue({ code: "custom", path: ["x"], message: "e must be above 0 and below 1" });
    if (v.model === "biawgn" && !(v.x >= -5 && v.x <= 20)) ctx.addIssue({ code: "custom", path: ["x"], message: "Eb/N0 must be from -5 to 20 dB" });
  });
export type ExplorerView = z.output<typeof explorerSchema>;
