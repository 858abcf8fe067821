import { describe, expect, it } from "vitest";
import { absoluteLink, MAIL_CAUTION, mailText } from "@/lib/mail/words";

describe("mailText", () => {
  const base = "https://ratecourt.example.org/";

  it("turns every app path into an absolute link, wherever it stands", () => {
    const text = mailText("Open it: /tenders/t1/sign-off\n/review/claims/c9\n(see /desk)", base);
    expect(text).toContain("Open it: https://ratecourt.example.org/tenders/t1/sign-off\n");
    expect(text).toContain("\nhttps://ratecourt.example.org/review/claims/c9\n");
    expect(text).toContain("(see https://ratecourt.example.org/desk)");
    expect(text).not.toMatch(/(^|[\s(])\/[a-z]/m);
  });

  it("leaves absolute links, fractions and words with slashes alone", () => {
    const text = mailText("Here: https://ratecourt.example.org/tenders/t1, rate 3/4, and/or 5 bits/s.", base);
    expect(text.split("\n\n")[0]).toBe("Here: https://ratecourt.example.org/tenders/t1, rate 3/4, and/or 5 bits/s.");
  });

  it("ends with the short caution and the sender", () => {
    const text = mailText("Hello.", base);
    expect(text).toBe(`Hello.\n\n${MAIL_CAUTION}\n\n— Ratecourt, https://ratecourt.example.org`);
  });

  it("builds absolute links with exactly one slash between base and path", () => {
    expect(absoluteLink("http://localhost:3140/", "/tenders/x")).toBe("http://localhost:3140/tenders/x");
    expect(absoluteLink("http://localhost:3140", "tenders/x")).toBe("http://localhost:3140/tenders/x");
  });
});
