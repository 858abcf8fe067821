// Tenders stated in sensitivity terms and the sensitivity claims and curves vendors make on them:
// the demo tender, the API (tenders and offers), the server action, stored verdicts, bad input.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { eq } from "drizzle-orm";
import { claims, offers, organisations, tenders } from "@/db/schema";
import type { Db } from "@/db/client";
import { evaluateClaim } from "@/lib/bounds";
import { curvePointInput, sensitivityClaimInput, type RadioClaim } from "@/lib/offers/radio";
import { sensitivityTerms } from "@/lib/offers";
import { POST as submitPost } from "@/app/api/v1/tenders/[id]/offers/route";
import { POST as createPost } from "@/app/api/v1/tenders/route";
import { PATCH as tenderPatch } from "@/app/api/v1/tenders/[id]/route";
import { GET as comparisonGet } from "@/app/api/v1/tenders/[id]/comparison/route";
import type { Comparison } from "@/lib/server/comparison";
import { closeDb, freshDatabase, params, request, signInAs } from "../support/app";

// The server action reads the session from next/headers: hand it the signed-in vendor's cookie.
const session = vi.hoisted(() => ({ headers: new Headers() }));
vi.mock("next/headers", () => ({ headers: async () => session.headers, cookies: async () => ({ get: () => undefined, getAll: () => [] }) }));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined }));

let db: Db;
let gateways: typeof tenders.$inferSelect;
const org: Record<string, string> = {};

beforeAll(async () => {
  db = await freshDatabase();
  [gateways] = await db.select().from(tenders).where(eq(tenders.reference, "RC-2027-004"));
  for (const o of await db.select().from(organisations)) org[o.name] = o.id;
});
afterAll(closeDb);

const submit = (headers: Headers, tenderId: string, body: unknown) =>
  submitPost(request(`/api/v1/tenders/${tenderId}/offers`, { method: "POST", headers, body }), params({ id: tenderId }));

const gatewayOffer = (sensitivity: Record<string, unknown>, over: Record<string, unknown> = {}) => ({
  moduleName: "Test gateway",
  partNumber: "TG-1",
  code: { family: "LDPC", decision: "soft", rate: 0.5 },
  claims: [{ pointIndex: 0, metric: "bler", value: 1e-2, sensitivity }],
  envelope: { unitPrice: 150, currency: "EUR", leadTimeWeeks: 8, warrantyMonths: 24, priceBreaks: [] },
  ...over,
});

describe("the demo gateway tender (RC-2027-004)", () => {
  it("is stated as an input level with bit rate, payload, PER and an assumed noise figure", () => {
    expect(gateways.channelModel).toBe("biawgn");
    expect(gateways.assumedNoiseFigureDb).toBe(6);
    expect(gateways.operatingPoints[0]).toEqual({ label: "Valley gateway", value: -130, sensitivity: { bitRate: 1200, payloadBits: 160, targetPer: 1e-2 } });
  });

  it("has one offer per verdict, the impossible one through a curve point beyond the limit", async () => {
    const rows = await db
      .select({ org: organisations.name, verdict: claims.verdict, radio: claims.radio })
      .from(claims)
      .innerJoin(organisations, eq(organisations.id, claims.vendorOrgId))
      .where(eq(claims.tenderId, gateways.id));
    const by = new Map(rows.map((r) => [r.org, r]));
    expect(by.get("Oxbow Wireless")?.verdict).toBe("plausible");
    expect(by.get("Marram Telemetry")?.verdict).toBe("needs-evidence");
    const kestrel = by.get("Kestrelink Radio")!;
    expect(kestrel.verdict).toBe("impossible");
    expect(kestrel.radio!.line.verdict).toBe("needs-evidence");
    expect(kestrel.radio!.worst.at).toBe(0);
    expect(kestrel.radio!.worst.marginDb!).toBeLessThan(0);
  });

  it("stores for the line and every curve point exactly what the engine gives when recomputed", async () => {
    const rows = await db.select().from(claims).where(eq(claims.tenderId, gateways.id));
    expect(rows).toHaveLength(3);
    const terms = sensitivityTerms(gateways, gateways.operatingPoints[0])!;
    for (const c of rows) {
      const radio = c.radio as RadioClaim;
      const statement = { dbm: radio.sensitivityDbm, noiseFigureDb: radio.noiseFigureDb, modulation: radio.modulation, n: radio.n, k: radio.k };
      const line = evaluateClaim(sensitivityClaimInput(terms, statement, c.value));
      expect((c.result as { verdict: string }).verdict).toBe(line.verdict);
      expect(radio.line.impliedEbn0Db).toBeCloseTo(line.implied!.ebn0Db, 12);
      for (const p of radio.curve) expect(p.verdict).toBe(evaluateClaim(curvePointInput(terms, statement, p)).verdict);
    }
  });
});

describe("drafting a tender in sensitivity terms (API)", () => {
  const inAWeek = () => new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);
  const draft = (over: Record<string, unknown> = {}) => ({
    title: "Reservoir gateway receivers",
    channelModel: "biawgn",
    operatingPoints: [
      { label: "Dam wall", value: -128, sensitivity: { bitRate: 2400, payloadBits: 200, targetPer: 1e-2 } },
      { label: "Nominal", value: 3 },
    ],
    targetMetric: "bler",
    targetValue: 1e-2,
    assumedNoiseFigureDb: 5,
    quantity: 20,
    currency: "EUR",
    weights: { technical: 40, evidence: 15, price: 30, leadTime: 10, warranty: 5 },
    closesLocal: `${inAWeek()}T12:00`,
    closesZone: "Europe/London",
    ...over,
  });
  const post = (headers: Headers, body: unknown) => createPost(request("/api/v1/tenders", { method: "POST", headers, body }), undefined);

  it("stores a point in dBm beside one in Eb/N0, with the assumed noise figure (default 6 dB)", async () => {
    const buyer = await signInAs("buyer@tarnwell.example");
    const response = await post(buyer, draft());
    expect(response.status).toBe(201);
    const { id } = await response.json();
    const [row] = await db.select().from(tenders).where(eq(tenders.id, id));
    expect(row.operatingPoints[0].sensitivity).toEqual({ bitRate: 2400, payloadBits: 200, targetPer: 1e-2 });
    expect(row.operatingPoints[1]).toEqual({ label: "Nominal", value: 3 });
    expect(row.assumedNoiseFigureDb).toBe(5);
    const plain = await post(buyer, draft({ assumedNoiseFigureDb: undefined }));
    const [again] = await db
      .select()
      .from(tenders)
      .where(eq(tenders.id, (await plain.json()).id));
    expect(again.assumedNoiseFigureDb).toBe(6);
    const changed = await tenderPatch(request(`/api/v1/tenders/${id}`, { method: "PATCH", headers: buyer, body: { assumedNoiseFigureDb: 3 } }), params({ id }));
    expect(changed.status).toBe(200);
    expect((await db.select().from(tenders).where(eq(tenders.id, id)))[0].assumedNoiseFigureDb).toBe(3);
  });

  it("answers 400 naming the field for a negative bit rate, a level above +30 dBm, a noise figure below 0, or dBm on a hard-decision tender", async () => {
    const buyer = await signInAs("buyer@tarnwell.example");
    const fields = async (body: unknown) => {
      const response = await post(buyer, body);
      expect(response.status).toBe(400);
      return (await response.json()).fieldErrors as Record<string, string[]>;
    };
    expect(
      await fields(draft({ operatingPoints: [{ label: "A", value: -120, sensitivity: { bitRate: -1200, payloadBits: 160, targetPer: 1e-2 } }] })),
    ).toHaveProperty(["operatingPoints.0.sensitivity.bitRate"]);
    expect(
      (await fields(draft({ operatingPoints: [{ label: "A", value: 31, sensitivity: { bitRate: 1200, payloadBits: 160, targetPer: 1e-2 } }] })))[
        "operatingPoints.0.value"
      ][0],
    ).toMatch(/\+30 dBm/);
    expect((await fields(draft({ assumedNoiseFigureDb: -1 })))["assumedNoiseFigureDb"][0]).toMatch(/at least 0 dB/);
    expect(
      await fields(
        draft({ channelModel: "bsc", operatingPoints: [{ label: "A", value: -120, sensitivity: { bitRate: 1200, payloadBits: 160, targetPer: 1e-2 } }] }),
      ),
    ).toHaveProperty(["operatingPoints.0.sensitivity"]);
  });
});

describe("sensitivity offers (API)", () => {
  it("judges a sensitivity line and a curve, stores both with the engine version, the worst point and its margin", async () => {
    const vendor = await signInAs("tenders@quillfield.example");
    const body = gatewayOffer({
      dbm: -135,
      noiseFigureDb: 3,
      modulation: "qpsk",
      n: 320,
      k: 160,
      curve: [
        { x: -138, unit: "dBm", metric: "per", value: 1e-1 },
        { x: 0.5, unit: "ebn0Db", metric: "bler", value: 1e-2 },
        { x: 4, unit: "ebn0Db", metric: "ber", value: 1e-5 },
      ],
    });
    const response = await submit(vendor, gateways.id, body);
    expect(response.status).toBe(201);
    const [row] = await db
      .select()
      .from(claims)
      .innerJoin(offers, eq(offers.id, claims.offerId))
      .where(eq(offers.id, (await response.json()).id));
    const radio = row.claims.radio as RadioClaim;
    expect(radio.curve).toHaveLength(3);
    // 0.5 dB is below the 1959 bound for (320, 160) at BLER 1e-2 (about 1.1 dB): beyond the limit.
    expect(radio.curve[1].verdict).toBe("impossible");
    expect(radio.worst.at).toBe(1);
    expect(radio.worst.marginDb).toBeCloseTo(0.5 - radio.curve[1].limitEbn0Db!, 12);
    expect(row.claims.verdict).toBe("impossible");
    expect(row.claims.engineVersion).toBe((row.claims.result as { engineVersion: string }).engineVersion);
    // The claim's channel value is the Eb/N0 the line amounts to at the vendor's noise figure.
    expect(row.claims.channelValue).toBeCloseTo(-135 + 173.975 - 10 * Math.log10(1200) - 3, 2);
  });

  it("answers 400 naming the field: sensitivity above +30 dBm, noise figure below 0, missing sensitivity, a bad curve point", async () => {
    const vendor = await signInAs("tenders@quillfield.example");
    const fields = async (body: unknown) => {
      const response = await submit(vendor, gateways.id, body);
      expect(response.status).toBe(400);
      return Object.keys((await response.json()).fieldErrors ?? {});
    };
    expect(await fields(gatewayOffer({ dbm: 31 }))).toContain("claims.0.sensitivity.dbm");
    expect(await fields(gatewayOffer({ dbm: -130, noiseFigureDb: -1 }))).toContain("claims.0.sensitivity.noiseFigureDb");
    expect(await fields(gatewayOffer({ dbm: -130, curve: [{ x: -130, unit: "dBm", metric: "per", value: 2 }] }))).toContain(
      "claims.0.sensitivity.curve.0.value",
    );
    expect(await fields(gatewayOffer({ dbm: -130, n: 320 }))).toContain("claims.0.sensitivity.k");
    const missing = await submit(vendor, gateways.id, { ...gatewayOffer({}), claims: [{ pointIndex: 0, metric: "bler", value: 1e-2 }] });
    expect(missing.status).toBe(400);
    expect(Object.keys((await missing.json()).fieldErrors)).toContain("claims.0.sensitivity.dbm");
  });
});

describe("sensitivity offers (server action)", () => {
  it("submits a sensitivity line through the offer form's action and stores its verdict", async () => {
    session.headers = await signInAs("tenders@quillfield.example");
    const { submitOfferAction } = await import("@/app/(app)/tenders/[id]/offer/actions");
    const outcome = await submitOfferAction(gateways.id, gatewayOffer({ dbm: -146 }, { moduleName: "Action gateway" }));
    expect(outcome.ok).toBe(true);
    const [row] = await db.select().from(claims).innerJoin(offers, eq(offers.id, claims.offerId)).where(eq(offers.moduleName, "Action gateway"));
    expect(row.claims.verdict).toBe("impossible");
    expect((row.claims.radio as RadioClaim).line.marginDb!).toBeLessThan(0);
    const refused = await submitOfferAction(gateways.id, gatewayOffer({ dbm: -130, noiseFigureDb: -2 }));
    expect(refused.ok).toBeFalsy();
    expect(Object.keys(refused.fieldErrors ?? {})).toContain("claims.0.sensitivity.noiseFigureDb");
  });
});

describe("the comparison of a sensitivity tender", () => {
  it("scores each claim on its worst point's margin, shows the margin in dB with where it lies, and holds the line to the buyer's level", async () => {
    // Close the gateway tender (it closes on read) so that its offers are unsealed to the buyer.
    await db
      .update(tenders)
      .set({ closesAt: new Date(Date.now() - 60_000) })
      .where(eq(tenders.id, gateways.id));
    const buyer = await signInAs("buyer@tarnwell.example");
    const response = await comparisonGet(request(`/api/v1/tenders/${gateways.id}/comparison`, { headers: buyer }), params({ id: gateways.id }));
    expect(response.status).toBe(200);
    const { input, sheet } = (await response.json()) as Comparison;
    const byVendor = new Map(input.offers.map((o) => [o.vendorName, o]));
    const kestrel = byVendor.get("Kestrelink Radio")!.claims[0];
    expect(kestrel.sensitivity!.place).toMatch(/^curve point 1 \(-145 dBm, PER 0.1\)$/);
    expect(kestrel.channelMargin).toBe(kestrel.sensitivity!.marginDb);
    expect(kestrel.channelMargin!).toBeLessThan(0);
    const points = (name: string) => sheet.offers.find((o) => o.vendorName === name)!.points[0];
    expect(points("Oxbow Wireless")).toMatchObject({ verdict: "plausible", meetsRequirement: true });
    expect(points("Oxbow Wireless").score).toBeGreaterThan(50);
    expect(points("Marram Telemetry")).toMatchObject({ verdict: "needs-evidence", meetsRequirement: true });
    expect(points("Kestrelink Radio")).toMatchObject({ verdict: "impossible", score: 0 });
  });
});
