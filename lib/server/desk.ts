import "server-only";
import { getDb } from "./database";
import { ne } from "drizzle-orm";
import { tenders } from "@/db/schema";
import { stuckRecommendations } from "./approval-coverage";
import { waitingObjections } from "./objections";
import type { Viewer } from "./session";
import { listTenders, type TenderWithInvites } from "./tenders";

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

export function capped(section: DeskSection, states: string[]): DeskSection {
  if (section.tenders.length <= DESK_SECTION_LIMIT) return section;
  const href = states.length === 1 ? `/tenders?state=${states[0]}` : "/tenders";
  return { ...section, tenders: section.tenders.slice(0, DESK_SECTION_LIMIT), more: { count: section.tenders.length - DESK_SECTION_LIMIT, href } };
}

/** Recommendations nobody can finish approving, for the people who can free them (buyers withdraw, admins raise limits). */
async function stuckSection(visible: TenderWithInvites[], tab: DeskSection["tab"]): Promise<DeskSection> {
  const stuck = await stuckRecommendations(await getDb());
  const ids = new Set(stuck.map((s) => s.tenderId));
  return {
    title: "Recommendations that cannot be approved",
    empty: "Every recommendation in approval can get the approvals it needs.",
    tenders: visible.filter((t) => ids.has(t.id)),
    tab,
    notes: Object.fromEntries(stuck.map((s) => [s.tenderId, s.problem])),
  };
}

/** Vendors' objections lodged during the standstill period and not yet answered, on the tenders given. */
async function objectionsSection(tenders: TenderWithInvites[]): Promise<DeskSection> {
  const waiting = await waitingObjections(tenders.map((t) => t.id));
  const plural = (n: number) => (n === 1 ? "1 objection waits" : `${n} objections wait`);
  return {
    title: "Objections to answer",
    empty: "No objection waits for an answer.",
    tenders: tenders.filter((t) => waiting.has(t.id)),
    tab: "notices",
    notes: Object.fromEntries([...waiting].map(([id, n]) => [id, `${plural(n)} for a written answer before the standstill period ends.`])),
  };
}

/** What waits for the signed-in person, one section per role they hold. */
export async function getDesk(viewer: Viewer): Promise<DeskSection[]> {
  const roles = viewer.actor.roles;
  const visible = viewer.ability.can("read", "Tender") ? await listTenders(viewer, ne(tenders.state, "cancelled")) : [];
  const inState = (...states: string[]) => visible.filter((t) => states.includes(t.state));
  const sections: DeskSection[] = [];
  if (roles.includes("buyer")) sections.push(await stuckSection(visible, "sign-off"));
  else if (roles.includes("admin")) sections.push(await stuckSection(visible, ""));
  // The buyer of the tender (its author) answers; an admin sees every one that waits.
  if (roles.includes("admin")) sections.push(await objectionsSection(visible));
  else if (roles.includes("buyer")) sections.push(await objectionsSection(visible.filter((t) => t.createdBy === viewer.actor.id)));
  if (roles.includes("buyer")) {
    sections.push(
      capped({ title: "Drafts to finish and open", empty: "No drafts.", tenders: inState("draft").filter((t) => t.createdBy === viewer.actor.id), tab: "" }, [
        "draft",
      ]),
    );
    sections.push(capped({ title: "Open for offers", empty: "No tender is open.", tenders: inState("open"), tab: "" }, ["open"]));
    sections.push(
      capped({ title: "Ready for commercial evaluation", empty: "Nothing to compare yet.", tenders: inState("commercial"), tab: "comparison" }, ["commercial"]),
    );
  }
  if (roles.includes("engineer")) {
    sections.push(
      capped({ title: "Technical evaluations to review", empty: "No tender is in technical evaluation.", tenders: inState("technical"), tab: "review" }, [
        "technical",
      ]),
    );
  }
  if (roles.includes("approver")) {
    sections.push(
      capped({ title: "Recommendations awaiting approval", empty: "No recommendation waits for you.", tenders: inState("approval"), tab: "sign-off" }, [
        "approval",
      ]),
    );
  }
  if (roles.includes("vendor")) {
    sections.push(capped({ title: "Tenders you are invited to", empty: "No open invitation.", tenders: inState("open"), tab: "offer" }, ["open"]));
    sections.push(
      capped(
        {
          title: "Under evaluation or decided",
          empty: "Nothing under evaluation.",
          tenders: inState("technical", "commercial", "approval", "awarded"),
          tab: "",
        },
        ["technical", "commercial", "approval", "awarded"],
      ),
    );
  }
  if (roles.includes("admin")) {
    sections.push(
      capped({ title: "Tenders in progress", empty: "No tender in progress.", tenders: inState("open", "technical", "commercial", "approval"), tab: "" }, [
        "open",
        "technical",
        "commercial",
        "approval",
      ]),
    );
  }
  return sections;
}
