import { describe, expect, it } from "vitest";
import { PHASE_DEVELOPMENT_SERVER, PHASE_PRODUCTION_SERVER } from "next/constants";
import config from "@/next.config";

async function rules(phase: string) {
  return (await config(phase).headers!()).map((rule) => ({ source: rule.source, headers: Object.fromEntries(rule.headers.map((h) => [h.key, h.value])) }));
}

describe("security headers from next.config.ts", () => {
  it("send nosniff, a referrer policy and no framing on every path", async () => {
    const [all] = await rules(PHASE_PRODUCTION_SERVER);
    expect(all.source).toBe("/:path*");
    expect(all.headers).toMatchObject({ "X-Content-Type-Options": "nosniff", "Referrer-Policy": "same-origin", "X-Frame-Options": "DENY" });
  });

  it("give pages a content security policy that keeps scripts, frames and forms to the app itself", async () => {
    const pages = (await rules(PHASE_PRODUCTION_SERVER)).find((r) => r.source === "/((?!api/).*)")!;
    const csp = pages.headers["Content-Security-Policy"];
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("form-action 'self'");
    expect(csp).not.toContain("unsafe-eval");
    expect(csp).not.toMatch(/https?:|\*/);
    const dev = (await rules(PHASE_DEVELOPMENT_SERVER)).find((r) => r.source === "/((?!api/).*)")!;
    expect(dev.headers["Content-Security-Policy"]).toContain("'unsafe-eval'");
  });

  it("let only the memo preview be framed, and only by the app", async () => {
    const all = await rules(PHASE_PRODUCTION_SERVER);
    expect(all.find((r) => r.source === "/api/:path*")!.headers["Content-Security-Policy"]).toBe("frame-ancestors 'none'");
    // Next.js applies every matching rule in order, so the preview's rule comes last and wins.
    expect(all.at(-1)).toEqual({
      source: "/api/v1/tenders/:id/memo/preview",
      headers: { "Content-Security-Policy": "frame-ancestors 'self'", "X-Frame-Options": "SAMEORIGIN" },
    });
  });
});
