import { index, primaryKey, text, pgTable, timestamp } from "drizzle-orm/pg-core";
import { tenderRef, vendorRef } from "./refs";
import { id, createdAt } from "./columns";
import { users } from "./people";
import { threads } from "./evaluation";

/** A vendor's written objection to an award, lodged during the standstill period. */
export const objections = pgTable(
  "objections",
  {
    id: id(),
    tenderId: tenderRef(),
    vendorOrgId: vendorRef(),
    body: text("body").notNull(),
    lodgedBy: text("lodged_by")
      .notNull()
      .references(() => users.id),
    lodgedAt: createdAt(),
    /** The buying team's written answer, sent to the vendor; until then the objection waits on the buyer's Desk. */
    answer: text("answer"),
    answeredBy: text("answered_by").references(() => users.id),
    answeredAt: timestamp("answered_at", { withTimezone: true }),
  },
  (t) => [index("objections_tender_idx").on(t.tenderId)],
);

/** A clarification that matters to every bidder, published to all invited vendors without the asker's name. */
export const addenda = pgTable(
  "addenda",
  {
    id: id(),
    tenderId: tenderRef(),
    /** The thread it answers, if any; never shown to vendors (it would name the asker). */
    threadId: text("thread_id").references(() => threads.id),
    title: text("title").notNull(),
    body: text("body").notNull(),
    publishedBy: text("published_by")
      .notNull()
      .references(() => users.id),
    publishedAt: createdAt(),
  },
  (t) => [index("addenda_tender_idx").on(t.tenderId)],
);

/** A vendor organisation's acknowledgement of an addendum: needed before it submits. */
export const addendumAcknowledgements = pgTable(
  "addendum_acknowledgements",
  {
    addendumId: text("addendum_id")
      .notNull()
      .references(() => addenda.id),
    vendorOrgId: vendorRef(),
    acknowledgedBy: text("acknowledged_by")
      .notNull()
      .references(() => users.id),
    acknowledgedAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.addendumId, t.vendorOrgId] })],
);
