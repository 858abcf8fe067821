// `npm run seed:scale [-- --tenders 200 --seed 2027]`: fills DATA_DIR (or the DATABASE_URL server)
// with the scale workload of db/seed-scale.ts. Stop the server first and start from an empty or
// freshly reset database (npm run db:reset): it holds the data folder as db:reset does.
import { parseArgs } from "node:util";
import { z } from "zod";
import { closeDb } from "./client";
import { FULL_SCALE, seedScale } from "./seed-scale";
import { parseEnv } from "@/lib/env";
import { flushMail } from "@/lib/mail/send";
import { holdDataFolder } from "@/lib/runtime/data-lock";

const argsSchema = z.object({
  tenders: z.coerce.number().int().min(4, "--tenders must be at least 4 (the demo's three and one more)").max(5000).default(FULL_SCALE.tenders),
  seed: z.coerce.number().int().default(FULL_SCALE.seed),
});

async function main() {
  const { values } = parseArgs({ options: { tenders: { type: "string" }, seed: { type: "string" } } });
  const parsed = argsSchema.safeParse(values);
  if (!parsed.success) throw new Error(parsed.error.issues.map((issue) => issue.message).join("\n"));
  const { DATA_DIR: dir, DATABASE_URL } = parseEnv();
  // Refuses while a server holds the folder, and keeps one from starting meanwhile.
  holdDataFolder(dir, "npm run seed:scale");
  console.log(`Filling ${DATABASE_URL ? "the PostgreSQL database" : dir} with ${parsed.data.tenders} tenders (seed ${parsed.data.seed})...`);
  const report = await seedScale({ ...parsed.data, log: (line) => console.log(`  ${line}`) });
  await flushMail();
  console.log(JSON.stringify(report, null, 2));
}

main()
  .catch((error) => {
    console.error(error instanceof Error ? error.message : error);
    process.exitCode = 1;
  })
  .finally(async () => {
    await closeDb();
    // The local mail and object-store fakes started for notices and memos keep the process alive.
    process.exit();
  });
