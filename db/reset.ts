// Resets the demo: `npm run db:reset`. Stop the server first: one process per PGlite data folder.
import fs from "node:fs";
import path from "node:path";

const dir = path.resolve(process.env.DATA_DIR ?? ".data");

async function main() {
  if (process.env.DATABASE_URL) {
    const { default: pg } = await import("pg");
    const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await client.connect();
    await client.query("drop schema if exists public cascade; drop schema if exists drizzle cascade; create schema public;");
    await client.end();
    console.log("Emptied the PostgreSQL database; the next start migrates it and loads the demo data.");
    return;
  }
  for (const name of ["pglite", "objects", "mailroom.json"]) {
    fs.rmSync(path.join(dir, name), { recursive: true, force: true });
  }
  console.log(`Removed the demo data in ${dir}; the next start creates it again.`);
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
