import { defineAbilityFor } from "@/policies";
import type { Queryable } from "./client";
import { actorOf, loadUser } from "@/lib/server/people-store";
import type { Viewer } from "@/lib/server/session";

/**
 * The viewer a person would be in a request: roles and declarations read from the database now.
 * Writers after the seed (db/seed-scale.ts, tests/e2e/prepare.ts) act through the app's own
 * functions as the people concerned; read it again after a declaration.
 */
export async function viewerOf(db: Queryable, userId: string): Promise<Viewer> {
  const user = await loadUser(db, userId);
  if (!user) throw new Error(`no user ${userId}`);
  const actor = actorOf(user);
  return { actor, ability: defineAbilityFor(actor), name: user.name, email: user.email, organisationName: user.organisation.name };
}
