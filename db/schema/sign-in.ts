import { bigint, index, integer, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { id } from "./columns";

// Sign-in protection, shared by every server instance on one database (lib/server/sign-in-guard.ts).

/** One failed sign-in: kept 24 hours, never in the ledger. `device` is set when a trusted-device cookie came with it. */
export const signInFailures = pgTable(
  "sign_in_failures",
  {
    id: id(),
    email: text("email").notNull(),
    address: text("address").notNull(),
    device: text("device"),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("sign_in_failures_email_idx").on(t.email, t.at), index("sign_in_failures_at_idx").on(t.at)],
);

/** Request counters per key (client address and path) for fixed windows; rows of past windows are pruned. */
export const rateLimits = pgTable("rate_limits", {
  key: text("key").primaryKey(),
  count: integer("count").notNull(),
  windowStart: bigint("window_start", { mode: "number" }).notNull(),
});
