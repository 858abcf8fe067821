import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import type { Queryable } from "@/db/client";
import { userRoles, users } from "@/db/schema";
import { defineAbilityFor, type Actor, type AppAbility, type Role } from "@/policies";
import { queueMail } from "@/lib/mail";
import { mailText } from "@/lib/mail/words";
import { env } from "@/lib/env";
import { actorOf, loadUser } from "./people-store";
import { ensureLocalServices } from "./services";

export interface Notice {
  to: string[];
  subject: string;
  text: string;
}

/**
 * Sends notices without ever blocking or failing the action that caused them: call it after the
 * transaction commits. Failed sends are retried in the background by lib/mail.
 */
export function notify(notices: Notice | Notice[]): void {
  const list = (Array.isArray(notices) ? notices : [notices]).filter((n) => n.to.length > 0);
  if (list.length === 0) return;
  ensureLocalServices()
    .catch((error) => console.warn("local mail server did not start", error))
    .finally(() => {
      for (const notice of list) queueMail({ ...notice, text: mailText(notice.text, env().appUrl) });
    });
}

/** E-mail addresses of the active members of some organisations (all of them, or those with a role). */
export async function addressesOf(db: Queryable, organisationIds: string[], role?: string): Promise<string[]> {
  if (organisationIds.length === 0) return [];
  const base = db.selectDistinct({ email: users.email }).from(users).innerJoin(userRoles, eq(userRoles.userId, users.id));
  const rows = await base.where(
    and(inArray(users.organisationId, organisationIds), eq(users.active, true), role ? eq(userRoles.role, role as never) : undefined),
  );
  return rows.map((r) => r.email).sort();
}

/**
 * The addresses of the active users holding a role whose abilities, as they stand now, pass the
 * check: a notice goes only to people who may read what it says, by the same rules as the pages.
 */
export async function readersWithRole(db: Queryable, role: InternalRole, may: (ability: AppAbility, actor: Actor) => boolean): Promise<string[]> {
  const rows = await db
    .selectDistinct({ id: users.id })
    .from(users)
    .innerJoin(userRoles, eq(userRoles.userId, users.id))
    .where(and(eq(userRoles.role, role), eq(users.active, true)));
  const people = await Promise.all(rows.map((r) => loadUser(db, r.id)));
  return people
    .filter((p): p is NonNullable<typeof p> => p !== null && may(defineAbilityFor(actorOf(p)), actorOf(p)))
    .map((p) => p.email)
    .sort();
}

type InternalRole = Exclude<Role, "vendor">;

/** E-mail addresses of the active internal users holding a role. */
export async function addressesWithRole(db: Queryable, role: InternalRole): Promise<string[]> {
  const rows = await db
    .selectDistinct({ email: users.email })
    .from(users)
    .innerJoin(userRoles, eq(userRoles.userId, users.id))
    .where(and(eq(userRoles.role, role), eq(users.active, true)));
  return rows.map((r) => r.email).sort();
}
