import { text } from "drizzle-orm/pg-core";
import { organisations } from "./people";
import { tenders } from "./tenders";

/** The tender a row belongs to: every record of a tender's life carries it, for the policies and the ledger. */
export const tenderRef = () =>
  text("tender_id")
    .notNull()
    .references(() => tenders.id);

/** The vendor organisation a row belongs to: what keeps one vendor out of another's records. */
export const vendorRef = () =>
  text("vendor_org_id")
    .notNull()
    .references(() => organisations.id);
