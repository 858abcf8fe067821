// Numbers in requests read as people type them (lib/numbers.ts): a text "0,00001" or "1 250,5" is
// the number, the same reading as the forms, so an action or a route accepts what a form accepts.
// A JSON number passes unchanged; an empty text is no value (null), which the schema then names.
import { z } from "zod";
import { parseCount, parseDecimal } from "@/lib/numbers";

/** A decimal: "1e-5", "0,00001", "1 250,5", "1,250.50". */
export const typedDecimal = <T extends z.ZodType>(schema: T) => z.preprocess((v) => (typeof v === "string" ? parseDecimal(v) : v), schema);

/** A count: "200000", "200,000", "200 000" (every comma groups thousands). */
export const typedCount = <T extends z.ZodType>(schema: T) => z.preprocess((v) => (typeof v === "string" ? parseCount(v) : v), schema);
