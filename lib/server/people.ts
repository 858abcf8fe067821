import "server-only";
import { and, asc, count, eq, ilike, or, sql } from "drizzle-orm";
import { asSubject, type OrganisationKind } from "@/policies";
import { getDb, type Queryable } from "./database";
import { organisations, sessions, userRoles, users, type RoleName } from "@/db/schema";
import type { CreateUserInput, PeopleFilters, UpdateUserInput } from "@/lib/validation/people";
import { pageInfo, pageWindow, type PagingInput } from "@/lib/validation/paging";
import { containing } from "./access-sql";
import { appendLedger } from "./ledger";
import { insertUser, loadUser, rolesByUser } from "./people-store";
import { authorize, ledgerActor, type Viewer } from "./session";
import { strandProblem } from "./approval-coverage";
import { ConflictError, InputError, NotFoundError } from "./errors";

/**
 * One page of people and their organisations, for the People page and GET /api/v1/users, filtered
 * by text in the name or e-mail, organisation, role and status. Never includes password material.
 */
export async function listPeople(viewer: Viewer, query: PeopleFilters & PagingInput) {
  authorize(viewer, "manage", "User");
  const db = await getDb();
  const where = and(
    query.q ? or(ilike(users.name, containing(query.q)), ilike(users.email, containing(query.q))) : undefined,
    query.organisationId ? eq(users.organisationId, query.organisationId) : undefined,
    query.role ? sql`exists (select 1 from ${userRoles} where ${userRoles.userId} = ${users.id} and ${userRoles.role} = ${query.role})` : undefined,
    query.status ? eq(users.active, query.status === "active") : undefined,
  );
  const [{ n }] = await db.select({ n: count() }).from(users).where(where);
  const window = pageWindow(n, query);
  const rows =
    n === 0
      ? []
      : await db
          .select({
            id: users.id,
            name: users.name,
            email: users.email,
            active: users.active,
            approvalLimit: users.approvalLimit,
            organisationId: users.organisationId,
            organisationName: organisations.name,
            organisationKind: organisations.kind,
          })
          .from(users)
          .innerJoin(organisations, eq(organisations.id, users.organisationId))
          .where(where)
          .orderBy(asc(organisations.name), asc(users.name), asc(users.id))
          .limit(window.pageSize)
          .offset(window.offset);
  const roles = await rolesByUser(
    db,
    rows.map((r) => r.id),
  );
  return { users: rows.map((r) => ({ ...r, roles: roles.get(r.id) ?? [] })), ...pageInfo(window) };
}

export async function listOrganisations(viewer: Viewer) {
  const db = await getDb();
  const rows = await db.select().from(organisations).orderBy(asc(organisations.kind), asc(organisations.name));
  return rows.filter((o) => viewer.ability.can("read", asSubject("Organisation", { id: o.id, kind: o.kind })));
}

export async function getOrganisation(viewer: Viewer, id: string) {
  const db = await getDb();
  const [org] = await db.select().from(organisations).where(eq(organisations.id, id));
  if (!org) throw new NotFoundError("No such organisation.");
  authorize(viewer, "read", asSubject("Organisation", { id: org.id, kind: org.kind }), "This organisation's record is not yours to see.");
  const members = viewer.ability.can("manage", "User")
    ? await db
        .select({ id: users.id, name: users.name, email: users.email, active: users.active })
        .from(users)
        .where(eq(users.organisationId, id))
        .orderBy(asc(users.name))
    : [];
  return { ...org, members };
}

function checkRolesFit(kind: OrganisationKind, roles: RoleName[]) {
  if (kind === "vendor" && (roles.length !== 1 || roles[0] !== "vendor")) {
    throw new InputError("A member of a vendor organisation holds the vendor role only.", { roles: ["Vendor organisations: vendor role only."] });
  }
  if (kind === "buyer" && roles.includes("vendor")) {
    throw new InputError("The vendor role belongs to vendor organisations.", { roles: ["Not for the buying company."] });
  }
}

export async function createUser(viewer: Viewer, input: CreateUserInput) {
  authorize(viewer, "create", "User");
  const db = await getDb();
  const [org] = await db.select().from(organisations).where(eq(organisations.id, input.organisationId));
  if (!org) throw new InputError("No such organisation.", { organisationId: ["Choose an existing organisation."] });
  checkRolesFit(org.kind, input.roles);
  const email = input.email.toLowerCase();
  const [taken] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
  if (taken) throw new InputError("That e-mail address already has an account.", { email: ["Already in use."] });
  return db.transaction(async (tx) => {
    const user = await insertUser(tx, { ...input, email });
    await appendLedger(tx, {
      actor: ledgerActor(viewer),
      action: "user.created",
      subjectType: "User",
      subjectId: user.id,
      data: { email, organisation: org.name, roles: [...input.roles].sort() },
    });
    return { id: user.id, email: user.email, name: user.name };
  });
}

/** A change that takes approving power away must not leave a pending recommendation without enough approvers (409). */
async function refuseStranding(db: Queryable, target: NonNullable<Awaited<ReturnType<typeof loadUser>>>, input: UpdateUserInput) {
  const lowered = input.approvalLimit !== undefined && (input.approvalLimit ?? -1) < (target.approvalLimit ?? -1);
  const unroled = input.roles !== undefined && target.roles.includes("approver") && !input.roles.includes("approver");
  if (!(input.active === false || lowered || unroled)) return;
  const problem = await strandProblem(db, { userId: target.id, name: target.name, ...input });
  if (problem) throw new ConflictError(problem);
}

/** Changes roles, active flag or approval limit; each change is a ledger entry in the same transaction. */
export async function updateUser(viewer: Viewer, userId: string, input: UpdateUserInput) {
  const db = await getDb();
  const target = await loadUser(db, userId);
  if (!target) throw new NotFoundError("No such user.");
  const subject = asSubject("User", { id: target.id, organisationId: target.organisationId });
  if (input.roles) {
    authorize(viewer, "assignRoles", subject);
    checkRolesFit(target.organisation.kind, input.roles);
  }
  if (input.active !== undefined) {
    authorize(viewer, "deactivate", subject);
  }
  if (input.approvalLimit !== undefined) authorize(viewer, "update", subject);
  await refuseStranding(db, target, input);

  await db.transaction(async (tx) => {
    const actor = ledgerActor(viewer);
    if (input.roles) {
      const roles = [...new Set(input.roles)].sort();
      await tx.delete(userRoles).where(eq(userRoles.userId, userId));
      await tx.insert(userRoles).values(roles.map((role) => ({ userId, role })));
      await appendLedger(tx, {
        actor,
        action: "user.roles-changed",
        subjectType: "User",
        subjectId: userId,
        data: { email: target.email, from: target.roles, to: roles },
      });
    }
    if (input.active !== undefined && input.active !== target.active) {
      await tx.update(users).set({ active: input.active }).where(eq(users.id, userId));
      // A deactivated account loses its open sessions at once.
      if (!input.active) await tx.delete(sessions).where(eq(sessions.userId, userId));
      await appendLedger(tx, {
        actor,
        action: input.active ? "user.reactivated" : "user.deactivated",
        subjectType: "User",
        subjectId: userId,
        data: { email: target.email },
      });
    }
    if (input.approvalLimit !== undefined && input.approvalLimit !== target.approvalLimit) {
      await tx.update(users).set({ approvalLimit: input.approvalLimit }).where(eq(users.id, userId));
      await appendLedger(tx, {
        actor,
        action: "user.approval-limit-changed",
        subjectType: "User",
        subjectId: userId,
        data: { email: target.email, from: target.approvalLimit, to: input.approvalLimit },
      });
    }
  });
  return loadUser(db, userId);
}

export async function createOrganisation(viewer: Viewer, input: { name: string; country?: string }) {
  authorize(viewer, "create", "Organisation");
  const db = await getDb();
  const [taken] = await db.select({ id: organisations.id }).from(organisations).where(eq(organisations.name, input.name));
  if (taken) throw new InputError("An organisation of that name exists.", { name: ["Already in use."] });
  return db.transaction(async (tx) => {
    const [org] = await tx
      .insert(organisations)
      .values({ name: input.name, kind: "vendor", country: input.country ?? null })
      .returning();
    await appendLedger(tx, {
      actor: ledgerActor(viewer),
      action: "organisation.created",
      subjectType: "Organisation",
      subjectId: org.id,
      data: { name: org.name },
    });
    return org;
  });
}
