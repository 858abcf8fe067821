import "server-only";
import fs from "node:fs";
import path from "node:path";
import type { PgDatabase, PgQueryResultHKT } from "drizzle-orm/pg-core";
import * as schema from "./schema/index";
import { seedDemoData } from "./seed";

export type Db = PgDatabase<PgQueryResultHKT, typeof schema>;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
/** Either the database or an open transaction: what lib/server functions accept. */
export type Queryable = Db | Tx;

interface Handle {
  db: Db;
  close: () => Promise<void>;
}

/** The data folder: PGlite's files and the local object store live below it. */
export function dataDir(): string {
  return path.resolve(process.env.DATA_DIR ?? ".data");
}

const migrationsFolder = () => path.join(process.cwd(), "drizzle");
const MIGRATION_LOCK = 72_011_950;

async function openPglite(): Promise<Handle> {
  const { PGlite } = await import("@electric-sql/pglite");
  const { drizzle } = await import("drizzle-orm/pglite");
  const { migrate } = await import("drizzle-orm/pglite/migrator");
  let client;
  if (process.env.DB_MEMORY === "1") {
    client = new PGlite();
  } else {
    // PGlite creates only the last folder of its path.
    fs.mkdirSync(dataDir(), { recursive: true });
    client = new PGlite(path.join(dataDir(), "pglite"));
  }
  const db = drizzle(client, { schema });
  await migrate(db, { migrationsFolder: migrationsFolder() });
  return { db: db as unknown as Db, close: () => client.close() };
}

async function openServer(url: string): Promise<Handle> {
  const { Pool } = await import("pg");
  const { drizzle } = await import("drizzle-orm/node-postgres");
  const { migrate } = await import("drizzle-orm/node-postgres/migrator");
  const pool = new Pool({ connectionString: url, max: Number(process.env.DB_POOL_SIZE ?? 10) });
  // Several instances may start at once against one server: one migrates, the others wait.
  const client = await pool.connect();
  try {
    await client.query("select pg_advisory_lock($1)", [MIGRATION_LOCK]);
    await migrate(drizzle(client, { schema }), { migrationsFolder: migrationsFolder() });
  } finally {
    await client.query("select pg_advisory_unlock($1)", [MIGRATION_LOCK]).catch(() => undefined);
    client.release();
  }
  return { db: drizzle(pool, { schema }) as unknown as Db, close: () => pool.end() };
}

async function open(): Promise<Handle> {
  const url = process.env.DATABASE_URL;
  const handle = url ? await openServer(url) : await openPglite();
  if (process.env.SEED !== "none") await seedDemoData(handle.db);
  return handle;
}

// One instance per process, kept across dev reloads: two PGlite instances on one folder lose data.
const KEY = Symbol.for("ratecourt.db");
type Holder = { [KEY]?: Promise<Handle> };
const holder = globalThis as Holder;

export async function getDb(): Promise<Db> {
  holder[KEY] ??= open().catch((error) => {
    holder[KEY] = undefined;
    throw error;
  });
  return (await holder[KEY]).db;
}

/** Closes the process's database (tests and scripts). */
export async function closeDb(): Promise<void> {
  const pending = holder[KEY];
  holder[KEY] = undefined;
  if (pending) await (await pending).close();
}
