import "server-only";
import { isAPIError } from "better-auth/api";
import type { SignInInput } from "@/lib/validation/auth";
import { getAuth } from "./auth";
import { clientAddress } from "./client-address";
import { ForbiddenError, InputError, TooManyError } from "./errors";
import { consumeRate, signInRate } from "./throttle";

const WRONG = "Wrong e-mail or password.";
const TOO_FAST = "Too many sign-in attempts from this address. Wait a minute and try again.";

/**
 * Signs in with e-mail and password, setting the session cookie through better-auth. The lockout
 * and the failure records live in better-auth's own pipeline (sign-in-guard.ts), so its HTTP
 * endpoint enforces them too; the form adds the per-address limit that the endpoint gets from
 * better-auth's rate limiter.
 */
export async function signIn(input: SignInInput, headers: Headers): Promise<void> {
  const rate = await consumeRate(`sign-in-form|${clientAddress(headers)}`, signInRate());
  if (!rate.allowed) throw new TooManyError(TOO_FAST);
  const auth = await getAuth();
  try {
    await auth.api.signInEmail({ body: { email: input.email.toLowerCase(), password: input.password }, headers });
  } catch (error) {
    if (!isAPIError(error)) throw error;
    if (error.statusCode === 429) throw new TooManyError(error.message);
    if (error.statusCode === 403) throw new ForbiddenError(error.message);
    throw new InputError(WRONG);
  }
}

export async function signOut(headers: Headers): Promise<void> {
  const auth = await getAuth();
  await auth.api.signOut({ headers });
}
