// The scale workload (`npm run seed:scale`, never run by default): an invented, reproducible
// history of a busy buying team, written through the app's own data-access functions so that the
// ledger is one valid chain. The demo scenario (db/seed.ts) comes first, so its accounts sign in
// and see everything. The same seed gives the same rows, verdicts and ledger actions every time
// (ids, hashes and timestamps differ). Everything here is invented: no real company, person or figure.
import { and, asc, count, eq, inArray, notLike } from "drizzle-orm";
import type { PgTable } from "drizzle-orm/pg-core";
import type { Db, Queryable } from "./client";
import { getDb } from "@/lib/server/database";
import { claims, declarations, marks, offers, organisations, tenderInvitations, tenders, threadMessages, threads, users, type RoleName } from "./schema";
import type { ChannelModel, OperatingPoint, ScoringWeights, TenderState } from "./schema/tenders";
import type { MarkKind } from "./schema/evaluation";
import { DEMO_PASSWORD, seedDemoData } from "./seed";
import { viewerOf } from "./seed-viewer";
import { evaluateClaim, type ClaimResult } from "@/lib/bounds";
import { evaluatedClaim, prepareOffer } from "@/lib/offers";
import { assessRun, unitForMetric } from "@/lib/review/evidence";
import { totalPriceAt } from "@/lib/scoring/criteria";
import type { OfferInput } from "@/lib/validation/offer";
import { decideRecommendation } from "@/lib/server/approvals";
import { getComparison, openEnvelopes } from "@/lib/server/comparison";
import { insertEvidenceRun } from "@/lib/server/evidence-runs";
import { appendLedger, appendLedgerMany, type LedgerInput } from "@/lib/server/ledger";
import { checkpointNow } from "@/lib/server/ledger-anchors";
import { writeOfferVersion } from "@/lib/server/offer-versions";
import { insertUser } from "@/lib/server/people-store";
import { submitRecommendation } from "@/lib/server/recommendations";
import type { Viewer } from "@/lib/server/session";
import { signTechnical } from "@/lib/server/signoff";
import { cancelTender } from "@/lib/server/tender-lifecycle";
import { closeDueTenders } from "@/lib/server/tenders";
import { insertThread } from "@/lib/server/threads";

export interface ScaleOptions {
  /** Tenders in all, the demo's three included. */
  tenders: number;
  /** Vendor organisations taking part in the ordinary tenders, the demo's four included. */
  vendors: number;
  /** The PRNG seed: the same seed gives the same workload. */
  seed: number;
  /** One tender in commercial evaluation, envelopes open, with this many offers x points (the comparison target). */
  wide: { offers: number; points: number } | null;
  /** Probability that a second engineer also marks a settled claim (every mark is kept). */
  secondOpinion: number;
  log: (line: string) => void;
}

export const FULL_SCALE: ScaleOptions = { tenders: 200, vendors: 30, seed: 2027, wide: { offers: 50, points: 10 }, secondOpinion: 0.9, log: () => undefined };

export interface ScaleReport {
  tenders: number;
  byState: Record<string, number>;
  vendorOrganisations: number;
  people: number;
  offers: number;
  claims: number;
  marks: number;
  evidenceRuns: number;
  threads: number;
  ledgerEntries: number;
  /** The comparison target's id, when one was made. */
  wideTenderId: string | null;
  distinctEngineInputs: number;
  seconds: number;
}

/** mulberry32, a small published 32-bit PRNG: the whole workload follows from one seed. */
function prng(seed: number) {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const int = (lo: number, hi: number) => lo + Math.floor(next() * (hi - lo + 1));
  const pick = <T>(list: readonly T[]): T => list[Math.floor(next() * list.length)];
  const chance = (p: number) => next() < p;
  return { next, int, pick, chance };
}
type Rng = ReturnType<typeof prng>;

// Invented names, combined deterministically; none is meant to name a real company or person.
const VENDOR_STEMS = [
  "Alderwick",
  "Brackenholt",
  "Corriemoss",
  "Dunnockfield",
  "Eltermere",
  "Fellgate",
  "Gorsedale",
  "Harebell",
  "Inglebrook",
  "Juniper Vale",
  "Kittiwake",
  "Lythebank",
  "Mossbeck",
  "Nethermoor",
  "Ormsgill",
  "Peewit",
  "Quarrymoor",
  "Rushmere",
  "Sedgefen",
  "Thistlecombe",
  "Underhowe",
  "Varlow",
  "Whinfell",
  "Yarrowby",
  "Zennorcove",
  "Ashgill",
  "Brockholme",
  "Cawdor Fen",
  "Dipperwell",
  "Eskholt",
  "Fernlow",
  "Gillraven",
  "Heronsike",
  "Ivybridge Moor",
  "Jackdaw Hill",
  "Kelpie Reach",
  "Lapwing",
  "Marlpit",
  "Nutwood",
  "Otterburnside",
  "Pinfold",
  "Quernstone",
  "Reedmace",
  "Stonechat",
  "Tarnhow",
  "Upfold",
];
const VENDOR_KINDS = ["Radio", "Telemetry", "Wireless", "RF", "Links", "Signal Works"];
const COUNTRIES = ["NL", "DK", "IE", "DE", "FR", "BE", "SE", "FI", "PL", "CZ", "AT", "ES", "PT", "IT", "NO", "GB"];
const GIVEN = [
  "Ada",
  "Bram",
  "Carys",
  "Dev",
  "Elin",
  "Femi",
  "Greta",
  "Hugo",
  "Isla",
  "Jori",
  "Kaia",
  "Lorcan",
  "Mina",
  "Nils",
  "Oona",
  "Pavel",
  "Rhea",
  "Sami",
  "Tove",
  "Ugo",
  "Vera",
  "Wim",
  "Yara",
  "Zeno",
];
const FAMILY = [
  "Abberley",
  "Brunt",
  "Castellow",
  "Dray",
  "Emberton",
  "Fallowby",
  "Garside",
  "Holroyd",
  "Ickworth",
  "Jessop",
  "Kettleby",
  "Lindqvist",
  "Marwood",
  "Northey",
  "Osgood",
  "Pellow",
  "Rainford",
  "Sowerby",
  "Thwaite",
  "Umber",
  "Vance",
  "Wetherall",
];
const ASSETS = [
  "pumping station",
  "reservoir level",
  "borehole",
  "sluice gate",
  "flow meter",
  "rain gauge",
  "valve chamber",
  "leak detector",
  "water tower",
  "treatment works",
  "outfall",
  "culvert",
  "groundwater probe",
  "storm overflow",
  "intake screen",
  "tide gauge",
];
const WORDS = ["radios", "telemetry links", "uplink modules", "sensor radios", "backhaul radios"];

interface CodeDesign {
  family: string;
  n: number;
  k: number;
}
// Block codes of the sizes radio modules use; the last ones are rate-1/2 codes for soft decision.
const HARD_CODES: CodeDesign[] = [
  { family: "LDPC", n: 648, k: 540 },
  { family: "BCH", n: 1023, k: 923 },
  { family: "polar", n: 1024, k: 768 },
  { family: "polar", n: 1024, k: 901 },
  { family: "LDPC", n: 1944, k: 1620 },
  { family: "LDPC", n: 2048, k: 1536 },
  { family: "LDPC", n: 2048, k: 1792 },
  { family: "BCH", n: 2047, k: 1695 },
  { family: "LDPC", n: 4096, k: 3584 },
  { family: "RS", n: 8160, k: 7136 },
];
const SOFT_CODES: CodeDesign[] = [
  { family: "LDPC", n: 1024, k: 512 },
  { family: "turbo", n: 2048, k: 1024 },
  { family: "LDPC", n: 4096, k: 2048 },
  { family: "polar", n: 2048, k: 1365 },
  { family: "LDPC", n: 8192, k: 6144 },
];
const BSC_POINTS = [5e-4, 1e-3, 1.5e-3, 2e-3, 3e-3, 4e-3, 5e-3, 6e-3, 8e-3, 1e-2, 1.2e-2, 1.5e-2, 2e-2, 2.5e-2];
const AWGN_POINTS = [8, 7, 6.5, 6, 5.5, 5, 4.5, 4, 3.5, 3, 2.5, 2, 1.5, 1];
const WEIGHT_SETS: ScoringWeights[] = [
  { technical: 40, evidence: 15, price: 30, leadTime: 10, warranty: 5 },
  { technical: 45, evidence: 10, price: 30, leadTime: 10, warranty: 5 },
  { technical: 35, evidence: 10, price: 40, leadTime: 10, warranty: 5 },
  { technical: 30, evidence: 20, price: 30, leadTime: 15, warranty: 5 },
];

/** How many of the ordinary tenders end in each state (fractions; drafts take the rest). */
const STATE_SHARES: [TenderState, number][] = [
  ["open", 0.15],
  ["technical", 0.25],
  ["commercial", 0.2],
  ["approval", 0.12],
  ["awarded", 0.13],
  ["cancelled", 0.05],
];

const DAY = 86_400_000;
const HOUR = 3_600_000;

interface Person {
  id: string;
  name: string;
}
interface Cast {
  buyerOrgId: string;
  buyers: Person[];
  engineers: Person[];
  approvers: Person[];
  /** Vendor organisations with their one sales person each. */
  vendors: { orgId: string; user: Person }[];
}

/** The engine's result for each distinct claim, computed once for the whole workload. */
class EngineCache {
  private results = new Map<string, ClaimResult>();
  evaluate(input: Parameters<typeof evaluateClaim>[0]): ClaimResult {
    const key = JSON.stringify(input);
    let result = this.results.get(key);
    if (!result) this.results.set(key, (result = evaluateClaim(input)));
    return result;
  }
  get size() {
    return this.results.size;
  }
}

interface TenderPlan {
  index: number;
  reference: string;
  title: string;
  state: TenderState;
  model: ChannelModel;
  points: OperatingPoint[];
  targetValue: number;
  maxFrameBits: number;
  quantity: number;
  weights: ScoringWeights;
  impossibleRule: "disqualify" | "penalty";
  closesAt: Date;
  invited: Cast["vendors"];
  submitChance: number;
  /** Share of claims marked so far (technical evaluation); 1 once the technical evaluation is signed. */
  markedShare: number;
  buyer: Person;
  engineers: Person[];
  wide: boolean;
}

function planTenders(rng: Rng, cast: Cast, options: ScaleOptions, now: number, demoTenders: number): TenderPlan[] {
  const ordinary = Math.max(0, options.tenders - demoTenders - (options.wide ? 1 : 0));
  const states: TenderState[] = [];
  for (const [state, share] of STATE_SHARES) for (let i = 0; i < Math.round(share * ordinary); i++) states.push(state);
  while (states.length < ordinary) states.push("draft");
  states.length = ordinary;
  // Spread the states over the history instead of in blocks: a fixed shuffle.
  for (let i = states.length - 1; i > 0; i--) {
    const j = rng.int(0, i);
    [states[i], states[j]] = [states[j], states[i]];
  }
  const regular = cast.vendors.slice(0, options.vendors);
  const plans: TenderPlan[] = [];
  const make = (index: number, state: TenderState, wide: boolean): TenderPlan => {
    const model: ChannelModel = wide || rng.chance(0.7) ? "bsc" : "biawgn";
    const palette = model === "bsc" ? BSC_POINTS : AWGN_POINTS;
    const pointCount = wide && options.wide ? options.wide.points : rng.int(6, 14);
    const start = rng.int(0, palette.length - pointCount);
    const points = palette.slice(start, start + pointCount).map((value, i) => ({ label: `Case ${String.fromCharCode(65 + i)}`, value }));
    const closesAt =
      state === "draft"
        ? new Date(now + rng.int(30, 90) * DAY)
        : state === "open"
          ? new Date(now + rng.int(3, 40) * DAY)
          : state === "technical"
            ? new Date(now - rng.int(1, 20) * DAY - rng.int(0, 23) * HOUR)
            : new Date(now - rng.int(25, 700) * DAY);
    const invited =
      wide && options.wide
        ? cast.vendors.slice(0, options.wide.offers)
        : [...regular].sort(() => rng.next() - 0.5).slice(0, rng.int(Math.min(16, regular.length), Math.min(30, regular.length)));
    const year = 2024 + Math.floor(index / 70);
    const asset = rng.pick(ASSETS);
    return {
      index,
      reference: `RC-${year}-${String(100 + (index % 70)).padStart(3, "0")}`,
      title: wide ? "Framework: telemetry radios for every works" : `${asset[0].toUpperCase()}${asset.slice(1)} ${rng.pick(WORDS)}, lot ${rng.int(1, 9)}`,
      state,
      model,
      points,
      targetValue: model === "bsc" ? rng.pick([1e-4, 1e-5]) : rng.pick([1e-5, 1e-6]),
      maxFrameBits: rng.pick([2048, 4096, 8192]),
      quantity: rng.pick([200, 500, 800, 1200, 2000, 3000, 4000, 6000, 8000]),
      weights: rng.pick(WEIGHT_SETS),
      impossibleRule: rng.chance(0.7) ? "disqualify" : "penalty",
      closesAt,
      invited,
      submitChance: wide ? 1 : 0.85,
      markedShare: state === "technical" ? rng.pick([0, 0.3, 0.6, 0.9]) : 1,
      buyer: rng.pick(cast.buyers),
      engineers: [cast.engineers[0], ...cast.engineers.slice(1).sort(() => rng.next() - 0.5)].slice(rng.chance(0.85) ? 0 : 1).slice(0, 2),
      wide,
    };
  };
  for (let i = 0; i < ordinary; i++) plans.push(make(i, states[i], false));
  if (options.wide) plans.push(make(ordinary, "commercial", true));
  return plans;
}

/** An offer from a vendor for a tender: a code that fits its frames, one claim per point. */
function offerFor(rng: Rng, plan: TenderPlan, vendor: Cast["vendors"][number], vendorIndex: number, version: number): OfferInput {
  const codes = (plan.model === "bsc" ? HARD_CODES : SOFT_CODES).filter((c) => c.n <= plan.maxFrameBits);
  // A few vendors overstate: a code rate close to 1 claimed to meet the target everywhere.
  const bold = rng.chance(0.12);
  const code = bold ? { family: "LDPC", n: Math.min(2048, plan.maxFrameBits), k: Math.round(Math.min(2048, plan.maxFrameBits) * 0.95) } : rng.pick(codes);
  const metric = plan.model === "bsc" ? "bler" : "ber";
  const claimed = bold ? plan.targetValue / 100 : rng.pick([plan.targetValue, plan.targetValue / 10]);
  const price = Math.round((28 + rng.next() * 30) * 100) / 100;
  const stem = VENDOR_STEMS[vendorIndex % VENDOR_STEMS.length] ?? "Module";
  return {
    moduleName: `${stem.split(" ")[0]} ${code.family}-${code.n}${version > 1 ? " rev B" : ""}`,
    partNumber: `${stem.slice(0, 3).toUpperCase()}-${code.n}-${code.k}${version > 1 ? "-B" : ""}`,
    code: { family: code.family, decision: plan.model === "bsc" ? "hard" : "soft", n: code.n, k: code.k, rate: null, overhead: null },
    claims: plan.points.map((_, pointIndex) => ({ pointIndex, metric, value: claimed, ncgOutputBer: null })),
    envelope: {
      unitPrice: price,
      currency: "EUR",
      leadTimeWeeks: rng.int(4, 20),
      warrantyMonths: rng.pick([12, 24, 36, 60]),
      priceBreaks: rng.chance(0.5) ? [{ minQuantity: 1000, unitPrice: Math.round(price * 95) / 100 }] : [],
    },
  };
}

async function makeCast(db: Db, rng: Rng, options: ScaleOptions): Promise<Cast> {
  const byEmail = async (email: string) => {
    const [u] = await db.select({ id: users.id, name: users.name, organisationId: users.organisationId }).from(users).where(eq(users.email, email));
    if (!u) throw new Error(`the demo account ${email} is missing: reset the database (npm run db:reset) and run the seed again`);
    return u;
  };
  const buyer = await byEmail("buyer@tarnwell.example");
  const cast: Cast = {
    buyerOrgId: buyer.organisationId,
    buyers: [buyer],
    engineers: [await byEmail("engineer@tarnwell.example")],
    approvers: [await byEmail("approver@tarnwell.example"), await byEmail("director@tarnwell.example")],
    vendors: [],
  };
  for (const email of ["sales@kestrelink.example", "offers@marram.example", "bids@oxbow.example", "tenders@quillfield.example"]) {
    const u = await byEmail(email);
    cast.vendors.push({ orgId: u.organisationId, user: u });
  }
  const totalVendors = Math.max(options.vendors, options.wide?.offers ?? 0);
  const person = (i: number) => `${GIVEN[i % GIVEN.length]} ${FAMILY[(i * 7 + 3) % FAMILY.length]}`;
  let serial = 0;
  // One connection on PGlite: everything inside the transaction goes through tx.
  const admin = await byEmail("admin@tarnwell.example");
  await db.transaction(async (tx) => {
    const adminActor = { id: admin.id, label: admin.name };
    const internal: { roles: RoleName[]; limit?: number; into: Person[] }[] = [
      { roles: ["buyer"], into: cast.buyers },
      { roles: ["buyer"], into: cast.buyers },
      { roles: ["engineer"], into: cast.engineers },
      { roles: ["engineer"], into: cast.engineers },
      { roles: ["engineer"], into: cast.engineers },
      { roles: ["approver"], limit: 500_000, into: cast.approvers },
      { roles: ["approver"], limit: 5_000_000, into: cast.approvers },
    ];
    for (const p of internal) {
      const name = person(serial++);
      const email = `${name.toLowerCase().replace(/[^a-z]+/g, ".")}@tarnwell.example`;
      const user = await insertUser(tx, {
        name,
        email,
        password: DEMO_PASSWORD,
        organisationId: cast.buyerOrgId,
        roles: p.roles,
        approvalLimit: p.limit ?? null,
      });
      await appendLedger(tx, { actor: adminActor, action: "user.created", subjectType: "User", subjectId: user.id, data: { email, roles: p.roles } });
      p.into.push({ id: user.id, name });
    }
    for (let i = cast.vendors.length; i < totalVendors; i++) {
      const stem = VENDOR_STEMS[i - 4] ?? `Vendor ${i}`;
      const orgName = `${stem} ${VENDOR_KINDS[i % VENDOR_KINDS.length]}`;
      const [org] = await tx
        .insert(organisations)
        .values({ name: orgName, kind: "vendor", country: rng.pick(COUNTRIES) })
        .returning();
      await appendLedger(tx, {
        actor: adminActor,
        action: "organisation.created",
        subjectType: "Organisation",
        subjectId: org.id,
        data: { name: orgName, kind: "vendor" },
      });
      const name = person(serial++);
      const email = `sales@${stem.toLowerCase().replace(/[^a-z]+/g, "")}.example`;
      const user = await insertUser(tx, { name, email, password: DEMO_PASSWORD, organisationId: org.id, roles: ["vendor"] });
      await appendLedger(tx, { actor: adminActor, action: "user.created", subjectType: "User", subjectId: user.id, data: { email, roles: ["vendor"] } });
      cast.vendors.push({ orgId: org.id, user: { id: user.id, name } });
    }
  });
  options.log(
    `people: ${cast.buyers.length} buyers, ${cast.engineers.length} engineers, ${cast.approvers.length} approvers, ${cast.vendors.length} vendor organisations`,
  );
  return cast;
}

/**
 * A tender's marks and ledger entries, written in a few multi-row statements: the entries through
 * appendLedgerMany, chained in the order they were added. Flushed before any app function that
 * appends on its own, so the chain keeps the order in which things happened.
 */
class Batch {
  entries: LedgerInput[] = [];
  marks: (typeof marks.$inferInsert)[] = [];
  /** Each claim's latest mark so far. */
  latest = new Map<string, { mark: MarkKind; comment: string }>();
  constructor(readonly tx: Queryable) {}
  async flush() {
    for (let i = 0; i < this.marks.length; i += 500) await this.tx.insert(marks).values(this.marks.slice(i, i + 500));
    await appendLedgerMany(this.tx, this.entries);
    this.marks = [];
    this.entries = [];
  }
}

async function declare(batch: Batch, tenderId: string, who: Person, at: Date) {
  const statement = "I have no financial, family or past employment ties to any vendor invited to this tender.";
  const [row] = await batch.tx.insert(declarations).values({ tenderId, userId: who.id, conflictedOrgIds: [], statement, createdAt: at }).returning();
  batch.entries.push({
    tenderId,
    actor: { id: who.id, label: who.name },
    action: "declaration.made",
    subjectType: "Declaration",
    subjectId: row.id,
    data: { conflicts: [], statement },
  });
}

type ClaimRow = typeof claims.$inferSelect;

/** One engineer's mark on a claim, with its ledger entry, at a given time (the latest mark counts). */
function mark(batch: Batch, claim: ClaimRow, vendorName: string, by: Person, kind: MarkKind, comment: string, at: Date) {
  batch.marks.push({ claimId: claim.id, tenderId: claim.tenderId, vendorOrgId: claim.vendorOrgId, mark: kind, comment, markedBy: by.id, markedAt: at });
  batch.latest.set(claim.id, { mark: kind, comment });
  batch.entries.push({
    tenderId: claim.tenderId,
    actor: { id: by.id, label: by.name },
    action: "claim.marked",
    subjectType: "Claim",
    subjectId: claim.id,
    data: { mark: kind, comment, vendor: vendorName, point: claim.pointLabel },
  });
}

/** A lab run on a claim at its own channel condition: verifying (error-free long enough) or contradicting. */
async function labRun(batch: Batch, claim: ClaimRow, model: ChannelModel, by: Person, verify: boolean) {
  const rate = claim.value;
  const run = verify
    ? {
        channelValue: claim.channelValue,
        unit: unitForMetric(claim.metric),
        trials: Math.ceil(4 / rate),
        errors: 0,
        confidence: 0.95,
        note: "Bench run at the stated condition.",
      }
    : {
        channelValue: claim.channelValue,
        unit: unitForMetric(claim.metric),
        trials: Math.ceil(10 / rate),
        errors: 100,
        confidence: 0.95,
        note: "Bench run at the stated condition: far more errors than claimed.",
      };
  const assessed = assessRun({ ...claim, channelModel: model }, run);
  if (!assessed.ok) throw new Error(`scale seed: a lab run was refused: ${assessed.message}`);
  const stored = await insertEvidenceRun(batch.tx, claim, run, assessed, { userId: by.id, source: "manual" });
  batch.entries.push({
    tenderId: claim.tenderId,
    actor: { id: by.id, label: by.name },
    action: "evidence.recorded",
    subjectType: "EvidenceRun",
    subjectId: stored.id,
    data: { claimId: claim.id, unit: run.unit, trials: run.trials, errors: run.errors, confidence: run.confidence, status: stored.status },
  });
  return stored.status;
}

/** A question to the vendor about a claim (opened the app's way), answered by the vendor. */
async function question(batch: Batch, claim: ClaimRow, asker: Viewer, vendor: Person, answer: boolean) {
  // insertThread appends its own entry: what came before goes first.
  await batch.flush();
  const { tx } = batch;
  const thread = await insertThread(tx, asker, claim, {
    subject: `Test conditions at ${claim.pointLabel}`,
    body: "Please state the decoder iterations and the frame count behind this figure.",
  });
  if (!answer) return;
  const body = "Fifty decoder iterations, measured over ten million frames at the stated condition.";
  // The answer comes after the question: its own timestamp, not the transaction's.
  await tx
    .insert(threadMessages)
    .values({ threadId: thread.id, authorId: vendor.id, authorLabel: `${vendor.name}`, body, createdAt: new Date(Date.now() + 1000) });
  batch.entries.push({
    tenderId: claim.tenderId,
    actor: { id: vendor.id, label: vendor.name },
    action: "thread.message",
    subjectType: "Thread",
    subjectId: thread.id,
    data: { from: "vendor", length: body.length },
  });
}

/**
 * One tender up to technical evaluation in one transaction: the tender, its invitations and
 * opening, offers (some resubmitted), closing (the app's closeDueTenders), declarations, marks,
 * lab runs and questions. Later steps (signature, envelopes, recommendation, approvals,
 * cancellation) go through the app's own functions afterwards, each in its own transaction.
 */
async function buildTender(db: Db, rng: Rng, engine: EngineCache, cast: Cast, plan: TenderPlan, options: ScaleOptions, now: number): Promise<string> {
  const openedAt = new Date(plan.closesAt.getTime() - 30 * DAY);
  const tenderId = await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(tenders)
      .values({
        reference: plan.reference,
        title: plan.title,
        description: `Invented workload tender ${plan.index + 1}: ${plan.points.length} operating points, ${plan.invited.length} invited vendors.`,
        state: "draft",
        channelModel: plan.model,
        operatingPoints: plan.points,
        targetMetric: plan.model === "bsc" ? "bler" : "ber",
        targetValue: plan.targetValue,
        maxFrameBits: plan.maxFrameBits,
        quantity: plan.quantity,
        currency: "EUR",
        weights: plan.weights,
        impossibleRule: plan.impossibleRule,
        impossiblePenalty: plan.impossibleRule === "penalty" ? 20 : 0,
        closesAt: plan.closesAt,
        closesZone: "Europe/London",
        createdBy: plan.buyer.id,
      })
      .returning();
    const buyer = { id: plan.buyer.id, label: plan.buyer.name };
    const entry = (action: string, data: Record<string, unknown>) =>
      appendLedger(tx, { tenderId: row.id, actor: buyer, action, subjectType: "Tender", subjectId: row.id, data });
    await entry("tender.created", { reference: row.reference });
    if (plan.state === "draft") return row.id;

    await tx.insert(tenderInvitations).values(plan.invited.map((v) => ({ tenderId: row.id, organisationId: v.orgId })));
    await tx.update(tenders).set({ state: "open", openedAt }).where(eq(tenders.id, row.id));
    await entry("tender.opened", { reference: row.reference, invited: plan.invited.length });
    const [tender] = await tx.select().from(tenders).where(eq(tenders.id, row.id));

    for (const [i, vendor] of plan.invited.entries()) {
      if (!rng.chance(plan.submitChance)) continue;
      const versions = plan.wide ? 1 : rng.chance(0.18) ? 2 : 1;
      for (let version = 1; version <= versions; version++) {
        const input = offerFor(rng, plan, vendor, cast.vendors.indexOf(vendor), version);
        const prepared = prepareOffer(tender, input);
        if (!prepared.ok) throw new Error(`scale seed: an offer does not fit ${plan.reference}: ${JSON.stringify(prepared.fieldErrors)}`);
        const evaluated = prepared.claims.map((item) => evaluatedClaim(item, engine.evaluate(item.input)));
        const at = new Date(openedAt.getTime() + (i + 1) * HOUR + version * DAY);
        await writeOfferVersion(tx, {
          tender,
          vendorOrgId: vendor.orgId,
          actor: { id: vendor.user.id, label: vendor.user.name },
          input,
          claims: evaluated,
          at,
        });
      }
    }
    if (plan.state === "open") return row.id;

    // Closing is the app's: the tender passed its closing time, and the next read closes it.
    await closeDueTenders(tx, new Date(Math.max(plan.closesAt.getTime() + 1, Math.min(now, plan.closesAt.getTime() + HOUR))));
    if (plan.state === "cancelled") return row.id;

    let clock = plan.closesAt.getTime() + HOUR;
    const tick = () => new Date((clock += rng.int(2, 30) * 60_000));
    const batch = new Batch(tx);
    for (const e of plan.engineers) await declare(batch, row.id, e, tick());
    const claimRows = await tx
      .select({ claim: claims, vendorName: organisations.name })
      .from(claims)
      .innerJoin(offers, eq(offers.id, claims.offerId))
      .innerJoin(organisations, eq(organisations.id, claims.vendorOrgId))
      .where(and(eq(claims.tenderId, row.id), eq(offers.status, "submitted")))
      // Names break ties of submission time: ids are random, and the PRNG must meet the claims in one order.
      .orderBy(asc(offers.submittedAt), asc(organisations.name), asc(claims.pointIndex));
    const first = plan.engineers[0];
    const second = plan.engineers[1] ?? first;
    const askers = new Map<string, Viewer>();
    const asker = async (p: Person) => askers.get(p.id) ?? askers.set(p.id, await viewerOf(tx, p.id)).get(p.id)!;
    const settled = plan.markedShare >= 1;
    for (const { claim, vendorName } of claimRows) {
      if (!rng.chance(plan.markedShare)) continue;
      const vendor = cast.vendors.find((v) => v.orgId === claim.vendorOrgId)!.user;
      const reviewer = rng.chance(0.5) ? first : second;
      if (claim.verdict === "impossible") {
        if (rng.chance(0.1)) {
          mark(batch, claim, vendorName, reviewer, "clarification-requested", "Please state the test conditions behind this figure.", tick());
          await question(batch, claim, await asker(reviewer), vendor, settled || rng.chance(0.5));
          if (!settled && rng.chance(0.5)) continue;
        }
        mark(batch, claim, vendorName, reviewer, "rejected-impossible", "The claim lies beyond the converse bound at this operating point.", tick());
      } else if (claim.verdict === "needs-evidence") {
        mark(batch, claim, vendorName, reviewer, "evidence-requested", "The claim sits between the bounds: lab error counts are needed.", tick());
        if (!settled && rng.chance(0.4)) continue;
        const status = await labRun(batch, claim, plan.model, reviewer, rng.chance(0.8));
        const final: MarkKind = status === "contradicted" ? "rejected-impossible" : "accepted";
        mark(batch, claim, vendorName, reviewer, final, final === "accepted" ? "" : "The lab run contradicts the claim.", tick());
      } else {
        if (rng.chance(0.08)) {
          mark(batch, claim, vendorName, reviewer, "clarification-requested", "Please state the decoder and the frame count behind this figure.", tick());
          await question(batch, claim, await asker(reviewer), vendor, settled || rng.chance(0.5));
          if (!settled && rng.chance(0.5)) continue;
        }
        if (rng.chance(0.25)) await labRun(batch, claim, plan.model, reviewer, true);
        mark(batch, claim, vendorName, reviewer, "accepted", "", tick());
      }
      // A second engineer's own look: every mark is kept, the latest counts, so it repeats the first.
      if (settled && reviewer !== (reviewer === first ? second : first) && rng.chance(options.secondOpinion)) {
        const latest = batch.latest.get(claim.id)!;
        mark(batch, claim, vendorName, reviewer === first ? second : first, latest.mark, latest.comment ? `Confirmed: ${latest.comment}` : "", tick());
      }
    }
    await batch.flush();
    return row.id;
  });

  // The steps after the technical evaluation, through the app's own functions and rules.
  const as = (p: Person) => viewerOf(db, p.id);
  if (plan.state === "cancelled") {
    await cancelTender(await as(plan.buyer), tenderId, { reason: "The works programme was deferred by a year; the need will be tendered again." });
    return tenderId;
  }
  if (plan.state === "technical" || plan.state === "draft" || plan.state === "open") return tenderId;
  await signTechnical(await as(plan.engineers[0]), tenderId, { statement: "Every claim is marked and every question answered." });
  if (plan.state === "commercial" && !plan.wide && rng.chance(0.5)) return tenderId;
  await openEnvelopes(await as(plan.buyer), tenderId);
  if (plan.state === "commercial") return tenderId;

  // The buyer and the approvers declare before they read the recommendation.
  await db.transaction(async (tx) => {
    const batch = new Batch(tx);
    const at = new Date();
    await declare(batch, tenderId, plan.buyer, at);
    for (const a of cast.approvers) await declare(batch, tenderId, a, at);
    await batch.flush();
  });
  const buyer = await as(plan.buyer);
  const comparison = await getComparison(buyer, tenderId);
  const best = [...comparison.sheet.offers]
    .filter((o) => !o.disqualified && !o.needsConversion && o.rank !== null)
    .sort((a, b) => (a.rank ?? 0) - (b.rank ?? 0))[0];
  if (!best) return tenderId; // nobody to recommend: the tender stays in commercial evaluation
  const envelope = comparison.input.offers.find((o) => o.id === best.offerId)?.envelope;
  if (!envelope) throw new Error(`scale seed: no envelope for the best offer of ${plan.reference}`);
  const value = totalPriceAt(envelope.unitPrice, envelope.priceBreaks, plan.quantity);
  await submitRecommendation(buyer, tenderId, {
    offerId: best.offerId,
    quantity: plan.quantity,
    value,
    justification: `${best.vendorName} ranks first on the weighted score with every claim settled.`,
  } as Parameters<typeof submitRecommendation>[2]);
  if (plan.state === "approval") return tenderId;
  // Approvers by rising limit until the award is made; the app refuses anyone the band excludes.
  for (const a of [...cast.approvers].reverse()) {
    const outcome = await decideRecommendation(await as(a), tenderId, { decision: "approve", comment: "Within budget and the evaluation is complete." }).catch(
      (error: unknown) => {
        if (error instanceof Error && /limit|band|already/i.test(error.message)) return null;
        throw error;
      },
    );
    if (outcome?.kind === "awarded") break;
  }
  return tenderId;
}

async function countOf(db: Db, table: PgTable) {
  const [row] = await db.select({ n: count() }).from(table);
  return Number(row.n);
}

/** Fills the process's database (the demo first, when it is empty) with the scale workload. */
export async function seedScale(partial: Partial<ScaleOptions> = {}): Promise<ScaleReport> {
  const options = { ...FULL_SCALE, ...partial };
  const t0 = performance.now();
  const db = await getDb();
  await seedDemoData(db);
  // The demo's tenders are RC-2027-…; the workload's are numbered in 2026: anything else means a used database.
  const [{ n: existing }] = await db.select({ n: count() }).from(tenders).where(notLike(tenders.reference, "RC-2027-%"));
  if (Number(existing) > 0)
    throw new Error(
      `The database holds ${existing} tenders besides the demo: the scale seed fills a fresh demo database. Stop the server, run npm run db:reset, then npm run seed:scale.`,
    );
  const rng = prng(options.seed);
  const cast = await makeCast(db, rng, options);
  const now = Date.now();
  const [{ n: demoTenders }] = await db.select({ n: count() }).from(tenders);
  const plans = planTenders(rng, cast, options, now, Number(demoTenders));
  const engine = new EngineCache();
  let wideTenderId: string | null = null;
  for (const [i, plan] of plans.entries()) {
    const id = await buildTender(db, rng, engine, cast, plan, options, now);
    if (plan.wide) wideTenderId = id;
    if ((i + 1) % 10 === 0 || i === plans.length - 1) options.log(`tenders ${i + 1}/${plans.length} (${((performance.now() - t0) / 1000).toFixed(0)} s)`);
  }
  await checkpointNow(db, "schedule");
  options.log("counting what was written");
  const states = await db.select({ state: tenders.state, n: count() }).from(tenders).groupBy(tenders.state);
  const { evidenceRuns, ledgerEntries, userRoles } = await import("./schema");
  const vendorOrgs = await db.select({ n: count() }).from(organisations).where(eq(organisations.kind, "vendor"));
  const people = await db
    .select({ n: count() })
    .from(users)
    .where(inArray(users.id, db.select({ id: userRoles.userId }).from(userRoles)));
  return {
    tenders: states.reduce((s, r) => s + Number(r.n), 0),
    byState: Object.fromEntries(states.map((r) => [r.state, Number(r.n)])),
    vendorOrganisations: Number(vendorOrgs[0].n),
    people: Number(people[0].n),
    offers: await countOf(db, offers),
    claims: await countOf(db, claims),
    marks: await countOf(db, marks),
    evidenceRuns: await countOf(db, evidenceRuns),
    threads: await countOf(db, threads),
    ledgerEntries: await countOf(db, ledgerEntries),
    wideTenderId,
    distinctEngineInputs: engine.size,
    seconds: (performance.now() - t0) / 1000,
  };
}
