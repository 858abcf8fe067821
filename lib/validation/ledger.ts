import { z } from "zod";

/** ?entries= on a step of a full ledger check: how many entries to verify in this step. */
export const ledgerStepSchema = z.object({
  entries: z.coerce
    .number({ error: () => "entries must be a whole number of entries to verify in this step." })
    .int("entries must be a whole number.")
    .min(1, "entries must be at least 1.")
    .max(20_000, "entries must be at most 20,000 per step.")
    .optional(),
});
