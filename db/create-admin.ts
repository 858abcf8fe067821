// `npm run admin:create -- --email … --name … --organisation …`: the first administrator of a
// production start, which loads no demo accounts. Prints a one-time random password.
import { randomBytes } from "node:crypto";
import { parseArgs } from "node:util";
import { z } from "zod";
import { count, eq } from "drizzle-orm";
import { closeDb, getDb } from "@/lib/server/database";
import { organisations, users } from "./schema";
import { insertUser } from "@/lib/server/people-store";
import { appendLedger } from "@/lib/server/ledger";

const argsSchema = z.object({
  email: z.email("--email must be an e-mail address"),
  name: z.string().trim().min(1, "--name is required").max(200),
  organisation: z.string().trim().min(1, "--organisation is required").max(200),
  country: z
    .string()
    .regex(/^[A-Z]{2}$/, "--country must be a two-letter code such as GB")
    .default("GB"),
});

async function main() {
  const { values } = parseArgs({
    options: { email: { type: "string" }, name: { type: "string" }, organisation: { type: "string" }, country: { type: "string" } },
  });
  const parsed = argsSchema.safeParse(values);
  if (!parsed.success) throw new Error(parsed.error.issues.map((issue) => issue.message).join("\n"));
  const input = parsed.data;
  const db = await getDb();
  const password = randomBytes(18).toString("base64url");
  await db.transaction(async (tx) => {
    const [{ n }] = await tx.select({ n: count() }).from(users).where(eq(users.email, input.email.toLowerCase()));
    if (n > 0) throw new Error(`An account for ${input.email} exists already.`);
    let [org] = await tx.select().from(organisations).where(eq(organisations.name, input.organisation));
    org ??= (await tx.insert(organisations).values({ name: input.organisation, kind: "buyer", country: input.country }).returning())[0];
    const user = await insertUser(tx, { name: input.name, email: input.email, password, organisationId: org.id, roles: ["admin"] });
    await appendLedger(tx, {
      actor: null,
      action: "user.created",
      subjectType: "User",
      subjectId: user.id,
      data: { email: user.email, roles: ["admin"], by: "admin:create" },
    });
  });
  console.log(`Created the administrator ${input.email}. One-time password (shown once, keep it safe):\n  ${password}`);
}

main()
  .catch((error) => {
    console.error(error instanceof Error ? error.message : error);
    process.exitCode = 1;
  })
  .finally(() => closeDb());
