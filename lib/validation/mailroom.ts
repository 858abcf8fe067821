import { z } from "zod";
import { optionalFilter, pagingSchema } from "./paging";

/** The Mailroom's filters and page, as they appear in the URL. */
export const mailroomQuerySchema = z.object({ to: optionalFilter(254), subject: optionalFilter() }).extend(pagingSchema.shape);
