import { createMongoAbility, type RawRuleOf } from "@casl/ability";
import { packRules, unpackRules, type PackRule } from "@casl/ability/extra";
import type { AppAbility } from "./types";

/** The compact, JSON-safe form in which the server ships an actor's rules to the client. */
export type PackedRules = PackRule<RawRuleOf<AppAbility>>[];

export function serializeRules(ability: AppAbility): PackedRules {
  return packRules(ability.rules);
}

/** On the client, only to hide controls: the server checks every action again. */
export function abilityFromRules(rules: PackedRules): AppAbility {
  return createMongoAbility<AppAbility>(unpackRules(rules));
}
