// Resets the demo: `npm run db:reset`. Stop the server first: one process per PGlite data folder.
import fs from "node:fs";
import path from "node:path";
import { CHECKPOINT_FILE } from "@/lib/ledger/anchors";
import { parseEnv } from "@/lib/env";
import { holdDataFolder } from "@/lib/runtime/data-lock";

async function main() {
  const { DATA_DIR: dir, DATABASE_URL } = parseEnv();
  // Refuses while a server holds the folder, and keeps one from starting meanwhile.
  holdDataFolder(dir, "npm run db:reset");
  if (DATABASE_URL) {
    const { default: pg } = await import("pg");
    const client = new pg.Client({ connectionString: DATABASE_URL });
    await client.connect();
    await client.query("drop schema if exists public cascade; drop schema if exists drizzle cascade; create schema public;");
    await client.end();
    // The signed checkpoints name entries of the emptied ledger.
    fs.rmSync(path.join(dir, CHECKPOINT_FILE), { force: true });
    console.log("Emptied the PostgreSQL database; the next start migrates it and loads the demo data.");
    return;
  }
  for (const name of ["pglite", "objects", "mailroom.json", CHECKPOINT_FILE]) {
    fs.rmSync(path.join(dir, name), { recursive: true, force: true });
  }
  console.log(`Removed the demo data in ${dir}; the next start creates it again.`);
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
