import "server-only";
import fs from "node:fs";
import path from "node:path";
import { randomBytes } from "node:crypto";
import { dataDir } from "@/db/client";
import { env } from "@/lib/env";
import { ensurePrivateFolder } from "@/lib/runtime/data-lock";

// On globalThis, so that a development reload keeps the secrets it made.
const KEY = Symbol.for("ratecourt.secrets");
const made = ((globalThis as { [KEY]?: Map<string, string> })[KEY] ??= new Map());

/**
 * A secret from its setting or, in demo mode, one made once and kept in the data folder (owner
 * only). With an in-memory database, or a server database unless `fileWithServerDb`, it lives as
 * long as the process.
 */
export function keptSecret(fromSetting: string | undefined, fileName: string, fileWithServerDb = false): string {
  if (fromSetting) return fromSetting;
  const { DB_MEMORY, DATABASE_URL } = env();
  if (DB_MEMORY || (DATABASE_URL && !fileWithServerDb)) {
    if (!made.has(fileName)) made.set(fileName, randomBytes(32).toString("hex"));
    return made.get(fileName)!;
  }
  const file = path.join(dataDir(), fileName);
  if (!fs.existsSync(file)) {
    ensurePrivateFolder(dataDir());
    fs.writeFileSync(file, randomBytes(32).toString("hex"), { mode: 0o600 });
  }
  return fs.readFileSync(file, "utf8").trim();
}
