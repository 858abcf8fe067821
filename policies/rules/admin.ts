import type { Actor } from "../actor";
import type { RuleBuilder } from "../types";
import { READ } from "./shared";

/** People, organisations and the approval-limit table; the ledger; backups; no award decisions. */
export function adminRules({ can, cannot }: RuleBuilder, actor: Actor): void {
  can("manage", ["User", "Organisation", "ApprovalLimit"]);
  cannot("delete", ["User", "Organisation"]).because("People and organisations stay in the record: deactivate them instead");
  cannot(["assignRoles", "deactivate"], "User", { id: actor.id }).because("Another admin changes your own roles or deactivates you");
  // The ledger is shown on the tender page, so the tender itself is readable too.
  can([...READ], ["Ledger", "Tender"]);
  // A full re-verification of the whole chain, batch by batch (the Ledger check page).
  can("verify", "Ledger");
  can("use", "Mailroom");
  can("create", "Backup");
}
