import "server-only";
import { and, count, eq, gt, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { ledgerEntries, users } from "@/db/schema";
import type { SignInInput } from "@/lib/validation/auth";
import { getAuth } from "./auth";
import { appendLedger } from "./ledger";
import { InputError, TooManyError } from "./errors";

export const SIGN_IN_WINDOW_MINUTES = 15;
export const SIGN_IN_MAX_FAILURES = 5;
const WRONG = "Wrong e-mail or password.";

async function recentFailures(email: string) {
  const db = await getDb();
  const since = new Date(Date.now() - SIGN_IN_WINDOW_MINUTES * 60_000);
  const [{ n }] = await db
    .select({ n: count() })
    .from(ledgerEntries)
    .where(
      and(
        eq(ledgerEntries.action, "auth.sign-in-failed"),
        sql`${ledgerEntries.data}->>'email' = ${email}`,
        gt(ledgerEntries.at, since),
      ),
    );
  return n;
}

async function recordFailure(email: string, reason: string) {
  const db = await getDb();
  await db.transaction((tx) =>
    appendLedger(tx, { actor: null, action: "auth.sign-in-failed", subjectType: "User", data: { email, reason } }),
  );
}

/**
 * Signs in with e-mail and password, setting the session cookie through better-auth.
 * Failures are written to the ledger, and they also drive the per-account attempt limit.
 */
export async function signIn(input: SignInInput, headers: Headers): Promise<void> {
  const email = input.email.toLowerCase();
  if ((await recentFailures(email)) >= SIGN_IN_MAX_FAILURES) {
    throw new TooManyError(
      `Too many failed attempts for this account. Try again in ${SIGN_IN_WINDOW_MINUTES} minutes.`,
    );
  }
  const db = await getDb();
  const [user] = await db.select({ active: users.active }).from(users).where(eq(users.email, email));
  if (user && !user.active) {
    await recordFailure(email, "deactivated");
    throw new InputError("This account has been deactivated. Ask an administrator.");
  }
  const auth = await getAuth();
  try {
    await auth.api.signInEmail({ body: { email, password: input.password }, headers });
  } catch {
    await recordFailure(email, user ? "wrong password" : "unknown account");
    throw new InputError(WRONG);
  }
}

export async function signOut(headers: Headers): Promise<void> {
  const auth = await getAuth();
  await auth.api.signOut({ headers });
}
