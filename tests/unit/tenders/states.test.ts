import { describe, expect, it } from "vitest";
import { TENDER_STATES, type TenderState } from "@/policies/vocabulary";
import { canMove, editProblem, isDueToClose, moveProblem, openingProblems } from "@/lib/tenders/states";

const NOW = new Date("2027-02-01T10:00:00Z");
const draft = {
  state: "draft" as TenderState,
  operatingPoints: [{ label: "Clear", value: 1e-3 }],
  invitedOrgIds: ["org-1"],
  closesAt: new Date("2027-02-15T12:00:00Z"),
};

describe("tender transitions", () => {
  it("follows the flow draft -> open -> technical -> commercial -> approval -> awarded", () => {
    const flow: TenderState[] = ["draft", "open", "technical", "commercial", "approval", "awarded"];
    for (let i = 0; i + 1 < flow.length; i++) expect(canMove(flow[i], flow[i + 1])).toBe(true);
  });

  it("refuses skipping a step or going back to draft", () => {
    expect(canMove("draft", "technical")).toBe(false);
    expect(canMove("open", "commercial")).toBe(false);
    expect(canMove("technical", "awarded")).toBe(false);
    for (const state of TENDER_STATES) expect(canMove(state, "draft")).toBe(false);
    expect(moveProblem("open", "open")).toMatch(/open for offers cannot become open for offers/);
  });

  it("cancels from every state before the award, and from none after", () => {
    for (const state of ["draft", "open", "technical", "commercial", "approval"] as const) expect(canMove(state, "cancelled")).toBe(true);
    expect(moveProblem("awarded", "cancelled")).toMatch(/can no longer be cancelled/);
    expect(canMove("cancelled", "cancelled")).toBe(false);
  });

  it("lets only drafts be edited", () => {
    expect(editProblem("draft")).toBeNull();
    for (const state of TENDER_STATES.filter((s) => s !== "draft")) expect(editProblem(state)).toMatch(/locked/);
  });
});

describe("opening a draft", () => {
  it("opens with a point, an invitation and a future closing time", () => {
    expect(openingProblems(draft, NOW)).toEqual([]);
  });

  it("names every missing piece at once", () => {
    const problems = openingProblems({ ...draft, operatingPoints: [], invitedOrgIds: [], closesAt: NOW }, NOW);
    expect(problems).toEqual(["Add at least one operating point.", "Invite at least one vendor organisation.", "Set a closing time in the future."]);
  });

  it("refuses a tender that is not a draft", () => {
    expect(openingProblems({ ...draft, state: "open" }, NOW)).toEqual([expect.stringMatching(/cannot become open/)]);
  });
});

describe("closing time", () => {
  it("is due from the closing instant on, and only for open tenders", () => {
    const open = { state: "open" as TenderState, closesAt: NOW };
    expect(isDueToClose(open, new Date(NOW.getTime() - 1))).toBe(false);
    expect(isDueToClose(open, NOW)).toBe(true);
    expect(isDueToClose({ ...open, state: "draft" }, new Date(NOW.getTime() + 1))).toBe(false);
  });
});
