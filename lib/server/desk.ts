import "server-only";
import { getDb, type Queryable } from "./database";
import { and, count, eq, exists, inArray, isNull, ne, type SQL } from "drizzle-orm";
import { objections, tenders } from "@/db/schema";
import { stuckRecommendations } from "./approval-coverage";
import { waitingObjections } from "./objections";
import type { TenderState } from "@/policies/vocabulary";
import type { Viewer } from "./session";
import { closeDueTenders, readableTenders, tenderSubject, tendersWhere, type TenderWithInvites } from "./tenders";

export interface DeskSection {
  title: string;
  empty: string;
  tenders: TenderWithInvites[];
  /** The tab of the tender page where the work waits ("" for Requirements). */
  tab: "" | "offer" | "review" | "comparison" | "sign-off" | "notices";
  /** A line under a tender saying what blocks it, by tender id. */
  notes?: Record<string, string>;
  /** Set when the section holds more than the Desk shows: how many more, and the list that has them all. */
  more?: { count: number; href: string };
}

/** The Desk shows the first few of each section; the Tenders list pages through the rest. */
export const DESK_SECTION_LIMIT = 8;

/** The first DESK_SECTION_LIMIT tenders of a section, and a link to the list when it holds `total` (more). */
export function capped(section: DeskSection, states: string[], total = section.tenders.length): DeskSection {
  if (total <= DESK_SECTION_LIMIT) return section;
  const href = states.length === 1 ? `/tenders?state=${states[0]}` : "/tenders";
  return { ...section, tenders: section.tenders.slice(0, DESK_SECTION_LIMIT), more: { count: total - DESK_SECTION_LIMIT, href } };
}

/** What the Desk reads: the viewer's readable tenders as SQL, or nothing at all for one who reads no tender. */
interface DeskReader {
  db: Queryable;
  viewer: Viewer;
  /** The readable tenders this viewer may see that match `where`, newest first; with `limit`, only that many. */
  tenders(where: SQL | undefined, limit?: number): Promise<TenderWithInvites[]>;
  count(where: SQL | undefined): Promise<number>;
}

async function deskReader(viewer: Viewer): Promise<DeskReader> {
  const db = await getDb();
  if (!viewer.ability.can("read", "Tender")) return { db, viewer, tenders: async () => [], count: async () => 0 };
  await closeDueTenders(db);
  // Cancelled tenders never wait on a Desk; the policies are applied in SQL and each row checked again by CASL.
  const readable = (where: SQL | undefined) => and(readableTenders(viewer), ne(tenders.state, "cancelled"), where);
  return {
    db,
    viewer,
    tenders: async (where, limit) => {
      const rows = await tendersWhere(db, readable(where), limit === undefined ? undefined : { limit, offset: 0 });
      return rows.filter((t) => viewer.ability.can("read", tenderSubject(t)));
    },
    count: async (where) => (await db.select({ n: count() }).from(tenders).where(readable(where)))[0].n,
  };
}

/** A section of the tenders in `states` (and matching `where`): the first few read, the rest only counted. */
async function stateSection(read: DeskReader, section: Omit<DeskSection, "tenders">, states: TenderState[], where?: SQL): Promise<DeskSection> {
  const filter = and(inArray(tenders.state, states), where);
  const first = await read.tenders(filter, DESK_SECTION_LIMIT + 1);
  const total = first.length > DESK_SECTION_LIMIT ? await read.count(filter) : first.length;
  return capped({ ...section, tenders: first }, states, total);
}

/** Recommendations nobody can finish approving, for the people who can free them (buyers withdraw, admins raise limits). */
async function stuckSection(read: DeskReader, tab: DeskSection["tab"]): Promise<DeskSection> {
  const stuck = await stuckRecommendations(read.db);
  return {
    title: "Recommendations that cannot be approved",
    empty: "Every recommendation in approval can get the approvals it needs.",
    tenders: stuck.length ? await read.tenders(inArray(tenders.id, [...new Set(stuck.map((s) => s.tenderId))])) : [],
    tab,
    notes: Object.fromEntries(stuck.map((s) => [s.tenderId, s.problem])),
  };
}

/** Vendors' objections lodged during the standstill period and not yet answered, on the tenders matching `where`. */
async function objectionsSection(read: DeskReader, where?: SQL): Promise<DeskSection> {
  const unanswered = read.db
    .select({ one: objections.id })
    .from(objections)
    .where(and(eq(objections.tenderId, tenders.id), isNull(objections.answeredAt)));
  const candidates = await read.tenders(and(exists(unanswered), where));
  const waiting = await waitingObjections(candidates.map((t) => t.id));
  const plural = (n: number) => (n === 1 ? "1 objection waits" : `${n} objections wait`);
  return {
    title: "Objections to answer",
    empty: "No objection waits for an answer.",
    tenders: candidates.filter((t) => waiting.has(t.id)),
    tab: "notices",
    notes: Object.fromEntries([...waiting].map(([id, n]) => [id, `${plural(n)} for a written answer before the standstill period ends.`])),
  };
}

/** What waits for the signed-in person, one section per role they hold; each section reads only the rows it shows. */
export async function getDesk(viewer: Viewer): Promise<DeskSection[]> {
  const roles = viewer.actor.roles;
  const read = await deskReader(viewer);
  const mine = eq(tenders.createdBy, viewer.actor.id);
  const sections: DeskSection[] = [];
  if (roles.includes("buyer")) sections.push(await stuckSection(read, "sign-off"));
  else if (roles.includes("admin")) sections.push(await stuckSection(read, ""));
  // The buyer of the tender (its author) answers; an admin sees every one that waits.
  if (roles.includes("admin")) sections.push(await objectionsSection(read));
  else if (roles.includes("buyer")) sections.push(await objectionsSection(read, mine));
  if (roles.includes("buyer")) {
    sections.push(await stateSection(read, { title: "Drafts to finish and open", empty: "No drafts.", tab: "" }, ["draft"], mine));
    sections.push(await stateSection(read, { title: "Open for offers", empty: "No tender is open.", tab: "" }, ["open"]));
    sections.push(await stateSection(read, { title: "Ready for commercial evaluation", empty: "Nothing to compare yet.", tab: "comparison" }, ["commercial"]));
  }
  if (roles.includes("engineer")) {
    sections.push(
      await stateSection(read, { title: "Technical evaluations to review", empty: "No tender is in technical evaluation.", tab: "review" }, ["technical"]),
    );
  }
  if (roles.includes("approver")) {
    sections.push(
      await stateSection(read, { title: "Recommendations awaiting approval", empty: "No recommendation waits for you.", tab: "sign-off" }, ["approval"]),
    );
  }
  if (roles.includes("vendor")) {
    sections.push(await stateSection(read, { title: "Tenders you are invited to", empty: "No open invitation.", tab: "offer" }, ["open"]));
    sections.push(
      await stateSection(read, { title: "Under evaluation or decided", empty: "Nothing under evaluation.", tab: "" }, [
        "technical",
        "commercial",
        "approval",
        "awarded",
      ]),
    );
  }
  if (roles.includes("admin")) {
    sections.push(
      await stateSection(read, { title: "Tenders in progress", empty: "No tender in progress.", tab: "" }, ["open", "technical", "commercial", "approval"]),
    );
  }
  return sections;
}
