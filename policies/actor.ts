import type { OrganisationKind, Role } from "./vocabulary";

/** The signed-in person, as lib/server reads it from the database on each request. */
export interface Actor {
  id: string;
  organisationId: string;
  /** The buying company, or one vendor organisation. */
  organisationKind: OrganisationKind;
  /** A vendor user holds exactly ["vendor"]; an internal user any of admin/buyer/engineer/approver. */
  roles: Role[];
  /** Deactivated users get no abilities at all. */
  active: boolean;
  /** Approvers: the largest award value they may approve, in the tender currency. */
  approvalLimit: number | null;
  /** Per-tender conflict-of-interest declarations made by this user (engineers and approvers). */
  declarations: Declared[];
}

export interface Declared {
  tenderId: string;
  conflictedVendorOrgIds: string[];
}

/** What the declarations mean for access, with several declarations on one tender merged. */
export interface TenderAccess {
  /** Tenders this person has declared on, whatever the declaration says. */
  declared: string[];
  /** Tenders declared on with no conflict at all: the only ones they may sign or approve. */
  clean: string[];
  /** Per tender, the vendor organisations this person must not see. */
  conflicts: Map<string, string[]>;
}

export function tenderAccess(declarations: readonly Declared[]): TenderAccess {
  const conflicts = new Map<string, Set<string>>();
  for (const { tenderId, conflictedVendorOrgIds } of declarations) {
    const set = conflicts.get(tenderId) ?? new Set<string>();
    conflictedVendorOrgIds.forEach((org) => set.add(org));
    conflicts.set(tenderId, set);
  }
  const declared = [...conflicts.keys()];
  return {
    declared,
    clean: declared.filter((tenderId) => conflicts.get(tenderId)!.size === 0),
    conflicts: new Map([...conflicts].filter(([, orgs]) => orgs.size > 0).map(([tenderId, orgs]) => [tenderId, [...orgs]])),
  };
}

/**
 * A vendor user may hold only the vendor role, and a vendor role only makes sense in a vendor
 * organisation. Anything else is a data error, so such an actor gets the narrowest reading.
 */
export function effectiveRoles(actor: Actor): Role[] {
  const roles = [...new Set(actor.roles)];
  if (actor.organisationKind === "vendor") return roles.includes("vendor") ? ["vendor"] : [];
  return roles.filter((role) => role !== "vendor");
}
