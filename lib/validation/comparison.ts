import { z } from "zod";
import { typedCount, typedDecimal } from "./numbers";
import { weightsSchema } from "./tender";

export const JUSTIFICATION_MIN = 20;

/** A reason for a deviation from the offer or the tender: optional here, required by the rule when it applies. */
const reason = z.string().trim().max(2000, "At most 2,000 characters.").optional();

/** The buyer's recommendation of an award, as the form and POST /api/v1/tenders/[id]/recommendation send it. */
export const recommendationSchema = z.object({
  offerId: z.string({ error: "Choose the offer to award." }).trim().min(1, "Choose the offer to award."),
  quantity: typedCount(
    z
      .number({ error: "Enter the quantity as a number." })
      .int("A whole number of units.")
      .positive("At least one unit.")
      .max(100_000_000, "At most 100,000,000 units."),
  ),
  value: typedDecimal(
    z
      .number({ error: "Enter the award value as a number." })
      .positive("The award value must be above zero.")
      .max(1e13, "The award value is too large.")
      .refine((v) => Math.abs(Math.round(v * 100) - v * 100) < 1e-6, "At most two decimals (whole cents)."),
  ),
  justification: z
    .string({ error: "Write the justification." })
    .trim()
    .min(JUSTIFICATION_MIN, `Write at least ${JUSTIFICATION_MIN} characters of justification.`)
    .max(5000, "At most 5,000 characters."),
  /** Why the award value differs from the offer's price at the quantity. */
  valueReason: reason,
  /** Why the quantity exceeds the tender's. */
  quantityReason: reason,
});
export type RecommendationInput = z.infer<typeof recommendationSchema>;

/** The what-if weights: the same rules as a tender's weights (zero or more, at least one above zero). */
export const whatIfWeightsSchema = weightsSchema;

/** The buyer withdraws a recommendation awaiting approval, saying why. */
export const withdrawalSchema = z.object({
  reason: z
    .string({ error: "Say why you withdraw it." })
    .trim()
    .min(10, "Say why you withdraw it (at least 10 characters).")
    .max(2000, "At most 2,000 characters."),
});
export type WithdrawalInput = z.infer<typeof withdrawalSchema>;
