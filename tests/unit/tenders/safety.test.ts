import { describe, expect, it } from "vitest";
import { SAFETY_CAUTION } from "@/lib/cautions";
import { withSafetyCaution } from "@/lib/tenders/safety";

describe("the safety caution on notices", () => {
  const notices = [{ to: ["a@example.test"], subject: "Awarded", text: "The tender is awarded." }];
  it("ends every notice of a safety-relevant tender with the stronger caution", () => {
    const [notice] = withSafetyCaution({ safetyRelevant: true }, notices);
    expect(notice.text).toBe(`The tender is awarded.\n\n${SAFETY_CAUTION}`);
    expect(SAFETY_CAUTION).toMatch(/qualification testing, the local codes and licensed professional practice decide it/);
  });
  it("leaves the notices of other tenders as they are", () => {
    expect(withSafetyCaution({ safetyRelevant: false }, notices)).toEqual(notices);
  });
});
