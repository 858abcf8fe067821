import "server-only";
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { APIError } from "better-auth/api";
import { nextCookies } from "better-auth/next-js";
import { getDb, type Db } from "./database";
import { env } from "@/lib/env";
import { keptSecret } from "./secrets";
import { accounts, sessions, users, verifications } from "@/db/schema";
import { eq } from "drizzle-orm";
import { trustedOrigins } from "./origin";
import { signInGuard } from "./sign-in-guard";
import { AUTH_RATE, consumeRate, signInRate } from "./throttle";

/** Set by the auth route handler from the trusted client address (lib/server/client-address.ts); a client's own value is dropped. */
export const CLIENT_ADDRESS_HEADER = "x-ratecourt-client-address";
export const DEACTIVATED_MESSAGE = "This account has been deactivated. Ask an administrator.";

export function appUrl(): string {
  return env().appUrl;
}

/** A secret from the environment, or one made once and kept in the data folder. */
const secret = () => keptSecret(env().BETTER_AUTH_SECRET, "auth-secret");

function createAuth(db: Db) {
  const baseURL = appUrl();
  const authSecret = secret();
  return betterAuth({
    baseURL,
    secret: authSecret,
    trustedOrigins: trustedOrigins(baseURL),
    database: drizzleAdapter(db, {
      provider: "pg",
      schema: { user: users, session: sessions, account: accounts, verification: verifications },
    }),
    // Accounts are made by an administrator on the People page, never by signing up.
    emailAndPassword: { enabled: true, disableSignUp: true, minPasswordLength: 8 },
    // Our own columns on better-auth's user table; never taken from a client.
    user: {
      additionalFields: {
        organisationId: { type: "string", required: true, input: false },
        active: { type: "boolean", required: false, defaultValue: true, input: false },
        approvalLimit: { type: "number", required: false, input: false },
      },
    },
    // No cookie cache: every request reads the session row, so deleting the rows ends the sessions at once.
    session: { expiresIn: 60 * 60 * 12, updateAge: 60 * 60, cookieCache: { enabled: false } },
    // People change their own records only through our People rules, never through the library's endpoints.
    disabledPaths: ["/update-user", "/change-email", "/delete-user", "/sign-up/email"],
    // Per client address, counted in the database so that every instance shares the count.
    rateLimit: {
      enabled: true,
      ...AUTH_RATE,
      customRules: { "/sign-in/email": signInRate() },
      customStorage: { consume: consumeRate },
    },
    advanced: {
      database: { generateId: () => crypto.randomUUID() },
      ipAddress: { ipAddressHeaders: [CLIENT_ADDRESS_HEADER] },
    },
    databaseHooks: {
      session: {
        create: {
          // A deactivated account gets no new session, whichever way sign-in is attempted. This runs
          // only after the password was checked, so the answer tells nothing to someone guessing.
          before: async (session) => {
            const [user] = await db.select({ active: users.active }).from(users).where(eq(users.id, session.userId));
            if (!user?.active) throw new APIError("FORBIDDEN", { message: DEACTIVATED_MESSAGE });
            return { data: session };
          },
        },
      },
    },
    // Must stay last: it sets cookies from server actions.
    plugins: [signInGuard(authSecret, baseURL.startsWith("https:")), nextCookies()],
  });
}

export type Auth = ReturnType<typeof createAuth>;

const KEY = Symbol.for("ratecourt.auth");
const holder = globalThis as { [KEY]?: Promise<Auth> };

export function getAuth(): Promise<Auth> {
  holder[KEY] ??= getDb()
    .then(createAuth)
    .catch((error) => {
      holder[KEY] = undefined;
      throw error;
    });
  return holder[KEY];
}
