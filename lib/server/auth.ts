import "server-only";
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { nextCookies } from "better-auth/next-js";
import { getDb, type Db } from "@/db/client";
import { env } from "@/lib/env";
import { keptSecret } from "./secrets";
import { accounts, sessions, users, verifications } from "@/db/schema";
import { eq } from "drizzle-orm";

export function appUrl(): string {
  return env().appUrl;
}

/** A secret from the environment, or one made once and kept in the data folder. */
const secret = () => keptSecret(env().BETTER_AUTH_SECRET, "auth-secret");

function trustedOrigins(base: string): string[] {
  const url = new URL(base);
  const port = url.port ? `:${url.port}` : "";
  return [base, `${url.protocol}//localhost${port}`, `${url.protocol}//127.0.0.1${port}`];
}

function createAuth(db: Db) {
  const baseURL = appUrl();
  return betterAuth({
    baseURL,
    secret: secret(),
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
    // The signed session cookie spares a session lookup for a minute; roles, organisation and the
    // active flag are still read from the database on every request (lib/server/session.ts).
    session: { expiresIn: 60 * 60 * 12, updateAge: 60 * 60, cookieCache: { enabled: true, maxAge: 60 } },
    rateLimit: {
      enabled: true,
      window: 60,
      max: 200,
      customRules: { "/sign-in/email": { window: 60, max: 20 } },
    },
    advanced: { database: { generateId: () => crypto.randomUUID() } },
    databaseHooks: {
      session: {
        create: {
          // A deactivated account gets no new session, whichever way sign-in is attempted.
          before: async (session) => {
            const [user] = await db.select({ active: users.active }).from(users).where(eq(users.id, session.userId));
            return user?.active ? { data: session } : false;
          },
        },
      },
    },
    // Must stay last: it sets cookies from server actions.
    plugins: [nextCookies()],
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
