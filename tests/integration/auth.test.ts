import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { ledgerEntries, sessions, signInFailures, userRoles, users } from "@/db/schema";
import type { Db } from "@/db/client";
import { GET as meGet } from "@/app/api/v1/me/route";
import { GET as usersGet, POST as usersPost } from "@/app/api/v1/users/route";
import { PATCH as userPatch } from "@/app/api/v1/users/[id]/route";
import { POST as authPost } from "@/app/api/auth/[...all]/route";
import { signIn } from "@/lib/server/sign-in";
import { verifyLedger } from "@/lib/server/ledger";
import { BASE, closeDb, freshDatabase, params, request, signInAs } from "../support/app";

let db: Db;
beforeAll(async () => {
  db = await freshDatabase();
});
afterAll(closeDb);

const countLedger = async (action: string) => (await db.select().from(ledgerEntries).where(eq(ledgerEntries.action, action))).length;

describe("sign-in", () => {
  it("signs in a demo account and reports who it is", async () => {
    const headers = await signInAs("buyer@tarnwell.example");
    const response = await meGet(request("/api/v1/me", { headers }), undefined);
    expect(response.status).toBe(200);
    const me = await response.json();
    expect(me.email).toBe("buyer@tarnwell.example");
    expect(me.roles).toEqual(["buyer"]);
    expect(me.organisation.kind).toBe("buyer");
  });

  it("refuses a wrong password with a clear message and records the failure", async () => {
    const before = (await db.select().from(signInFailures)).length;
    await expect(
      signIn({ email: "engineer@tarnwell.example", password: "not-the-password" }, new Headers({ origin: "http://localhost:3000" })),
    ).rejects.toThrow("Wrong e-mail or password.");
    expect((await db.select().from(signInFailures)).length).toBe(before + 1);
  });

  it("gives an unknown account the same message, and writes no user", async () => {
    const usersBefore = (await db.select().from(users)).length;
    await expect(signIn({ email: "nobody@tarnwell.example", password: "whatever-1" }, new Headers())).rejects.toThrow("Wrong e-mail or password.");
    expect((await db.select().from(users)).length).toBe(usersBefore);
  });

  it("stops trying after five failures for one account within the window", async () => {
    const email = "approver@tarnwell.example";
    for (let i = 0; i < 5; i++) {
      await expect(signIn({ email, password: `wrong-${i}-pass` }, new Headers())).rejects.toThrow("Wrong e-mail");
    }
    await expect(signIn({ email, password: "ratecourt-demo" }, new Headers())).rejects.toThrow(/Too many failed attempts/);
  });
});

describe("route handlers", () => {
  it("answer 401 JSON when signed out", async () => {
    const response = await meGet(request("/api/v1/me"), undefined);
    expect(response.status).toBe(401);
    expect(response.headers.get("content-type")).toContain("application/json");
    expect((await response.json()).error).toMatch(/Sign in/);
  });

  it("answer 403 JSON when the role does not allow it", async () => {
    const vendor = await signInAs("sales@kestrelink.example");
    const response = await usersGet(request("/api/v1/users", { headers: vendor }), undefined);
    expect(response.status).toBe(403);
    expect(await response.json()).toHaveProperty("error");
  });

  it("answer 400 with a message for malformed JSON, and write nothing", async () => {
    const admin = await signInAs("admin@tarnwell.example");
    const before = (await db.select().from(users)).length;
    const response = await usersPost(request("/api/v1/users", { method: "POST", headers: admin, rawBody: "{not json" }), undefined);
    expect(response.status).toBe(400);
    expect((await response.json()).error).toMatch(/not valid JSON/);
    expect((await db.select().from(users)).length).toBe(before);
  });

  it("answer 413 for an oversized body", async () => {
    const admin = await signInAs("admin@tarnwell.example");
    const response = await usersPost(
      request("/api/v1/users", { method: "POST", headers: admin, rawBody: JSON.stringify({ name: "x".repeat(1_100_000) }) }),
      undefined,
    );
    expect(response.status).toBe(413);
  });

  it("answer 400 naming the field for bad input", async () => {
    const admin = await signInAs("admin@tarnwell.example");
    const response = await usersPost(
      request("/api/v1/users", { method: "POST", headers: admin, body: { name: "A", email: "not-an-address", password: "x", organisationId: "", roles: [] } }),
      undefined,
    );
    expect(response.status).toBe(400);
    const body = await response.json();
    expect(Object.keys(body.fieldErrors)).toEqual(expect.arrayContaining(["email", "password", "roles"]));
  });
});

describe("people administration", () => {
  it("creates an account that can sign in, and records it", async () => {
    const admin = await signInAs("admin@tarnwell.example");
    const orgs = await db.query.organisations.findMany();
    const buyerOrg = orgs.find((o) => o.kind === "buyer")!;
    const response = await usersPost(
      request("/api/v1/users", {
        method: "POST",
        headers: admin,
        body: { name: "Maren Lusk", email: "maren@tarnwell.example", password: "first-pass-1", organisationId: buyerOrg.id, roles: ["engineer"] },
      }),
      undefined,
    );
    expect(response.status).toBe(201);
    expect(await countLedger("user.created")).toBeGreaterThan(0);
    const headers = await signInAs("maren@tarnwell.example", "first-pass-1");
    expect((await (await meGet(request("/api/v1/me", { headers }), undefined)).json()).roles).toEqual(["engineer"]);
  });

  it("refuses a vendor role for a buying-company user, and changes nothing", async () => {
    const admin = await signInAs("admin@tarnwell.example");
    const [engineer] = await db.select().from(users).where(eq(users.email, "engineer@tarnwell.example"));
    const response = await userPatch(
      request(`/api/v1/users/${engineer.id}`, { method: "PATCH", headers: admin, body: { roles: ["vendor"] } }),
      params({ id: engineer.id }),
    );
    expect(response.status).toBe(400);
    const roles = await db.select().from(userRoles).where(eq(userRoles.userId, engineer.id));
    expect(roles.map((r) => r.role)).toEqual(["engineer"]);
  });

  it("records role changes in the ledger, and the new roles apply on the next request", async () => {
    const admin = await signInAs("admin@tarnwell.example");
    const engineerHeaders = await signInAs("engineer@tarnwell.example");
    const [engineer] = await db.select().from(users).where(eq(users.email, "engineer@tarnwell.example"));
    const response = await userPatch(
      request(`/api/v1/users/${engineer.id}`, { method: "PATCH", headers: admin, body: { roles: ["engineer", "buyer"] } }),
      params({ id: engineer.id }),
    );
    expect(response.status).toBe(200);
    const [entry] = await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.action, "user.roles-changed"), eq(ledgerEntries.subjectId, engineer.id)));
    expect(entry.data).toMatchObject({ from: ["engineer"], to: ["buyer", "engineer"] });
    const me = await (await meGet(request("/api/v1/me", { headers: engineerHeaders }), undefined)).json();
    expect(me.roles).toEqual(["buyer", "engineer"]);
  });

  it("deactivating an account ends its sessions and blocks sign-in", async () => {
    const admin = await signInAs("admin@tarnwell.example");
    const vendorHeaders = await signInAs("bids@oxbow.example");
    const [vendor] = await db.select().from(users).where(eq(users.email, "bids@oxbow.example"));
    const response = await userPatch(
      request(`/api/v1/users/${vendor.id}`, { method: "PATCH", headers: admin, body: { active: false } }),
      params({ id: vendor.id }),
    );
    expect(response.status).toBe(200);
    expect((await meGet(request("/api/v1/me", { headers: vendorHeaders }), undefined)).status).toBe(401);
    await expect(signIn({ email: "bids@oxbow.example", password: "ratecourt-demo" }, new Headers())).rejects.toThrow(/deactivated/);
    await expect(signInAs("bids@oxbow.example")).rejects.toThrow();
  });

  it("reactivating an account does not bring back the sessions that deactivation ended", async () => {
    const admin = await signInAs("admin@tarnwell.example");
    const vendorHeaders = await signInAs("offers@marram.example");
    expect((await meGet(request("/api/v1/me", { headers: vendorHeaders }), undefined)).status).toBe(200);
    const [vendor] = await db.select().from(users).where(eq(users.email, "offers@marram.example"));
    const patch = (active: boolean) =>
      userPatch(request(`/api/v1/users/${vendor.id}`, { method: "PATCH", headers: admin, body: { active } }), params({ id: vendor.id }));
    expect((await patch(false)).status).toBe(200);
    expect(await db.select().from(sessions).where(eq(sessions.userId, vendor.id))).toEqual([]);
    expect((await patch(true)).status).toBe(200);
    expect((await meGet(request("/api/v1/me", { headers: vendorHeaders }), undefined)).status).toBe(401);
  });

  it("nobody changes their own record through the auth library's update endpoint", async () => {
    const vendorHeaders = await signInAs("sales@kestrelink.example");
    const headers = new Headers(vendorHeaders);
    headers.set("content-type", "application/json");
    const response = await authPost(
      new Request(`${BASE}/api/auth/update-user`, { method: "POST", headers, body: JSON.stringify({ name: "Someone Else", image: "x" }) }),
    );
    expect(response.status).toBe(404);
    const [vendor] = await db.select().from(users).where(eq(users.email, "sales@kestrelink.example"));
    expect(vendor.name).toBe("Pieter Aalders");
  });

  it("an admin cannot deactivate their own account (another admin must)", async () => {
    const admin = await signInAs("admin@tarnwell.example");
    const [self] = await db.select().from(users).where(eq(users.email, "admin@tarnwell.example"));
    const response = await userPatch(
      request(`/api/v1/users/${self.id}`, { method: "PATCH", headers: admin, body: { active: false } }),
      params({ id: self.id }),
    );
    expect(response.status).toBe(403);
    expect((await response.json()).error).toMatch(/Another admin/);
    expect((await db.select().from(users).where(eq(users.id, self.id)))[0].active).toBe(true);
  });

  it("keeps the ledger chain intact through all of the above", async () => {
    expect(await verifyLedger(db)).toMatchObject({ ok: true });
  });
});
