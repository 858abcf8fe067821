import { describe, expect, it } from "vitest";
import { MAX_PAGE_SIZE, pageWindow, pagingSchema } from "@/lib/validation/paging";

describe("paging query", () => {
  it("defaults to the first page of 25", () => {
    expect(pagingSchema.parse({})).toEqual({ page: 1, size: 25 });
  });
  it("reads numbers from the URL's text", () => {
    expect(pagingSchema.parse({ page: "3", size: "10" })).toEqual({ page: 3, size: 10 });
  });
  it.each([
    [{ page: "0" }, "page must be at least 1"],
    [{ page: "two" }, "page must be a number"],
    [{ page: "1.5" }, "page must be a whole number"],
    [{ size: String(MAX_PAGE_SIZE + 1) }, "page size must be at most 100"],
  ])("refuses %j, saying why", (query, message) => {
    const parsed = pagingSchema.safeParse(query);
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues[0].message).toContain(message);
  });
});

describe("page window", () => {
  it("gives the offset and whether more follows", () => {
    expect(pageWindow(60, { page: 2, size: 25 })).toEqual({ page: 2, pageSize: 25, total: 60, pages: 3, hasMore: true, offset: 25 });
  });
  it("serves the last page for a page past the end", () => {
    expect(pageWindow(60, { page: 9, size: 25 })).toMatchObject({ page: 3, hasMore: false, offset: 50 });
  });
  it("has one empty page when nothing matches", () => {
    expect(pageWindow(0, { page: 1, size: 25 })).toMatchObject({ page: 1, pages: 1, total: 0, hasMore: false, offset: 0 });
  });
});
