import "server-only";
import { createHmac, randomBytes, timingSafeEqual } from "node:crypto";
import { and, count, eq, gt, isNull, lt } from "drizzle-orm";
import type { BetterAuthPlugin } from "better-auth";
import { APIError, createAuthMiddleware, isAPIError } from "better-auth/api";
import { getDb } from "./database";
import { signInFailures } from "@/db/schema";
import { clientAddress } from "./client-address";

// The account lockout, as a better-auth plugin so that it holds on every way in: the sign-in form
// (auth.api.signInEmail) and POST /api/auth/sign-in/email alike. The design is in DEVELOPERS.md
// ("Sign-in attempts"): failures count per account and client address, a browser that has signed
// in to the account before (it carries a trusted-device cookie) has a count of its own, and a
// stranger cannot use up that count.

export const SIGN_IN_WINDOW_MINUTES = 15;
/** Failures of one account from one address (or from one trusted device) before it waits. */
export const SIGN_IN_MAX_FAILURES = 5;
/** Failures of one account from all untrusted clients together before every untrusted client waits. */
export const SIGN_IN_MAX_UNTRUSTED_FAILURES = 20;
export const DEVICE_COOKIE = "ratecourt_device";
const DEVICE_DAYS = 90;
const KEEP_FAILURES_MS = 24 * 60 * 60 * 1000;
const SIGN_IN_PATH = "/sign-in/email";

export const LOCKED_MESSAGE = `Too many failed attempts for this account. Try again in ${SIGN_IN_WINDOW_MINUTES} minutes, or sign in from a browser you have signed in with before.`;

const sign = (secret: string, payload: string) => createHmac("sha256", secret).update(payload).digest("base64url");

/** A trusted-device token: the account it was issued to, a random id, and a signature. */
function issueDevice(secret: string, email: string): string {
  const payload = `${Buffer.from(email).toString("base64url")}.${randomBytes(16).toString("base64url")}`;
  return `${payload}.${sign(secret, payload)}`;
}

/** The device id when the request carries a valid device cookie issued for this account, else null. */
export function trustedDevice(secret: string, headers: Headers | undefined, email: string): string | null {
  const cookie = (headers?.get("cookie") ?? "")
    .split(";")
    .map((part) => part.trim())
    .find((part) => part.startsWith(`${DEVICE_COOKIE}=`));
  const [forEmail, id, signature] = (cookie?.slice(DEVICE_COOKIE.length + 1) ?? "").split(".");
  if (!forEmail || !id || !signature) return null;
  const expected = Buffer.from(sign(secret, `${forEmail}.${id}`));
  const given = Buffer.from(signature);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) return null;
  return Buffer.from(forEmail, "base64url").toString() === email ? id : null;
}

interface Attempt {
  email: string;
  address: string;
  device: string | null;
}

/** Whether this attempt must wait: its own count, then (untrusted only) the account-wide count. */
export async function isLockedOut({ email, address, device }: Attempt, now = Date.now()): Promise<boolean> {
  const db = await getDb();
  const since = new Date(now - SIGN_IN_WINDOW_MINUTES * 60_000);
  const failures = async (...where: Parameters<typeof and>) => {
    const [{ n }] = await db
      .select({ n: count() })
      .from(signInFailures)
      .where(and(eq(signInFailures.email, email), gt(signInFailures.at, since), ...where));
    return n;
  };
  if (device) return (await failures(eq(signInFailures.device, device))) >= SIGN_IN_MAX_FAILURES;
  if ((await failures(isNull(signInFailures.device), eq(signInFailures.address, address))) >= SIGN_IN_MAX_FAILURES) return true;
  return (await failures(isNull(signInFailures.device))) >= SIGN_IN_MAX_UNTRUSTED_FAILURES;
}

/** Records one failure in its own table (not the ledger), pruning those older than a day. */
export async function recordFailure(attempt: Attempt, now = Date.now()): Promise<void> {
  const db = await getDb();
  await db.insert(signInFailures).values({ ...attempt, at: new Date(now) });
  await db.delete(signInFailures).where(lt(signInFailures.at, new Date(now - KEEP_FAILURES_MS)));
}

function attemptOf(secret: string, headers: Headers | undefined, body: unknown): Attempt | null {
  const email = typeof body === "object" && body && "email" in body && typeof body.email === "string" ? body.email.trim().toLowerCase() : "";
  if (!email) return null;
  const address = headers ? clientAddress(headers) : "server";
  return { email, address, device: trustedDevice(secret, headers, email) };
}

export function signInGuard(secret: string, secureCookies: boolean): BetterAuthPlugin {
  const isSignIn = (ctx: { path?: string }) => ctx.path === SIGN_IN_PATH;
  return {
    id: "ratecourt-sign-in-guard",
    hooks: {
      before: [
        {
          matcher: isSignIn,
          handler: createAuthMiddleware(async (ctx) => {
            const attempt = attemptOf(secret, ctx.headers, ctx.body);
            if (attempt && (await isLockedOut(attempt))) throw new APIError("TOO_MANY_REQUESTS", { message: LOCKED_MESSAGE });
          }),
        },
      ],
      after: [
        {
          matcher: isSignIn,
          handler: createAuthMiddleware(async (ctx) => {
            const attempt = attemptOf(secret, ctx.headers, ctx.body);
            if (!attempt) return;
            const returned = ctx.context.returned;
            if (isAPIError(returned)) {
              // 401 is a wrong password or an unknown account; a lockout or a deactivated account is not a guess.
              if (returned.statusCode === 401) await recordFailure(attempt);
              return;
            }
            if (!attempt.device) {
              ctx.setCookie(DEVICE_COOKIE, issueDevice(secret, attempt.email), {
                httpOnly: true,
                sameSite: "lax",
                secure: secureCookies,
                path: "/",
                maxAge: DEVICE_DAYS * 24 * 60 * 60,
              });
            }
          }),
        },
      ],
    },
  } satisfies BetterAuthPlugin;
}
