import { recordRoute } from "@/lib/server/http";
import { answerObjection } from "@/lib/server/objections";
import { objectionAnswerSchema } from "@/lib/validation/notices";

/** The buying team's written answer to a vendor's objection (buyer), once. */
export const POST = recordRoute(objectionAnswerSchema, answerObjection);
