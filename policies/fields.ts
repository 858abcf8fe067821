import { ForbiddenError, subject } from "@casl/ability";
import { permittedFieldsOf } from "@casl/ability/extra";
import type { SubjectRecords } from "./records";
import type { AppAbility, TaggedSubject } from "./types";
import type { Action, SubjectType } from "./vocabulary";

/**
 * Tags a plain record with its subject type for CASL. The record is copied, because CASL's
 * subject() marks the object itself and refuses to mark it again as another type.
 */
export function asSubject<S extends SubjectType>(type: S, record: SubjectRecords[S]): TaggedSubject {
  return subject(type, { ...record }) as unknown as TaggedSubject;
}

/** ability.can for a subject type (what the client uses to hide controls) or one record. */
export function allows<S extends SubjectType>(ability: AppAbility, action: Action, type: S, record?: SubjectRecords[S], field?: string): boolean {
  return ability.can(action, record === undefined ? type : asSubject(type, record), field);
}

/** Throws CASL's ForbiddenError (with the rule's reason, if any) unless allowed. */
export function assertAllowed<S extends SubjectType>(ability: AppAbility, action: Action, type: S, record?: SubjectRecords[S], field?: string): void {
  const target = record === undefined ? type : asSubject(type, record);
  ForbiddenError.from(ability).throwUnlessCan(action, target, field);
}

/** The record's own fields that the ability permits for this action, in the record's order. */
export function permittedFields<S extends SubjectType, R extends SubjectRecords[S]>(
  ability: AppAbility,
  action: Action,
  type: S,
  record: R,
): (keyof R & string)[] {
  const own = Object.keys(record) as (keyof R & string)[];
  const permitted = new Set(
    permittedFieldsOf(ability, action, asSubject(type, record), {
      fieldsFrom: (rule) => rule.fields ?? own,
    }),
  );
  return own.filter((field) => permitted.has(field));
}

/**
 * The record with only the permitted fields, to strip a response before it leaves the server.
 * A record the ability does not reach at all comes back empty: authorise it first.
 */
export function pickPermitted<S extends SubjectType, R extends SubjectRecords[S]>(ability: AppAbility, action: Action, type: S, record: R): Partial<R> {
  const picked: Partial<R> = {};
  for (const field of permittedFields(ability, action, type, record)) picked[field] = record[field];
  return picked;
}
