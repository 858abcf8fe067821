import { describe, expect, it } from "vitest";
import { pageQuery } from "@/lib/server/pages";
import { tenderListQuerySchema } from "@/lib/validation/tender";

describe("a list page's address", () => {
  it("reads the filters and page with the API's schema", () => {
    expect(pageQuery({ state: "open", q: "gauge", page: "2", from: "mail" }, tenderListQuerySchema)).toEqual({
      query: { state: "open", q: "gauge", page: 2, size: 25 },
      problem: null,
    });
  });

  it("takes the first of a repeated parameter", () => {
    expect(pageQuery({ page: ["3", "4"] }, tenderListQuerySchema).query.page).toBe(3);
  });

  it("shows the defaults and says what was wrong instead of failing the page", () => {
    const { query, problem } = pageQuery({ page: "0", state: "finished" }, tenderListQuerySchema);
    expect(query).toEqual({ page: 1, size: 25 });
    expect(problem).toMatch(/page must be at least 1/);
    expect(problem).toMatch(/state must be one of/);
    expect(problem).toMatch(/Showing the first page without filters instead\.$/);
  });
});
