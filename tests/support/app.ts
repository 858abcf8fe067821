import { sql } from "drizzle-orm";
import { closeDb, getDb } from "@/lib/server/database";
import { forgetCheckpointsInMemory } from "@/lib/server/ledger-anchors";
import { seedDemoData, DEMO_PASSWORD } from "@/db/seed";
import { POST as authPost } from "@/app/api/auth/[...all]/route";
import { DEMO_ACCOUNTS, type DemoAccount } from "./accounts";

export { DEMO_ACCOUNTS, type DemoAccount };

export const BASE = process.env.BETTER_AUTH_URL ?? "http://localhost:3000";

/** A fresh demo database: on PGlite a new in-memory one per file; on a server, emptied and seeded again. */
export async function freshDatabase() {
  const db = await getDb();
  if (process.env.DATABASE_URL) {
    const { rows } = (await db.execute(sql`select tablename from pg_tables where schemaname = 'public'`)) as unknown as { rows: { tablename: string }[] };
    const names = rows.map((r) => `"${r.tablename}"`).join(", ");
    if (names) await db.execute(sql.raw(`truncate ${names} restart identity cascade`));
    // The checkpoints this process kept of the ledger just emptied (the first file on an empty
    // server seeds it once on opening) would not match the new one.
    forgetCheckpointsInMemory();
    await seedDemoData(db);
  }
  return db;
}

export { closeDb };

/** Signs in through the auth route handler, as a browser would, and returns headers carrying the session cookie. */
export async function signInAs(email: string, password = DEMO_PASSWORD): Promise<Headers> {
  const response = await authPost(
    new Request(`${BASE}/api/auth/sign-in/email`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: BASE },
      body: JSON.stringify({ email, password }),
    }),
  );
  if (response.status !== 200) throw new Error(`sign-in as ${email} failed: ${response.status} ${await response.text()}`);
  const cookie = response.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  return new Headers({ cookie, origin: BASE });
}

/** Signs in each demo account named: `signInAll("buyer", "oxbow")` gives `{ buyer: headers, oxbow: headers }`. */
export async function signInAll<K extends DemoAccount>(...names: K[]): Promise<Record<K, Headers>> {
  const out = {} as Record<K, Headers>;
  for (const name of names) out[name] = await signInAs(DEMO_ACCOUNTS[name]);
  return out;
}

/** A Request to a route handler, with the given session headers. */
export function request(path: string, init: { method?: string; headers?: Headers; body?: unknown; rawBody?: string } = {}) {
  const headers = new Headers(init.headers);
  if (init.body !== undefined || init.rawBody !== undefined) headers.set("content-type", "application/json");
  return new Request(`${BASE}${path}`, {
    method: init.method ?? "GET",
    headers,
    body: init.rawBody ?? (init.body === undefined ? undefined : JSON.stringify(init.body)),
  });
}

export const params = <T extends Record<string, string>>(value: T) => ({ params: Promise.resolve(value) });
