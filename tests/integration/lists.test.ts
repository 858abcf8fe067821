import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import { claims, offers, organisations, tenderInvitations, tenders, users } from "@/db/schema";
import type { TenderState } from "@/db/schema/tenders";
import { GET as tendersGet } from "@/app/api/v1/tenders/route";
import { GET as claimsGet } from "@/app/api/v1/claims/route";
import { GET as usersGet } from "@/app/api/v1/users/route";
import { POST as declarePost } from "@/app/api/v1/tenders/[id]/declaration/route";
import { claimSubject } from "@/lib/server/review";
import { requireViewer } from "@/lib/server/session";
import { tendersWhere, tenderSubject } from "@/lib/server/tenders";
import { TENDER_STATES } from "@/policies/vocabulary";
import { closeDb, freshDatabase, params, request, DEMO_ACCOUNTS, signInAll } from "../support/app";
import { createCommercialTender, honest } from "../support/comparison-fixtures";

let db: Db;
const as: Record<string, Headers> = {};
const WHO = ["admin", "buyer", "engineer", "approver", "kestrelink", "oxbow"] as const;
let technical: Awaited<ReturnType<typeof createCommercialTender>>;

/** 36 more tenders in every state, invitations spread over two demo vendors, drafts invited too (they must stay hidden). */
async function manyTenders() {
  const [buyer] = await db.select().from(users).where(eq(users.email, DEMO_ACCOUNTS.buyer));
  const orgs = await db
    .select()
    .from(organisations)
    .where(inArray(organisations.name, ["Kestrelink Radio", "Oxbow Wireless"]));
  const base = new Date("2027-03-01T09:00:00Z").getTime();
  for (let i = 0; i < 36; i++) {
    const state = TENDER_STATES[i % TENDER_STATES.length] as TenderState;
    const [t] = await db
      .insert(tenders)
      .values({
        reference: `RC-2031-${String(i + 1).padStart(3, "0")}`,
        title: i % 5 === 0 ? `Harbour buoy radios ${i}` : `Field telemetry radios ${i}`,
        state,
        channelModel: "bsc",
        operatingPoints: [{ label: "Clear", value: 1e-3 }],
        targetMetric: "bler",
        targetValue: 1e-4,
        quantity: 100 + i,
        currency: "EUR",
        weights: { technical: 40, evidence: 15, price: 30, leadTime: 10, warranty: 5 },
        // Far in the future, so that nothing closes on read while the test pages; distinct times give one order.
        closesAt: new Date(base + 400 * 86_400_000),
        createdAt: new Date(base + i * 60_000),
        createdBy: buyer.id,
      })
      .returning();
    const invited = orgs.filter((_, j) => (i + j) % 3 !== 0);
    if (invited.length) await db.insert(tenderInvitations).values(invited.map((o) => ({ tenderId: t.id, organisationId: o.id })));
  }
}

beforeAll(async () => {
  db = await freshDatabase();
  await manyTenders();
  technical = await createCommercialTender(db, {
    state: "technical",
    signed: false,
    points: [
      { label: "Clear", value: 1e-3 },
      { label: "Fade", value: 5e-3 },
      { label: "Storm", value: 8e-3 },
    ],
    offers: Array.from({ length: 5 }, (_, i) =>
      honest(`Pager vendor ${i + 1}`, 40 + i, 6, 24, { claims: [{ value: 1e-5 }, { value: 1e-5 }, { value: 1e-5 }] }),
    ),
  });
  Object.assign(as, await signInAll(...WHO));
});
afterAll(closeDb);

const get = async (handler: typeof tendersGet, path: string, who: string) => {
  const response = await handler(request(path, { headers: as[who] }), undefined);
  return { status: response.status, body: await response.json() };
};

/** Every page of a list, walked through its "more" flag, in the order served. */
async function walk<T>(handler: typeof tendersGet, path: string, key: string, who: string): Promise<T[]> {
  const rows: T[] = [];
  for (let page = 1; ; page++) {
    const { status, body } = await get(handler, `${path}${path.includes("?") ? "&" : "?"}page=${page}`, who);
    expect(status).toBe(200);
    expect(body.page).toBe(page);
    rows.push(...body[key]);
    if (!body.hasMore) {
      expect(body.pages).toBe(page);
      expect(rows).toHaveLength(body.total);
      return rows;
    }
  }
}

describe("the tenders list", () => {
  it("serves a page at a time, newest first, with the total and whether more follows", async () => {
    const first = await get(tendersGet, "/api/v1/tenders?size=10", "buyer");
    expect(first.status).toBe(200);
    expect(first.body.tenders).toHaveLength(10);
    expect(first.body).toMatchObject({ page: 1, pageSize: 10, hasMore: true });
    expect(first.body.total).toBeGreaterThanOrEqual(36);
    const second = await get(tendersGet, "/api/v1/tenders?size=10&page=2", "buyer");
    expect(second.body.page).toBe(2);
    const ids = (b: { tenders: { id: string }[] }) => b.tenders.map((t) => t.id);
    expect(ids(second.body).filter((id) => ids(first.body).includes(id))).toEqual([]);
    const created = [...first.body.tenders, ...second.body.tenders].map((t: { createdAt: string }) => Date.parse(t.createdAt));
    expect(created).toEqual([...created].sort((a, b) => b - a));
    // The fields the list always had are still there.
    expect(Object.keys(first.body.tenders[0])).toEqual(expect.arrayContaining(["id", "reference", "title", "state", "invitedOrgIds", "invited", "closesAt"]));
  });

  it.each(WHO)("pages exactly the tenders the policies let %s read, each once", async (who) => {
    const viewer = await requireViewer(as[who]);
    const expected = (await tendersWhere(db)).filter((t) => viewer.ability.can("read", tenderSubject(t))).map((t) => t.id);
    const served = await walk<{ id: string }>(tendersGet, "/api/v1/tenders?size=7", "tenders", who);
    expect(served.map((t) => t.id)).toEqual(expected);
  });

  it("shows a vendor only tenders it is invited to, never a draft, and only its own invitation", async () => {
    const [kestrelink] = await db.select().from(organisations).where(eq(organisations.name, "Kestrelink Radio"));
    const served = await walk<{ id: string; state: string; invitedOrgIds: string[] }>(tendersGet, "/api/v1/tenders?size=5", "tenders", "kestrelink");
    expect(served.length).toBeGreaterThan(0);
    for (const t of served) {
      expect(t.state).not.toBe("draft");
      expect(t.invitedOrgIds).toEqual([kestrelink.id]);
    }
  });

  it("filters by state and by text in the reference or title, in the database", async () => {
    const open = await walk<{ state: string }>(tendersGet, "/api/v1/tenders?state=open&size=4", "tenders", "buyer");
    expect(open.length).toBeGreaterThan(0);
    expect(open.every((t) => t.state === "open")).toBe(true);
    const buoys = await walk<{ title: string }>(tendersGet, "/api/v1/tenders?q=harbour+BUOY", "tenders", "buyer");
    expect(buoys.map((t) => t.title).sort()).toEqual(Array.from({ length: 8 }, (_, k) => `Harbour buoy radios ${k * 5}`).sort());
    expect((await get(tendersGet, "/api/v1/tenders?q=RC-2031-00", "buyer")).body.total).toBe(9);
    // Pattern characters in the text are taken literally.
    expect((await get(tendersGet, "/api/v1/tenders?q=%25", "buyer")).body.total).toBe(0);
    expect((await get(tendersGet, "/api/v1/tenders?q=RC_2031", "buyer")).body.total).toBe(0);
  });

  it("serves the last page for a page past the end", async () => {
    const { body } = await get(tendersGet, "/api/v1/tenders?state=awarded&page=999", "buyer");
    expect(body.page).toBe(body.pages);
  });

  it.each([
    ["page=0", /page must be at least 1/],
    ["page=two", /page must be a number/],
    ["size=101", /page size must be at most 100/],
    ["size=0", /page size must be at least 1/],
    ["state=finished", /state must be one of: draft/],
  ])("answers ?%s with 400 and says what is wrong", async (query, message) => {
    const { status, body } = await get(tendersGet, `/api/v1/tenders?${query}`, "buyer");
    expect(status).toBe(400);
    expect(body.error).toMatch(message);
  });
});

describe("the review queue", () => {
  beforeAll(async () => {
    // The engineer declares on the fixture tender, with a conflict with its first vendor.
    const body = { conflict: "some", conflictedOrgIds: [technical.vendorOrgIds[0]], statement: "I consulted for the first vendor last year." };
    const response = await declarePost(
      request(`/api/v1/tenders/${technical.tenderId}/declaration`, { method: "POST", headers: as.engineer, body }),
      params({ id: technical.tenderId }),
    );
    expect(response.status).toBe(201);
  });

  /** The queue as the policies define it, checked claim by claim: what every walk through the pages must give. */
  async function readable(who: string, tenderId?: string) {
    const viewer = await requireViewer(as[who]);
    const rows = await db
      .select({ claim: claims, state: tenders.state })
      .from(claims)
      .innerJoin(offers, eq(offers.id, claims.offerId))
      .innerJoin(tenders, eq(tenders.id, claims.tenderId))
      .where(and(eq(offers.status, "submitted"), tenderId ? eq(claims.tenderId, tenderId) : eq(tenders.state, "technical")));
    return rows
      .filter((r) => viewer.ability.can("list", claimSubject(r.claim, r.state)))
      .map((r) => r.claim.id)
      .sort();
  }

  it("pages the declared engineer's claims, leaving out the vendor they are conflicted with", async () => {
    const served = await walk<{ id: string; vendorOrgId: string }>(claimsGet, `/api/v1/claims?tenderId=${technical.tenderId}&size=4`, "claims", "engineer");
    expect(served).toHaveLength(12);
    expect(served.some((c) => c.vendorOrgId === technical.vendorOrgIds[0])).toBe(false);
    expect(served.map((c) => c.id).sort()).toEqual(await readable("engineer", technical.tenderId));
  });

  it.each(["engineer", "buyer", "kestrelink", "approver"])("serves %s the claims the policies let them list, each once", async (who) => {
    const served = await walk<{ id: string }>(claimsGet, "/api/v1/claims?size=6", "claims", who);
    expect(new Set(served.map((c) => c.id)).size).toBe(served.length);
    expect(served.map((c) => c.id).sort()).toEqual(await readable(who));
  });

  it("filters by vendor (id or name), verdict and mark, and lists the vendors for the filter", async () => {
    const path = `/api/v1/claims?tenderId=${technical.tenderId}`;
    const all = await get(claimsGet, path, "buyer");
    expect(all.body.vendors.map((v: { name: string }) => v.name)).toEqual(
      Array.from({ length: 5 }, (_, i) => `Pager vendor ${i + 1} (${all.body.claims[0].tenderReference})`),
    );
    const byId = await get(claimsGet, `${path}&vendor=${technical.vendorOrgIds[2]}`, "buyer");
    expect(byId.body.total).toBe(3);
    const byName = await get(claimsGet, `${path}&vendor=pager+VENDOR+4`, "buyer");
    expect(byName.body.claims.every((c: { vendorOrgId: string }) => c.vendorOrgId === technical.vendorOrgIds[3])).toBe(true);
    expect((await get(claimsGet, `${path}&mark=accepted`, "buyer")).body.total).toBe(15);
    expect((await get(claimsGet, `${path}&mark=unmarked`, "buyer")).body.total).toBe(0);
    expect((await get(claimsGet, `${path}&verdict=impossible`, "buyer")).body.total).toBe(0);
  });

  it.each([
    ["page=-1", /page must be at least 1/],
    ["size=500", /page size must be at most 100/],
    ["verdict=maybe", /verdict must be one of/],
  ])("answers ?%s with 400 and says what is wrong", async (query, message) => {
    const { status, body } = await get(claimsGet, `/api/v1/claims?${query}`, "buyer");
    expect(status).toBe(400);
    expect(body.error).toMatch(message);
  });
});

describe("the people list", () => {
  it("pages people for the admin, with filters", async () => {
    const served = await walk<{ id: string; roles: string[] }>(usersGet, "/api/v1/users?size=3", "users", "admin");
    const total = (await db.select().from(users)).length;
    expect(served).toHaveLength(total);
    const vendors = await walk<{ roles: string[] }>(usersGet, "/api/v1/users?role=vendor&size=2", "users", "admin");
    expect(vendors.length).toBeGreaterThan(0);
    expect(vendors.every((u) => u.roles.includes("vendor"))).toBe(true);
    const found = await get(usersGet, "/api/v1/users?q=STRAND", "admin");
    expect(found.body.users.map((u: { name: string }) => u.name)).toEqual(["Helen Strand"]);
    expect((await get(usersGet, "/api/v1/users?status=deactivated", "admin")).body.total).toBe(0);
  });

  it("is the admin's alone, and refuses a bad filter with 400", async () => {
    expect((await get(usersGet, "/api/v1/users?page=2", "buyer")).status).toBe(403);
    const bad = await get(usersGet, "/api/v1/users?role=owner", "admin");
    expect(bad.status).toBe(400);
    expect(bad.body.error).toMatch(/role must be one of/);
  });
});
