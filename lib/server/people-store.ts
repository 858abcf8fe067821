import "server-only";
import { hashPassword } from "better-auth/crypto";
import { eq, inArray, sql } from "drizzle-orm";
import type { Actor } from "@/policies";
import type { Queryable } from "@/db/client";
import { accounts, declarations, organisations, userRoles, users, type RoleName } from "@/db/schema";

export interface NewUserRow {
  name: string;
  email: string;
  password: string;
  organisationId: string;
  roles: RoleName[];
  approvalLimit?: number | null;
}

/** Writes a user with a password credential, the way better-auth's e-mail sign-in expects it. */
export async function insertUser(tx: Queryable, input: NewUserRow) {
  const [user] = await tx
    .insert(users)
    .values({
      name: input.name,
      email: input.email.toLowerCase(),
      emailVerified: true,
      organisationId: input.organisationId,
      approvalLimit: input.approvalLimit ?? null,
    })
    .returning();
  await tx.insert(accounts).values({
    accountId: user.id,
    providerId: "credential",
    userId: user.id,
    password: await hashPassword(input.password),
  });
  if (input.roles.length > 0) {
    await tx.insert(userRoles).values(input.roles.map((role) => ({ userId: user.id, role })));
  }
  return user;
}

/** A user with organisation, roles and conflict-of-interest declarations, or null. */
export async function loadUser(db: Queryable, userId: string) {
  // One round trip: it runs on every request.
  const [row] = await db
    .select({
      user: users,
      organisation: organisations,
      roles: sql<
        RoleName[]
      >`coalesce((select array_agg(${userRoles.role} order by ${userRoles.role}) from ${userRoles} where ${userRoles.userId} = ${users.id}), '{}')`,
      declarations: sql<
        { tenderId: string; conflictedOrgIds: string[] }[]
      >`coalesce((select json_agg(json_build_object('tenderId', ${declarations.tenderId}, 'conflictedOrgIds', ${declarations.conflictedOrgIds})) from ${declarations} where ${declarations.userId} = ${users.id}), '[]'::json)`,
    })
    .from(users)
    .innerJoin(organisations, eq(organisations.id, users.organisationId))
    .where(eq(users.id, userId));
  if (!row) return null;
  return { ...row.user, organisation: row.organisation, roles: row.roles, declarations: row.declarations };
}

export type LoadedUser = NonNullable<Awaited<ReturnType<typeof loadUser>>>;

/** The person as the policies see them (roles, organisation, declarations, limit). */
export function actorOf(user: LoadedUser): Actor {
  return {
    id: user.id,
    organisationId: user.organisationId,
    organisationKind: user.organisation.kind,
    roles: user.roles,
    active: user.active,
    approvalLimit: user.approvalLimit,
    declarations: user.declarations.map((d) => ({ tenderId: d.tenderId, conflictedVendorOrgIds: d.conflictedOrgIds })),
  };
}

export async function rolesByUser(db: Queryable, userIds: string[]) {
  const map = new Map<string, RoleName[]>();
  if (userIds.length === 0) return map;
  const rows = await db.select().from(userRoles).where(inArray(userRoles.userId, userIds));
  for (const row of rows) map.set(row.userId, [...(map.get(row.userId) ?? []), row.role].sort());
  return map;
}
