// Each Desk section reads only the tenders it shows: the first few, in the Tenders list's order,
// and a count of the rest with a link to the list. Against a real in-memory database, with more
// tenders in several states than a section shows.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import { tenderInvitations, tenders } from "@/db/schema";
import { DESK_SECTION_LIMIT, getDesk } from "@/lib/server/desk";
import { requireViewer } from "@/lib/server/session";
import { listTenders } from "@/lib/server/tenders";
import type { TenderState } from "@/policies/vocabulary";
import { closeDb, freshDatabase, signInAs } from "../support/app";

let db: Db;
const viewerOf = async (email: string) => requireViewer(await signInAs(email));

/** Copies of a demo tender of the demo buyer, in `state`, each newer than the last, inviting the same organisations. */
async function copies(state: TenderState, n: number, prefix: string) {
  const [model] = await db.select().from(tenders).where(eq(tenders.state, "open")).limit(1);
  const invited = await db.select().from(tenderInvitations).where(eq(tenderInvitations.tenderId, model.id));
  for (let i = 0; i < n; i++) {
    const { id: _id, ...rest } = model;
    const [row] = await db
      .insert(tenders)
      .values({ ...rest, state, reference: `${prefix}-${i}`, createdAt: new Date(Date.now() + i * 1000), closesAt: new Date(Date.now() + 30 * 86_400_000) })
      .returning();
    if (invited.length) await db.insert(tenderInvitations).values(invited.map((v) => ({ ...v, tenderId: row.id })));
  }
}

beforeAll(async () => {
  db = await freshDatabase();
  await copies("draft", DESK_SECTION_LIMIT + 3, "DESK-DRAFT");
  await copies("open", DESK_SECTION_LIMIT + 1, "DESK-OPEN");
  await copies("technical", 4, "DESK-TECH");
});
afterAll(closeDb);

const CASES: { email: string; title: string; states: TenderState[]; mine?: boolean }[] = [
  { email: "buyer@tarnwell.example", title: "Drafts to finish and open", states: ["draft"], mine: true },
  { email: "buyer@tarnwell.example", title: "Open for offers", states: ["open"] },
  { email: "engineer@tarnwell.example", title: "Technical evaluations to review", states: ["technical"] },
  { email: "bids@oxbow.example", title: "Tenders you are invited to", states: ["open"] },
  { email: "bids@oxbow.example", title: "Under evaluation or decided", states: ["technical", "commercial", "approval", "awarded"] },
  { email: "admin@tarnwell.example", title: "Tenders in progress", states: ["open", "technical", "commercial", "approval"] },
];

describe("a Desk section", () => {
  it("with more than it shows says how many more there are and links to the Tenders list", async () => {
    const buyer = await viewerOf("buyer@tarnwell.example");
    const drafts = (await getDesk(buyer)).find((s) => s.title === "Drafts to finish and open")!;
    const all = await listTenders(buyer, and(eq(tenders.state, "draft"), eq(tenders.createdBy, buyer.actor.id)));
    expect(all.length).toBeGreaterThan(DESK_SECTION_LIMIT);
    expect(drafts.tenders).toHaveLength(DESK_SECTION_LIMIT);
    expect(drafts.more).toEqual({ count: all.length - DESK_SECTION_LIMIT, href: "/tenders?state=draft" });
  });

  it("shows the same tenders, in the same order, as the whole list of its states cut at the limit", async () => {
    for (const c of CASES) {
      const viewer = await viewerOf(c.email);
      const section = (await getDesk(viewer)).find((s) => s.title === c.title);
      const where = and(inArray(tenders.state, c.states), c.mine ? eq(tenders.createdBy, viewer.actor.id) : undefined);
      const all = await listTenders(viewer, where);
      expect(
        section?.tenders.map((t) => t.reference),
        c.title,
      ).toEqual(all.slice(0, DESK_SECTION_LIMIT).map((t) => t.reference));
      const more =
        all.length > DESK_SECTION_LIMIT
          ? { count: all.length - DESK_SECTION_LIMIT, href: c.states.length === 1 ? `/tenders?state=${c.states[0]}` : "/tenders" }
          : undefined;
      expect(section?.more, c.title).toEqual(more);
    }
  });
});
