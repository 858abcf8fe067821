import { afterEach, beforeAll, afterAll, describe, expect, it } from "vitest";
import { count, eq } from "drizzle-orm";
import { ledgerEntries, signInFailures, users } from "@/db/schema";
import type { Db } from "@/db/client";
import { DEMO_PASSWORD } from "@/db/seed";
import { resetEnvForTests } from "@/lib/env";
import { POST as authPost } from "@/app/api/auth/[...all]/route";
import { signIn } from "@/lib/server/sign-in";
import { recordFailure, SIGN_IN_MAX_FAILURES, SIGN_IN_MAX_UNTRUSTED_FAILURES } from "@/lib/server/sign-in-guard";
import { signInRate } from "@/lib/server/throttle";
import { BASE, closeDb, freshDatabase } from "../support/app";

let db: Db;
beforeAll(async () => {
  db = await freshDatabase();
});
afterAll(closeDb);

/** Behind one proxy that appends the address it saw: the tests below name their client address. */
function behindProxy(hops: string | undefined) {
  if (hops === undefined) delete process.env.TRUST_PROXY_HOPS;
  else process.env.TRUST_PROXY_HOPS = hops;
  resetEnvForTests();
}
afterEach(() => behindProxy(undefined));

let nextAddress = 1;
const freshAddress = () => `198.51.100.${nextAddress++}`;

/** POST /api/auth/sign-in/email as a client at `address` (the proxy's entry), optionally with cookies. */
function endpointSignIn(email: string, password: string, opts: { address?: string; forwarded?: string; cookie?: string } = {}) {
  const headers = new Headers({ "content-type": "application/json", origin: BASE });
  const forwarded = opts.forwarded ?? opts.address;
  if (forwarded) headers.set("x-forwarded-for", forwarded);
  if (opts.cookie) headers.set("cookie", opts.cookie);
  return authPost(new Request(`${BASE}/api/auth/sign-in/email`, { method: "POST", headers, body: JSON.stringify({ email, password }) }));
}

const cookiesOf = (response: Response) =>
  response.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");

const formHeaders = (address: string, cookie?: string) => new Headers({ origin: BASE, "x-forwarded-for": address, ...(cookie ? { cookie } : {}) });

async function failTimes(email: string, times: number, address: string) {
  for (let i = 0; i < times; i++) expect((await endpointSignIn(email, `wrong-${i}-pass`, { address })).status).toBe(401);
}

describe("the account lockout", () => {
  it("holds on better-auth's own endpoint: the right password after five wrong ones is refused", async () => {
    behindProxy("1");
    const address = freshAddress();
    await failTimes("engineer@tarnwell.example", SIGN_IN_MAX_FAILURES, address);
    const response = await endpointSignIn("engineer@tarnwell.example", DEMO_PASSWORD, { address });
    expect(response.status).toBe(429);
    expect((await response.json()).message).toMatch(/Too many failed attempts for this account/);
  });

  it("holds on the sign-in form too, whichever path the failures came through", async () => {
    behindProxy("1");
    const address = freshAddress();
    const email = "buyer@tarnwell.example";
    await failTimes(email, 3, address);
    for (let i = 0; i < 2; i++) {
      await expect(signIn({ email, password: `form-wrong-${i}` }, formHeaders(address))).rejects.toThrow("Wrong e-mail or password.");
    }
    await expect(signIn({ email, password: DEMO_PASSWORD }, formHeaders(address))).rejects.toThrow(/Too many failed attempts/);
    expect((await endpointSignIn(email, DEMO_PASSWORD, { address })).status).toBe(429);
  });

  it("cannot be used from another address to lock someone out", async () => {
    behindProxy("1");
    const email = "director@tarnwell.example";
    // The owner signed in before from this browser: it carries the trusted-device cookie.
    const owner = await endpointSignIn(email, DEMO_PASSWORD, { address: freshAddress() });
    expect(owner.status).toBe(200);
    const device = cookiesOf(owner)
      .split("; ")
      .find((c) => c.startsWith("ratecourt_device="));
    expect(device).toBeDefined();
    // A stranger fails from many addresses, until every untrusted client of the account waits.
    for (let i = 0; i < SIGN_IN_MAX_UNTRUSTED_FAILURES; i++) {
      expect((await endpointSignIn(email, `guess-${i}-pass`, { address: freshAddress() })).status).toBe(401);
    }
    expect((await endpointSignIn(email, DEMO_PASSWORD, { address: freshAddress() })).status).toBe(429);
    // The owner's browser is not locked by the stranger's failures.
    expect((await endpointSignIn(email, DEMO_PASSWORD, { address: freshAddress(), cookie: device })).status).toBe(200);
  });

  it("counts per account and address: another address still signs in after five failures elsewhere", async () => {
    behindProxy("1");
    const email = "offers@marram.example";
    const attacker = freshAddress();
    await failTimes(email, SIGN_IN_MAX_FAILURES, attacker);
    expect((await endpointSignIn(email, DEMO_PASSWORD, { address: attacker })).status).toBe(429);
    expect((await endpointSignIn(email, DEMO_PASSWORD, { address: freshAddress() })).status).toBe(200);
  });

  it("says an account is deactivated only after the right password", async () => {
    behindProxy("1");
    await db.update(users).set({ active: false }).where(eq(users.email, "tenders@quillfield.example"));
    const address = freshAddress();
    const wrong = await endpointSignIn("tenders@quillfield.example", "not-the-password", { address });
    expect(wrong.status).toBe(401);
    expect(JSON.stringify(await wrong.json())).not.toMatch(/deactivated/);
    await expect(signIn({ email: "tenders@quillfield.example", password: "not-the-password" }, formHeaders(address))).rejects.toThrow(
      "Wrong e-mail or password.",
    );
    const right = await endpointSignIn("tenders@quillfield.example", DEMO_PASSWORD, { address });
    expect(right.status).toBe(403);
    expect((await right.json()).message).toMatch(/deactivated/);
    expect(right.headers.getSetCookie().join()).not.toMatch(/session_token=[^;]/);
    await expect(signIn({ email: "tenders@quillfield.example", password: DEMO_PASSWORD }, formHeaders(address))).rejects.toThrow(/deactivated/);
  });

  it("records failures in their own table, not the ledger, and prunes them after a day", async () => {
    behindProxy("1");
    const ledgerBefore = (await db.select({ n: count() }).from(ledgerEntries))[0].n;
    for (let i = 0; i < 3; i++) {
      expect((await endpointSignIn(`invented-${i}@nowhere.example`, "whatever-1", { address: freshAddress() })).status).toBe(401);
    }
    expect((await db.select({ n: count() }).from(ledgerEntries))[0].n).toBe(ledgerBefore);
    expect(await db.select().from(signInFailures).where(eq(signInFailures.email, "invented-0@nowhere.example"))).toHaveLength(1);

    const old = Date.now() - 25 * 60 * 60 * 1000;
    await recordFailure({ email: "old@nowhere.example", address: "unknown", device: null }, old);
    await recordFailure({ email: "new@nowhere.example", address: "unknown", device: null });
    expect(await db.select().from(signInFailures).where(eq(signInFailures.email, "old@nowhere.example"))).toHaveLength(0);
  });
});

describe("per-address throttling", () => {
  it("trusts X-Forwarded-For only as far as the configured proxies: a client's own entries change nothing", async () => {
    behindProxy("1");
    const proxySaw = freshAddress();
    const statuses: number[] = [];
    for (let i = 0; i <= signInRate().max; i++) {
      // The client sends its own invented X-Forwarded-For; the proxy appends the address it saw.
      statuses.push((await endpointSignIn(`spray-${i}@nowhere.example`, "whatever-1", { forwarded: `203.0.113.${i}, ${proxySaw}` })).status);
    }
    expect(statuses.filter((s) => s === 401)).toHaveLength(signInRate().max);
    expect(statuses.at(-1)).toBe(429);
  });

  it("without a configured proxy, rotating X-Forwarded-For gives no fresh tries, on the endpoint and on the form", async () => {
    const statuses: number[] = [];
    for (let i = 0; i <= signInRate().max; i++) {
      statuses.push((await endpointSignIn(`rotate-${i}@nowhere.example`, "whatever-1", { forwarded: `192.0.2.${i}` })).status);
    }
    expect(statuses.at(-1)).toBe(429);
    for (let i = 0; i < signInRate().max; i++) {
      await expect(signIn({ email: `form-${i}@nowhere.example`, password: "whatever-1" }, formHeaders(`192.0.2.${100 + i}`))).rejects.toThrow();
    }
    await expect(signIn({ email: "form-last@nowhere.example", password: "whatever-1" }, formHeaders("192.0.2.250"))).rejects.toThrow(
      /Too many sign-in attempts from this address/,
    );
  });
});
