import "server-only";
import { headers as nextHeaders } from "next/headers";
import { defineAbilityFor, type Actor, type AppAbility } from "@/policies";
import { getDb } from "./database";
import { getAuth } from "./auth";
import { actorOf, loadUser } from "./people-store";
import { ForbiddenError, UnauthorizedError } from "./errors";

export interface Viewer {
  actor: Actor;
  ability: AppAbility;
  name: string;
  email: string;
  organisationName: string;
}

/** Who is asking, with roles and declarations read from the database on every request. */
export async function getViewer(requestHeaders?: Headers): Promise<Viewer | null> {
  // The request's headers first: a page the build tries to prerender stops here, before it would
  // open the database (and hold the data folder that the server will need).
  const h = requestHeaders ?? (await nextHeaders());
  const auth = await getAuth();
  const session = await auth.api.getSession({ headers: h });
  if (!session) return null;
  const db = await getDb();
  const user = await loadUser(db, session.user.id);
  if (!user || !user.active) return null;
  const actor = actorOf(user);
  return {
    actor,
    ability: defineAbilityFor(actor),
    name: user.name,
    email: user.email,
    organisationName: user.organisation.name,
  };
}

export async function requireViewer(requestHeaders?: Headers): Promise<Viewer> {
  const viewer = await getViewer(requestHeaders);
  if (!viewer) throw new UnauthorizedError();
  return viewer;
}

/** The one gate: throws ForbiddenError unless the viewer's abilities allow the action on the subject. */
export function authorize(viewer: Viewer, action: Parameters<AppAbility["can"]>[0], subject: Parameters<AppAbility["can"]>[1], message?: string): void {
  if (viewer.ability.can(action, subject)) return;
  // The policy's own reason, where a rule gives one, tells the person why.
  const reason = viewer.ability.relevantRuleFor(action, subject)?.reason;
  throw new ForbiddenError(message ?? reason);
}

/** The viewer as the ledger names them. */
export const ledgerActor = (viewer: Viewer) => ({ id: viewer.actor.id, label: viewer.name });
