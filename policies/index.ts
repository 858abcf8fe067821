/**
 * Ratecourt's permissions: the one place they live. Pure TypeScript, no I/O.
 * The full rule table, role by role, is in README.md beside this file.
 */
export { ForbiddenError } from "@casl/ability";
export { defineAbilityFor } from "./ability";
export { effectiveRoles, tenderAccess, type Actor, type Declared, type TenderAccess } from "./actor";
export { allows, asSubject, assertAllowed, permittedFields, pickPermitted } from "./fields";
export type * from "./records";
export { abilityFromRules, serializeRules, type PackedRules } from "./transport";
export type { AppAbility, TaggedSubject } from "./types";
export {
  ACTIONS,
  CANCELLABLE_STATES,
  cancelKeepsSeal,
  offersSealed,
  recordTenderState,
  ENVELOPE_FIELDS,
  ORGANISATION_KINDS,
  ROLES,
  SEALED_STATES,
  SUBJECTS,
  TENDER_STATES,
  type Action,
  type EnvelopeField,
  type OrganisationKind,
  type RecordTenderState,
  type Role,
  type SealFacts,
  type SubjectType,
  type TenderState,
} from "./vocabulary";
