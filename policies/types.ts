import type { AbilityBuilder, ForcedSubject, MongoAbility } from "@casl/ability";
import type { SubjectRecords } from "./records";
import type { Action, SubjectType } from "./vocabulary";

/** A record tagged with its subject type (see asSubject), as CASL matches conditions on it. */
export type TaggedSubject = {
  [S in SubjectType]: SubjectRecords[S] & ForcedSubject<S>;
}[SubjectType];

export type AppAbility = MongoAbility<[Action, SubjectType | TaggedSubject]>;
export type RuleBuilder = AbilityBuilder<AppAbility>;
