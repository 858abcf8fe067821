import { describe, expect, it } from "vitest";
import { capped, DESK_SECTION_LIMIT, type DeskSection } from "@/lib/server/desk";

const section = (n: number): DeskSection => ({
  title: "Open for offers",
  empty: "No tender is open.",
  tab: "",
  tenders: Array.from({ length: n }, (_, i) => ({ id: `t${i}` }) as DeskSection["tenders"][number]),
});

describe("a Desk section", () => {
  it("shows every tender up to the limit, with no link to more", () => {
    const out = capped(section(DESK_SECTION_LIMIT), ["open"]);
    expect(out.tenders).toHaveLength(DESK_SECTION_LIMIT);
    expect(out.more).toBeUndefined();
  });

  it("shows the first few beyond it and links to the Tenders list filtered by the section's state", () => {
    const out = capped(section(DESK_SECTION_LIMIT + 5), ["open"]);
    expect(out.tenders.map((t) => t.id)).toEqual(section(DESK_SECTION_LIMIT).tenders.map((t) => t.id));
    expect(out.more).toEqual({ count: 5, href: "/tenders?state=open" });
  });

  it("links to the whole list when the section spans several states", () => {
    expect(capped(section(20), ["technical", "commercial"]).more).toEqual({ count: 20 - DESK_SECTION_LIMIT, href: "/tenders" });
  });
});
