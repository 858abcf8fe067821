import { recordRoute } from "@/lib/server/http";
import { closeThread } from "@/lib/server/threads";
import { closeThreadSchema } from "@/lib/validation/review";

export const POST = recordRoute(closeThreadSchema, closeThread);
