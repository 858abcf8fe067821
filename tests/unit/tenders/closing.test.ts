import { describe, expect, it } from "vitest";
import { closingInstant, closingLocal, isValidZone, localTimeExists, zoneChoices } from "@/lib/tenders/closing";
import { closingWords } from "@/lib/tenders/notices";

describe("closing time across zones", () => {
  it("reads London winter time as UTC and summer time as UTC+1", () => {
    expect(closingInstant("2027-01-15T12:00", "Europe/London").toISOString()).toBe("2027-01-15T12:00:00.000Z");
    expect(closingInstant("2027-07-15T12:00", "Europe/London").toISOString()).toBe("2027-07-15T11:00:00.000Z");
  });

  it("follows the day the clocks change (Berlin, 28 March 2027)", () => {
    expect(closingInstant("2027-03-28T01:30", "Europe/Berlin").toISOString()).toBe("2027-03-28T00:30:00.000Z");
    expect(closingInstant("2027-03-28T03:30", "Europe/Berlin").toISOString()).toBe("2027-03-28T01:30:00.000Z");
  });

  it("handles zones west of UTC and the US change date (New York, 14 March 2027)", () => {
    expect(closingInstant("2027-03-13T17:00", "America/New_York").toISOString()).toBe("2027-03-13T22:00:00.000Z");
    expect(closingInstant("2027-03-15T17:00", "America/New_York").toISOString()).toBe("2027-03-15T21:00:00.000Z");
  });

  it("refuses a wall-clock time the clocks skip, and keeps every other one", () => {
    expect(localTimeExists("2027-03-28T01:30", "Europe/London")).toBe(false);
    expect(localTimeExists("2027-03-28T02:30", "Europe/Berlin")).toBe(false);
    expect(localTimeExists("2027-03-28T03:30", "Europe/Berlin")).toBe(true);
    // The autumn hour that happens twice exists (once): it stays allowed.
    expect(localTimeExists("2027-10-31T01:30", "Europe/London")).toBe(true);
  });

  it("gives back the same wall-clock time for the form", () => {
    for (const [local, zone] of [
      ["2027-11-02T09:15", "Asia/Kolkata"],
      ["2027-06-30T23:45", "Pacific/Auckland"],
      ["2027-12-31T23:59", "UTC"],
    ]) {
      expect(closingLocal(closingInstant(local, zone), zone)).toBe(local);
    }
  });

  it("knows real zones from made-up ones", () => {
    expect(isValidZone("Europe/London")).toBe(true);
    expect(isValidZone("Mars/Olympus")).toBe(false);
    expect(isValidZone("")).toBe(false);
    expect(zoneChoices()[0]).toBe("UTC");
    expect(zoneChoices()).toContain("Europe/Berlin");
  });

  it("words the closing time in the tender's own zone for the e-mails", () => {
    expect(closingWords(new Date("2027-07-15T11:00:00Z"), "Europe/London")).toBe("Thursday 15 July 2027, 12:00 (Europe/London)");
  });
});
