import { recordRoute } from "@/lib/server/http";
import { cancelTender } from "@/lib/server/tender-lifecycle";
import { cancelTenderSchema } from "@/lib/validation/tender";

export const POST = recordRoute(cancelTenderSchema, cancelTender);
