import { eq } from "drizzle-orm";
import type { Queryable } from "./client";
import { DEMO_USERS, type DemoContext } from "./seed-context";
import { tenders } from "./schema";
import { evaluateOffer } from "@/lib/offers";
import { writeOfferVersion } from "@/lib/server/offer-versions";
import type { OfferInput } from "@/lib/validation/offer";

// Invented offers for the gauges tender (hard decision, p = 1e-3 and 5e-3, BLER 1e-4 required,
// frames of at most 2,048 bits). The verdicts are not written here: the engine computes them when
// the seed submits each offer, and tests/integration/offers.test.ts checks what each one shows.

const DAY = 86_400_000;
const bothPoints = (metric: "bler" | "ber", value: number) => [0, 1].map((pointIndex) => ({ pointIndex, metric, value, ncgOutputBer: null }));

export interface DemoOffer {
  /** DEMO_USERS key of the vendor's demo user, which is also the DEMO_ORGANISATIONS key. */
  vendor: "kestrelink" | "marram" | "oxbow" | "quillfield";
  /** What the numbers were chosen to show; the engine decides, tests hold them to it. */
  shows: "beyond capacity" | "needs evidence" | "honest";
  daysBeforeClosing: number;
  offer: OfferInput;
}

export const DEMO_OFFERS: DemoOffer[] = [
  {
    vendor: "kestrelink",
    shows: "beyond capacity",
    daysBeforeClosing: 9,
    offer: {
      moduleName: "KR-868 GaugeLink",
      partNumber: "KR-868-GL2",
      code: { family: "LDPC", decision: "hard", n: 2048, k: null, rate: 0.95, overhead: null },
      claims: bothPoints("bler", 1e-6),
      envelope: { unitPrice: 29.9, currency: "EUR", leadTimeWeeks: 10, warrantyMonths: 24, priceBreaks: [{ minQuantity: 2000, unitPrice: 28.4 }] },
    },
  },
  {
    vendor: "marram",
    shows: "needs evidence",
    daysBeforeClosing: 6,
    offer: {
      moduleName: "Marram TM-4 River",
      partNumber: "TM4-R-1024",
      code: { family: "polar", decision: "hard", n: 1024, k: 901, rate: null, overhead: null },
      claims: bothPoints("bler", 1e-5),
      envelope: { unitPrice: 41.2, currency: "EUR", leadTimeWeeks: 12, warrantyMonths: 24, priceBreaks: [] },
    },
  },
  {
    vendor: "oxbow",
    shows: "honest",
    daysBeforeClosing: 4,
    offer: {
      moduleName: "Oxbow OW-Sub1 Gauge",
      partNumber: "OW-S1-G75",
      code: { family: "LDPC", decision: "hard", n: 2048, k: 1536, rate: null, overhead: null },
      claims: bothPoints("bler", 1e-5),
      envelope: {
        unitPrice: 38.5,
        currency: "EUR",
        leadTimeWeeks: 14,
        warrantyMonths: 24,
        priceBreaks: [
          { minQuantity: 1000, unitPrice: 37.2 },
          { minQuantity: 2500, unitPrice: 35.9 },
        ],
      },
    },
  },
  {
    vendor: "quillfield",
    shows: "honest",
    daysBeforeClosing: 3,
    offer: {
      moduleName: "Quillfield QR-9 Hydro",
      partNumber: "QR9-H-BCH",
      code: { family: "BCH", decision: "hard", n: 2047, k: 1695, rate: null, overhead: null },
      claims: bothPoints("bler", 1e-5),
      envelope: { unitPrice: 44.9, currency: "EUR", leadTimeWeeks: 6, warrantyMonths: 36, priceBreaks: [{ minQuantity: 2000, unitPrice: 43.5 }] },
    },
  },
];

/**
 * Invented offers for the flood-warning gateway tender (one point stated as an input level:
 * -130 dBm at 1,200 bit/s, 160-bit packets, PER 1e-2; assumed noise figure 6 dB). Quillfield has
 * not answered yet (the browser journey submits its offer).
 */
export const DEMO_SENSITIVITY_OFFERS: (Omit<DemoOffer, "shows"> & { shows: "plausible" | "needs evidence" | "curve beyond the limit" })[] = [
  {
    vendor: "oxbow",
    shows: "plausible",
    daysBeforeClosing: 18,
    offer: {
      moduleName: "Oxbow OW-GW2 Gateway",
      partNumber: "OW-GW2-320",
      code: { family: "LDPC", decision: "soft", n: 320, k: 160, rate: null, overhead: null },
      claims: [
        {
          pointIndex: 0,
          metric: "bler",
          value: 1e-2,
          ncgOutputBer: null,
          sensitivity: { dbm: -133, noiseFigureDb: 4, modulation: "bpsk", n: 320, k: 160, curve: null },
        },
      ],
      envelope: { unitPrice: 212, currency: "EUR", leadTimeWeeks: 8, warrantyMonths: 36, priceBreaks: [] },
    },
  },
  {
    vendor: "marram",
    shows: "needs evidence",
    daysBeforeClosing: 17,
    offer: {
      moduleName: "Marram GR-1 Basin",
      partNumber: "GR1-B-12",
      code: { family: "convolutional", decision: "soft", n: null, k: null, rate: 0.5, overhead: null },
      claims: [
        {
          pointIndex: 0,
          metric: "bler",
          value: 1e-2,
          ncgOutputBer: null,
          sensitivity: { dbm: -141, noiseFigureDb: null, modulation: null, n: null, k: null, curve: null },
        },
      ],
      envelope: { unitPrice: 189, currency: "EUR", leadTimeWeeks: 10, warrantyMonths: 24, priceBreaks: [] },
    },
  },
  {
    vendor: "kestrelink",
    shows: "curve beyond the limit",
    daysBeforeClosing: 16,
    offer: {
      moduleName: "KR-GW Longreach",
      partNumber: "KR-GW-LR4",
      code: { family: "polar", decision: "soft", n: null, k: null, rate: 0.5, overhead: null },
      claims: [
        {
          pointIndex: 0,
          metric: "bler",
          value: 1e-2,
          ncgOutputBer: null,
          sensitivity: {
            dbm: -142,
            noiseFigureDb: null,
            modulation: null,
            n: null,
            k: null,
            curve: [
              { x: -145, unit: "dBm", metric: "per", value: 1e-1 },
              { x: -142, unit: "dBm", metric: "per", value: 1e-2 },
              { x: -140.5, unit: "dBm", metric: "per", value: 1e-3 },
              { x: -139.5, unit: "dBm", metric: "per", value: 1e-4 },
            ],
          },
        },
      ],
      envelope: { unitPrice: 164, currency: "EUR", leadTimeWeeks: 6, warrantyMonths: 24, priceBreaks: [] },
    },
  },
];

/** The demo offers: four vendors on the gauges tender (one claim beyond capacity, one needing evidence, two honest). */
export async function seedDemoOffers(
  tx: Queryable,
  ctx: DemoContext,
  tenderId = ctx.tenderIds.gauges,
  offers: readonly Omit<DemoOffer, "shows">[] = DEMO_OFFERS,
): Promise<void> {
  const [tender] = await tx.select().from(tenders).where(eq(tenders.id, tenderId));
  for (const demo of offers) {
    const evaluation = evaluateOffer(tender, demo.offer);
    if (!evaluation.ok) throw new Error(`demo offer of ${demo.vendor} does not fit the tender: ${JSON.stringify(evaluation.fieldErrors)}`);
    await writeOfferVersion(tx, {
      tender,
      vendorOrgId: ctx.orgIds[demo.vendor],
      actor: { id: ctx.userIds[demo.vendor], label: DEMO_USERS.find((u) => u.key === demo.vendor)?.name ?? demo.vendor },
      input: demo.offer,
      claims: evaluation.claims,
      at: new Date(tender.closesAt.getTime() - demo.daysBeforeClosing * DAY),
    });
  }
}

/** The demo offers on the gateway tender, one per verdict (the last through a curve point beyond the limit). */
export function seedDemoSensitivityOffers(tx: Queryable, ctx: DemoContext): Promise<void> {
  return seedDemoOffers(tx, ctx, ctx.tenderIds.gateways, DEMO_SENSITIVITY_OFFERS);
}
