import "server-only";
import { readFile } from "node:fs/promises";
import path from "node:path";
import type { PgDatabase, PgQueryResultHKT } from "drizzle-orm/pg-core";
import type { PGliteInterface } from "@electric-sql/pglite";
import { env } from "@/lib/env";
import { holdDataFolder } from "@/lib/runtime/data-lock";
import { ADVISORY_LOCKS } from "./locks";
import * as schema from "./schema/index";

export type Db = PgDatabase<PgQueryResultHKT, typeof schema>;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
/** Either the database or an open transaction: what lib/server functions accept. */
export type Queryable = Db | Tx;

interface Handle {
  db: Db;
  close: () => Promise<void>;
  /** The embedded database itself, when there is one (backups dump it). */
  pglite?: PGliteInterface;
}

/** The data folder: PGlite's files and the local object store live below it. */
export function dataDir(): string {
  return env().DATA_DIR;
}

const migrationsFolder = () => path.join(process.cwd(), "drizzle");

async function openPglite(): Promise<Handle> {
  const { PGlite } = await import("@electric-sql/pglite");
  const { drizzle } = await import("drizzle-orm/pglite");
  const { migrate } = await import("drizzle-orm/pglite/migrator");
  let client;
  if (env().DB_MEMORY) {
    const snapshot = env().NODE_ENV === "test" ? env().TEST_DB_SNAPSHOT : undefined;
    client = snapshot ? new PGlite({ loadDataDir: new Blob([await readFile(snapshot)]) }) : new PGlite();
  } else {
    // One process per data folder (the starter may hold it for this process); PGlite creates
    // only the last folder of its path.
    holdDataFolder(dataDir(), "Ratecourt server", env().RATECOURT_DATA_LOCK_PID);
    client = new PGlite(path.join(dataDir(), "pglite"));
  }
  const db = drizzle(client, { schema });
  await migrate(db, { migrationsFolder: migrationsFolder() });
  return { db: db as unknown as Db, close: () => client.close(), pglite: client };
}

async function openServer(url: string): Promise<Handle> {
  const { Pool } = await import("pg");
  const { drizzle } = await import("drizzle-orm/node-postgres");
  const { migrate } = await import("drizzle-orm/node-postgres/migrator");
  const pool = new Pool({ connectionString: url, max: env().DB_POOL_SIZE });
  // Several instances may start at once against one server: one migrates, the others wait.
  const client = await pool.connect();
  try {
    await client.query("select pg_advisory_lock($1)", [ADVISORY_LOCKS.migrations]);
    await migrate(drizzle(client, { schema }), { migrationsFolder: migrationsFolder() });
  } finally {
    await client.query("select pg_advisory_unlock($1)", [ADVISORY_LOCKS.migrations]).catch(() => undefined);
    client.release();
  }
  return { db: drizzle(pool, { schema }) as unknown as Db, close: () => pool.end() };
}

/**
 * What runs once on a freshly opened database, before anyone else uses it: the bootstrap step
 * (`lib/server/database.ts` loads the demo or explains the first account). It lives outside this
 * file so that the client imports nothing of the data-access layer.
 */
export type Prepare = (db: Db) => Promise<void>;

async function open(prepare: Prepare): Promise<Handle> {
  const url = env().DATABASE_URL;
  const handle = url ? await openServer(url) : await openPglite();
  await prepare(handle.db);
  return handle;
}

// One instance per process, kept across dev reloads: two PGlite instances on one folder lose data.
const KEY = Symbol.for("ratecourt.db");
type Holder = { [KEY]?: Promise<Handle> };
const holder = globalThis as Holder;

/** The process's database, opened, migrated and prepared on first use. */
export async function openDb(prepare: Prepare): Promise<Db> {
  holder[KEY] ??= open(prepare).catch((error) => {
    holder[KEY] = undefined;
    throw error;
  });
  return (await holder[KEY]).db;
}

/** The process's embedded database once opened, or null when DATABASE_URL names a PostgreSQL server. */
export async function openedPglite(prepare: Prepare): Promise<PGliteInterface | null> {
  await openDb(prepare);
  return (await holder[KEY])?.pglite ?? null;
}

/** Closes the process's database (tests and scripts). */
export async function closeDb(): Promise<void> {
  const pending = holder[KEY];
  holder[KEY] = undefined;
  if (pending) await (await pending).close();
}
