import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, count, eq, notInArray } from "drizzle-orm";
import { claims, declarations, ledgerEntries, offers, organisations, tenders, users } from "@/db/schema";
import type { Db } from "@/db/client";
import { DEMO_OFFERS } from "@/db/seed-offers";
import { evaluateClaim } from "@/lib/bounds";
import { claimInputFor } from "@/lib/offers";
import { verifyLedger } from "@/lib/server/ledger";
import { GET as listGet, POST as submitPost } from "@/app/api/v1/tenders/[id]/offers/route";
import { GET as offerGet } from "@/app/api/v1/offers/[id]/route";
import { POST as withdrawPost } from "@/app/api/v1/offers/[id]/withdraw/route";
import { closeDb, freshDatabase, params, request, signInAs } from "../support/app";

let db: Db;
const tenderIds: Record<string, string> = {};
const orgIds: Record<string, string> = {};
const ENVELOPE_KEYS = ["unitPrice", "currency", "leadTimeWeeks", "warrantyMonths", "priceBreaks"];

beforeAll(async () => {
  db = await freshDatabase();
  for (const t of await db.select().from(tenders)) tenderIds[t.reference] = t.id;
  for (const o of await db.select().from(organisations)) orgIds[o.name] = o.id;
});
afterAll(closeDb);

const GAUGES = () => tenderIds["RC-2027-001"];
const WEIRS = () => tenderIds["RC-2027-003"];
const RAIN = () => tenderIds["RC-2027-002"];

/** An honest offer for the weirs tender (one point, p = 2e-3). */
const weirsOffer = (over: Record<string, unknown> = {}) => ({
  moduleName: "Test module",
  partNumber: "TM-1",
  code: { family: "LDPC", decision: "hard", n: 2048, k: 1536 },
  claims: [{ pointIndex: 0, metric: "bler", value: 1e-5 }],
  envelope: { unitPrice: 52.5, currency: "EUR", leadTimeWeeks: 8, warrantyMonths: 24, priceBreaks: [{ minQuantity: 300, unitPrice: 50 }] },
  ...over,
});

const submit = (headers: Headers, tenderId: string, body: unknown) =>
  submitPost(request(`/api/v1/tenders/${tenderId}/offers`, { method: "POST", headers, body }), params({ id: tenderId }));
const list = (headers: Headers, tenderId: string) => listGet(request(`/api/v1/tenders/${tenderId}/offers`, { headers }), params({ id: tenderId }));
const getOne = (headers: Headers, id: string) => offerGet(request(`/api/v1/offers/${id}`, { headers }), params({ id }));
const withdraw = (headers: Headers, id: string) => withdrawPost(request(`/api/v1/offers/${id}/withdraw`, { method: "POST", headers }), params({ id }));

async function counts() {
  const [o] = await db.select({ n: count() }).from(offers);
  const [c] = await db.select({ n: count() }).from(claims);
  // Closing on read may append "tender.closed" and "offers.unsealed": that is the tender's own change, not the offer's.
  const [l] = await db
    .select({ n: count() })
    .from(ledgerEntries)
    .where(notInArray(ledgerEntries.action, ["tender.closed", "offers.unsealed"]));
  return { offers: o.n, claims: c.n, ledger: l.n };
}

/** Keys present anywhere in a JSON value. */
function keysIn(value: unknown, out = new Set<string>()): Set<string> {
  if (Array.isArray(value)) value.forEach((v) => keysIn(v, out));
  else if (value && typeof value === "object")
    for (const [k, v] of Object.entries(value)) {
      out.add(k);
      keysIn(v, out);
    }
  return out;
}

async function declare(email: string, tenderId: string, conflictedOrgIds: string[] = []) {
  const [user] = await db.select().from(users).where(eq(users.email, email));
  // Replaces whatever the demo seed declared, so each test states its own situation.
  await db.delete(declarations).where(and(eq(declarations.userId, user.id), eq(declarations.tenderId, tenderId)));
  await db.insert(declarations).values({ tenderId, userId: user.id, conflictedOrgIds, statement: "test" });
}

describe("the demo offers", () => {
  it("store, for every claim, exactly the verdict the engine gives when recomputed", async () => {
    const [tender] = await db.select().from(tenders).where(eq(tenders.id, GAUGES()));
    const rows = await db.select().from(claims).innerJoin(offers, eq(offers.id, claims.offerId)).where(eq(claims.tenderId, GAUGES()));
    expect(rows).toHaveLength(8);
    for (const { claims: c, offers: o } of rows) {
      const input = claimInputFor(tender.channelModel, tender.operatingPoints[c.pointIndex].value, o, c);
      const recomputed = evaluateClaim(input);
      expect(c.verdict).toBe(recomputed.verdict);
      expect(c.engineVersion).toBe(recomputed.engineVersion);
      expect((c.result as { findings: unknown[] }).findings).toEqual(JSON.parse(JSON.stringify(recomputed.findings)));
    }
  });

  it("show one vendor beyond capacity, one needing evidence and two honest ones", async () => {
    const byVendor = new Map<string, string[]>();
    const rows = await db
      .select({ org: organisations.name, verdict: claims.verdict })
      .from(claims)
      .innerJoin(organisations, eq(organisations.id, claims.vendorOrgId))
      .where(eq(claims.tenderId, GAUGES()));
    for (const r of rows) byVendor.set(r.org, [...(byVendor.get(r.org) ?? []), r.verdict]);
    expect(byVendor.get("Kestrelink Radio")).toContain("impossible");
    expect(byVendor.get("Marram Telemetry")).toContain("needs-evidence");
    expect(byVendor.get("Marram Telemetry")).not.toContain("impossible");
    expect(byVendor.get("Oxbow Wireless")).toEqual(["plausible", "plausible"]);
    expect(byVendor.get("Quillfield RF")).toEqual(["plausible", "plausible"]);
    expect(DEMO_OFFERS.map((d) => d.offer.envelope.unitPrice)).toEqual(expect.arrayContaining([38.5, 44.9]));
  });

  it("are in the ledger with their verdicts and without a price", async () => {
    const entries = await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.action, "offer.submitted"), eq(ledgerEntries.tenderId, GAUGES())));
    expect(entries).toHaveLength(4);
    for (const e of entries) {
      const keys = keysIn(e.data);
      for (const key of ENVELOPE_KEYS) expect(keys.has(key)).toBe(false);
      expect(JSON.stringify(e.data)).not.toMatch(/38\.5|44\.9/);
      expect(e.data).toHaveProperty("summary");
    }
  });
});

describe("who reads what", () => {
  it("a vendor lists only its own organisation's offer, with its envelope", async () => {
    const vendor = await signInAs("sales@kestrelink.example");
    const response = await list(vendor, GAUGES());
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body).toHaveLength(1);
    expect(body[0]).toMatchObject({ vendorName: "Kestrelink Radio", unitPrice: 29.9, currency: "EUR" });
    const text = JSON.stringify(body);
    for (const name of ["Marram", "Oxbow", "Quillfield"]) expect(text).not.toContain(name);
    for (const other of ["Marram Telemetry", "Oxbow Wireless", "Quillfield RF"]) expect(text).not.toContain(orgIds[other]);
  });

  it("a vendor cannot read another organisation's offer or claims", async () => {
    const vendor = await signInAs("sales@kestrelink.example");
    const [marram] = await db.select().from(offers).where(eq(offers.vendorOrgId, orgIds["Marram Telemetry"]));
    const response = await getOne(vendor, marram.id);
    expect([403, 404]).toContain(response.status);
    const text = await response.text();
    expect(text).not.toContain("TM4-R-1024");
    expect(text).not.toContain("41.2");
  });

  it("an engineer who has not declared reads no offers; once declared, never an envelope field", async () => {
    const [ravi] = await db.select().from(users).where(eq(users.email, "engineer@tarnwell.example"));
    await db.delete(declarations).where(eq(declarations.userId, ravi.id));
    const engineer = await signInAs("engineer@tarnwell.example");
    expect((await list(engineer, GAUGES())).status).toBe(403);
    await declare("engineer@tarnwell.example", GAUGES());
    const again = await signInAs("engineer@tarnwell.example");
    const response = await list(again, GAUGES());
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body).toHaveLength(4);
    expect(body[0].claims[0]).toHaveProperty("verdict");
    for (const key of ENVELOPE_KEYS) expect(keysIn(body).has(key)).toBe(false);
    const one = await (await getOne(again, body[0].id)).json();
    expect(one.moduleName).toBeTruthy();
    for (const key of ENVELOPE_KEYS) expect(keysIn(one).has(key)).toBe(false);
    // Even once the envelopes are opened, the engineer stays price-blind.
    await db.update(tenders).set({ envelopesOpenedAt: new Date() }).where(eq(tenders.id, GAUGES()));
    try {
      const opened = await (await list(again, GAUGES())).json();
      for (const key of ENVELOPE_KEYS) expect(keysIn(opened).has(key)).toBe(false);
    } finally {
      await db.update(tenders).set({ envelopesOpenedAt: null }).where(eq(tenders.id, GAUGES()));
    }
  });

  it("a declared conflict hides that vendor's offer altogether", async () => {
    await declare("director@tarnwell.example", GAUGES(), [orgIds["Kestrelink Radio"]]);
    const director = await signInAs("director@tarnwell.example");
    const body = await (await list(director, GAUGES())).json();
    expect(body.map((o: { vendorName: string }) => o.vendorName).sort()).toEqual(["Marram Telemetry", "Oxbow Wireless", "Quillfield RF"]);
  });

  it("a buyer reads the envelopes only after they are opened", async () => {
    const buyer = await signInAs("buyer@tarnwell.example");
    const sealed = await (await list(buyer, GAUGES())).json();
    expect(sealed).toHaveLength(4);
    for (const key of ENVELOPE_KEYS) expect(keysIn(sealed).has(key)).toBe(false);
    await db.update(tenders).set({ envelopesOpenedAt: new Date() }).where(eq(tenders.id, GAUGES()));
    try {
      const opened = await (await list(buyer, GAUGES())).json();
      expect(opened.find((o: { vendorName: string }) => o.vendorName === "Oxbow Wireless")).toMatchObject({
        unitPrice: 38.5,
        leadTimeWeeks: 14,
        warrantyMonths: 24,
      });
    } finally {
      await db.update(tenders).set({ envelopesOpenedAt: null }).where(eq(tenders.id, GAUGES()));
    }
  });
});

describe("submitting, resubmitting and withdrawing", () => {
  let firstId = "";

  it("computes and returns each claim's verdict with its findings on submission", async () => {
    const vendor = await signInAs("bids@oxbow.example");
    const response = await submit(vendor, WEIRS(), weirsOffer());
    expect(response.status).toBe(201);
    const body = await response.json();
    firstId = body.id;
    expect(body).toMatchObject({ version: 1, status: "submitted", unitPrice: 52.5 });
    expect(body.claims[0].verdict).toBe("plausible");
    expect(body.claims[0].result.findings.length).toBeGreaterThan(0);
    expect(body.claims[0].keyFinding.message).toMatch(/BLER/);
    const [entry] = await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.action, "offer.submitted"), eq(ledgerEntries.subjectId, firstId)));
    expect(entry.data).toMatchObject({ version: 1, summary: { plausible: 1, impossible: 0 } });
    expect(JSON.stringify(entry.data)).not.toContain("52.5");
  });

  it("shows a claim beyond capacity as impossible to the vendor at once", async () => {
    const vendor = await signInAs("sales@kestrelink.example");
    const response = await submit(
      vendor,
      WEIRS(),
      weirsOffer({ code: { family: "RS", decision: "hard", n: 2048, k: 2040 }, claims: [{ pointIndex: 0, metric: "bler", value: 1e-9 }] }),
    );
    expect(response.status).toBe(201);
    const body = await response.json();
    expect(body.claims[0].verdict).toBe("impossible");
    expect(body.claims[0].keyFinding.severity).toBe("violation");
  });

  it("a resubmission is a new version and keeps the earlier one with its claims", async () => {
    const vendor = await signInAs("bids@oxbow.example");
    const response = await submit(vendor, WEIRS(), weirsOffer({ moduleName: "Test module rev B" }));
    expect(response.status).toBe(201);
    const second = await response.json();
    expect(second.version).toBe(2);
    const [first] = await db.select().from(offers).where(eq(offers.id, firstId));
    expect(first.status).toBe("superseded");
    expect(await db.select().from(claims).where(eq(claims.offerId, firstId))).toHaveLength(1);
    const detail = await (await getOne(vendor, second.id)).json();
    expect(detail.versions.map((v: { version: number; status: string }) => [v.version, v.status])).toEqual([
      [1, "superseded"],
      [2, "submitted"],
    ]);
    const current = await (await list(vendor, WEIRS())).json();
    expect(current.map((o: { version: number }) => o.version)).toEqual([2]);
  });

  it("a withdrawal is recorded and kept; withdrawing twice is a conflict", async () => {
    const vendor = await signInAs("bids@oxbow.example");
    const [current] = await db
      .select()
      .from(offers)
      .where(and(eq(offers.tenderId, WEIRS()), eq(offers.vendorOrgId, orgIds["Oxbow Wireless"]), eq(offers.version, 2)));
    const response = await withdraw(vendor, current.id);
    expect(response.status).toBe(200);
    expect((await response.json()).status).toBe("withdrawn");
    const [entry] = await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.action, "offer.withdrawn"), eq(ledgerEntries.subjectId, current.id)));
    expect(entry.data).toMatchObject({ version: 2 });
    expect(await db.select().from(offers).where(eq(offers.tenderId, WEIRS()))).toHaveLength(3);
    const twice = await withdraw(vendor, current.id);
    expect(twice.status).toBe(409);
    expect((await twice.json()).error).toMatch(/already withdrawn/);
  });

  it("another vendor cannot withdraw someone else's offer", async () => {
    const other = await signInAs("tenders@quillfield.example");
    const [kestrel] = await db
      .select()
      .from(offers)
      .where(and(eq(offers.tenderId, WEIRS()), eq(offers.vendorOrgId, orgIds["Kestrelink Radio"])));
    const response = await withdraw(other, kestrel.id);
    expect([403, 404]).toContain(response.status);
    expect((await db.select().from(offers).where(eq(offers.id, kestrel.id)))[0].status).toBe("submitted");
  });
});

describe("refusals write nothing", () => {
  async function refused(headers: Headers, tenderId: string, body: unknown, status: number, message: RegExp) {
    const before = await counts();
    const response = await submit(headers, tenderId, body);
    expect(response.status).toBe(status);
    const json = await response.json();
    expect(json.error).toMatch(message);
    expect(await counts()).toEqual(before);
    return json;
  }

  it("after the closing time, even while the tender still says open", async () => {
    const vendor = await signInAs("tenders@quillfield.example");
    const [weirs] = await db.select().from(tenders).where(eq(tenders.id, WEIRS()));
    await db
      .update(tenders)
      .set({ closesAt: new Date(Date.now() - 60_000) })
      .where(eq(tenders.id, WEIRS()));
    try {
      await refused(vendor, WEIRS(), weirsOffer(), 409, /closed at .*nothing can be submitted/);
      const [closed] = await db.select().from(tenders).where(eq(tenders.id, WEIRS()));
      expect(closed.state).toBe("technical");
    } finally {
      await db.update(tenders).set({ closesAt: weirs.closesAt, state: "open" }).where(eq(tenders.id, WEIRS()));
    }
  });

  it("on a tender in technical evaluation", async () => {
    const vendor = await signInAs("bids@oxbow.example");
    await refused(vendor, GAUGES(), weirsOffer({ claims: [0, 1].map((pointIndex) => ({ pointIndex, metric: "bler", value: 1e-5 })) }), 409, /closed/);
  });

  it("on a cancelled tender", async () => {
    const vendor = await signInAs("tenders@quillfield.example");
    await db.update(tenders).set({ state: "cancelled", cancelReason: "test" }).where(eq(tenders.id, WEIRS()));
    try {
      await refused(vendor, WEIRS(), weirsOffer(), 409, /cancelled/);
    } finally {
      await db.update(tenders).set({ state: "open", cancelReason: null }).where(eq(tenders.id, WEIRS()));
    }
  });

  it("from a vendor the tender did not invite", async () => {
    await db.update(tenders).set({ state: "open" }).where(eq(tenders.id, RAIN()));
    try {
      const vendor = await signInAs("sales@kestrelink.example");
      const body = weirsOffer({ claims: [0, 1].map((pointIndex) => ({ pointIndex, metric: "ber", value: 1e-6 })) });
      await refused(vendor, RAIN(), body, 403, /not invited/);
    } finally {
      await db.update(tenders).set({ state: "draft" }).where(eq(tenders.id, RAIN()));
    }
  });

  it("from a role that does not submit offers", async () => {
    await refused(await signInAs("buyer@tarnwell.example"), WEIRS(), weirsOffer(), 403, /vendors/);
  });

  let quillfield: Headers;
  it("a claim with k > n, naming the field", async () => {
    const vendor = (quillfield = await signInAs("tenders@quillfield.example"));
    const json = await refused(vendor, WEIRS(), weirsOffer({ code: { family: "BCH", decision: "hard", n: 1023, k: 2000 } }), 400, /code\.k/);
    expect(json.fieldErrors["code.k"][0]).toMatch(/at most n \(1023\)/);
  });

  it("a claimed BLER outside (0, 1), a missing point, a foreign currency, naming each field", async () => {
    const vendor = await signInAs("tenders@quillfield.example");
    const bad = await refused(vendor, WEIRS(), weirsOffer({ claims: [{ pointIndex: 0, metric: "bler", value: 1.5 }] }), 400, /claims\.0\.value/);
    expect(bad.fieldErrors["claims.0.value"]).toBeTruthy();
    const missing = await refused(
      vendor,
      WEIRS(),
      weirsOffer({ claims: [{ pointIndex: 3, metric: "bler", value: 1e-5 }] }),
      400,
      /check the highlighted fields/,
    );
    expect(missing.fieldErrors.claims[0]).toMatch(/each of the tender's 1 operating point/);
    const foreign = await refused(
      vendor,
      WEIRS(),
      weirsOffer({ envelope: { unitPrice: 10, currency: "USD", leadTimeWeeks: 4, warrantyMonths: 12, priceBreaks: [] } }),
      400,
      /highlighted/,
    );
    expect(foreign.fieldErrors["envelope.currency"][0]).toMatch(/EUR/);
  });

  it("a soft-decision code on a hard-decision (BSC) tender, saying what to do, and storing nothing", async () => {
    const vendor = quillfield;
    const json = await refused(vendor, WEIRS(), weirsOffer({ code: { family: "LDPC", decision: "soft", n: 2048, k: 1536 } }), 400, /highlighted/);
    expect(json.fieldErrors["code.decision"][0]).toMatch(/hard decision \(binary symmetric channel\)/);
  });

  it("price breaks out of order, and a zero price", async () => {
    const vendor = await signInAs("tenders@quillfield.example");
    const envelope = {
      unitPrice: 0,
      currency: "EUR",
      leadTimeWeeks: 4,
      warrantyMonths: 12,
      priceBreaks: [
        { minQuantity: 500, unitPrice: 9 },
        { minQuantity: 100, unitPrice: 8 },
      ],
    };
    const json = await refused(vendor, WEIRS(), weirsOffer({ envelope }), 400, /envelope/);
    expect(Object.keys(json.fieldErrors)).toEqual(expect.arrayContaining(["envelope.unitPrice", "envelope.priceBreaks.1.minQuantity"]));
  });

  it("malformed JSON", async () => {
    const vendor = await signInAs("tenders@quillfield.example");
    const before = await counts();
    const response = await submitPost(
      request(`/api/v1/tenders/${WEIRS()}/offers`, { method: "POST", headers: vendor, rawBody: "{oops" }),
      params({ id: WEIRS() }),
    );
    expect(response.status).toBe(400);
    expect(await counts()).toEqual(before);
  });
});

describe("the ledger", () => {
  it("still verifies after all of the above", async () => {
    expect(await verifyLedger(db)).toMatchObject({ ok: true });
  });
});
