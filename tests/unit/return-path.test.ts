import { describe, expect, it } from "vitest";
import { NextRequest } from "next/server";
import { proxy } from "@/proxy";
import { DESK_PATH, PAGE_PATH_HEADER, safeReturnPath, signInPath } from "@/lib/return-path";

describe("the return path after sign-in", () => {
  it("follows a same-origin path with its query", () => {
    expect(safeReturnPath("/tenders/abc/sign-off")).toBe("/tenders/abc/sign-off");
    expect(safeReturnPath("/review?tenderId=t1&vendor=ox")).toBe("/review?tenderId=t1&vendor=ox");
  });

  it.each<[unknown, string]>([
    ["/\\evil.example", "a backslash, read by browsers as another host"],
    ["//evil.example/x", "a protocol-relative URL"],
    ["/\\/evil.example", "a backslash after the slash"],
    ["https://evil.example/", "an absolute URL"],
    ["javascript:alert(1)", "a script URL"],
    ["/tenders\n/x", "a control character"],
    ["tenders/x", "a relative path"],
    ["/sign-in?next=/desk", "the sign-in page itself"],
    ["/api/v1/me", "an API route"],
    ["", "nothing"],
    [undefined, "no value"],
    [["/desk"], "a list"],
  ])("refuses %j (%s) and falls back to the Desk", (next, _why) => {
    expect(safeReturnPath(next)).toBe(DESK_PATH);
  });

  it("asks sign-in to return only where it may", () => {
    expect(signInPath("/tenders/t1?tab=ledger")).toBe("/sign-in?next=%2Ftenders%2Ft1%3Ftab%3Dledger");
    expect(signInPath("//evil.example")).toBe("/sign-in");
    expect(signInPath(null)).toBe("/sign-in");
  });
});

describe("the proxy", () => {
  it("hands the page the path and query that were asked for, overriding any sent by the client", async () => {
    const request = new NextRequest("http://localhost:3140/tenders/t1/ledger?page=2", { headers: { [PAGE_PATH_HEADER]: "//evil.example" } });
    const response = proxy(request);
    expect(response.headers.get(`x-middleware-request-${PAGE_PATH_HEADER}`)).toBe("/tenders/t1/ledger?page=2");
  });
});
