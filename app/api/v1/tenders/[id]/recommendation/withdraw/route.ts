import { recordRoute } from "@/lib/server/http";
import { withdrawRecommendation } from "@/lib/server/recommendations";
import { withdrawalSchema } from "@/lib/validation/comparison";

/** The buyer withdraws the recommendation awaiting approval: { reason }; the tender returns to commercial evaluation. */
export const POST = recordRoute(withdrawalSchema, withdrawRecommendation);
