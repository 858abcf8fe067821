import { AbilityBuilder, createMongoAbility } from "@casl/ability";
import { effectiveRoles, type Actor } from "./actor";
import { adminRules } from "./rules/admin";
import { approverRules } from "./rules/approver";
import { buyerRules } from "./rules/buyer";
import { engineerRules } from "./rules/engineer";
import { personalRules } from "./rules/personal";
import { everyoneRules, sealedUntilClosing, signedOutRules } from "./rules/shared";
import { vendorRules } from "./rules/vendor";
import type { AppAbility, RuleBuilder } from "./types";
import type { Role } from "./vocabulary";

type RoleRules = (builder: RuleBuilder, actor: Actor) => void;

/**
 * The order matters, because a later CASL rule overrides an earlier one. Roles grant as a
 * union; the engineer's price ban comes before the buyer's and approver's grants so that a
 * person holding both may read envelopes once opened (after the technical sign-off). The
 * personal restrictions come last and hold whatever roles the person has.
 */
const ROLE_ORDER: readonly [Role, RoleRules][] = [
  ["vendor", vendorRules],
  ["admin", adminRules],
  ["engineer", engineerRules],
  ["approver", approverRules],
  ["buyer", buyerRules],
];

/**
 * The abilities of one request's actor, built from roles and declarations read from the
 * database for that request. null means signed out.
 */
export function defineAbilityFor(actor: Actor | null): AppAbility {
  const builder = new AbilityBuilder<AppAbility>(createMongoAbility);
  if (actor === null) {
    signedOutRules(builder);
  } else if (actor.active) {
    const roles = effectiveRoles(actor);
    everyoneRules(builder, actor);
    for (const [role, rules] of ROLE_ORDER) if (roles.includes(role)) rules(builder, actor);
    if (actor.organisationKind === "buyer") sealedUntilClosing(builder);
    personalRules(builder, actor);
  }
  return builder.build();
}
