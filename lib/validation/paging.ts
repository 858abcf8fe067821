import { z } from "zod";

/** Rows per page when the URL names none, and the most a client may ask for. */
export const DEFAULT_PAGE_SIZE = 25;
export const MAX_PAGE_SIZE = 100;

const whole = (what: string, min: number, max: number) =>
  z.coerce
    .number({ error: `The ${what} must be a number.` })
    .int(`The ${what} must be a whole number.`)
    .min(min, `The ${what} must be at least ${min}.`)
    .max(max, `The ${what} must be at most ${max.toLocaleString("en-GB")}.`);

/** ?page=&size= of every paged list: pages start at 1; a page holds 1 to MAX_PAGE_SIZE rows. */
export const pagingSchema = z.object({
  page: whole("page", 1, 1_000_000).default(1),
  size: whole("page size", 1, MAX_PAGE_SIZE).default(DEFAULT_PAGE_SIZE),
});
export type PagingInput = z.infer<typeof pagingSchema>;

/** Blank text filters (an empty field of a GET form) mean no filter. */
export const optionalFilter = (max = 200) =>
  z
    .string()
    .trim()
    .max(max, `At most ${max} characters.`)
    .optional()
    .transform((v) => (v ? v : undefined));

/** An enumerated filter that may also be blank (no filter). */
export const optionalChoice = <const T extends readonly [string, ...string[]]>(values: T, what: string) =>
  z.preprocess((v) => (v === "" ? undefined : v), z.enum(values, { error: () => `The ${what} must be one of: ${values.join(", ")}.` }).optional());

/** What a paged answer says about its place: sent with every list beside its rows. */
export interface PageInfo {
  page: number;
  pageSize: number;
  /** Rows matching the filters, over every page. */
  total: number;
  /** At least 1, so that "page 1 of 1" reads right for an empty list. */
  pages: number;
  hasMore: boolean;
}

/** The page actually served for a request (never past the last one) and its row offset. */
export function pageWindow(total: number, asked: PagingInput): PageInfo & { offset: number } {
  const pages = Math.max(1, Math.ceil(total / asked.size));
  const page = Math.min(asked.page, pages);
  return { page, pageSize: asked.size, total, pages, hasMore: page < pages, offset: (page - 1) * asked.size };
}

/** Strips the offset: what leaves the server. */
export const pageInfo = ({ offset: _offset, ...info }: PageInfo & { offset: number }): PageInfo => info;
