import "server-only";
import { count } from "drizzle-orm";
import type { PGliteInterface } from "@electric-sql/pglite";
import { openDb, openedPglite, type Db } from "@/db/client";
import { users } from "@/db/schema";
import { seedDemoData } from "@/db/seed";
import { env } from "@/lib/env";

export { closeDb, dataDir, type Db, type Queryable, type Tx } from "@/db/client";

/**
 * The bootstrap step, run once when the process first opens its database (after the migrations):
 * loads the demo into an empty database when the demo is on (development, tests, SEED=demo), else
 * says how to make the first account. The seed writes through the transaction it is handed and
 * imports only writers that never open the database, so nothing here leads back to this file.
 */
async function prepare(db: Db): Promise<void> {
  if (env().seedDemo) await seedDemoData(db);
  else await explainFirstAdmin(db);
}

/** A production start without the demo has no accounts at first: say how to make the first one. */
async function explainFirstAdmin(db: Db) {
  const [row] = await db.select({ n: count() }).from(users);
  if (row.n > 0) return;
  console.log(
    "Ratecourt has no accounts yet. Create the first administrator with\n" +
      '  npm run admin:create -- --email you@example.org --name "Your Name" --organisation "Your organisation"\n' +
      "(with the embedded database, stop the server first). It prints a one-time password to change at first sign-in.",
  );
}

/** The process's database: opened, migrated and prepared on first use, once per process. */
export function getDb(): Promise<Db> {
  return openDb(prepare);
}

/** The process's embedded database (opened and prepared if need be), or null when DATABASE_URL names a PostgreSQL server. */
export function embeddedDatabase(): Promise<PGliteInterface | null> {
  return openedPglite(prepare);
}
