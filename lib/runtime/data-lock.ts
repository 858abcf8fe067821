// One process per data folder: PGlite loses data when two processes open the same files.
// A lock file names the holder's pid; it is removed at exit and taken over once that pid is gone
// (after a crash). A lock made of a pid suits the starter that holds the folder for the server
// it runs as a child (lock libraries based on file ages cannot hand a lock down to a child).
import fs from "node:fs";
import path from "node:path";

const LOCK_NAME = "server.lock";

export class DataFolderBusyError extends Error {
  override readonly name = "DataFolderBusyError";
  constructor(
    readonly folder: string,
    readonly holder: LockHolder,
  ) {
    super(
      `The data folder ${folder} is in use by process ${holder.pid} (${holder.what}, since ${holder.since}). ` +
        "One process per data folder: stop that process first, or give this one its own DATA_DIR.",
    );
  }
}

export type LockHolder = { pid: number; what: string; since: string };

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    // EPERM: the process exists but belongs to someone else.
    return (error as NodeJS.ErrnoException).code === "EPERM";
  }
}

function lockFile(folder: string): string {
  return path.join(folder, LOCK_NAME);
}

/** The live holder of the folder's lock, or null when it is free (or held by a dead process). */
export function dataFolderHolder(folder: string): LockHolder | null {
  try {
    const holder = JSON.parse(fs.readFileSync(lockFile(folder), "utf8")) as LockHolder;
    return Number.isInteger(holder.pid) && isAlive(holder.pid) ? holder : null;
  } catch {
    return null;
  }
}

/** Creates the data folder readable by its owner only (it holds the database, documents and the secret). */
export function ensurePrivateFolder(folder: string): void {
  fs.mkdirSync(folder, { recursive: true, mode: 0o700 });
  fs.chmodSync(folder, 0o700);
}

/**
 * Creates the folders a file of ours goes into, readable by their owner only, and leaves any that
 * exist as they are: a backup written to /tmp/x must not close /tmp to everybody else.
 */
export function ensureParentFolder(file: string): void {
  fs.mkdirSync(path.dirname(file), { recursive: true, mode: 0o700 });
}

const HELD = Symbol.for("ratecourt.data-lock");
type Held = { [HELD]?: Set<string> };

/**
 * Takes the folder's lock for this process's life. `sharedWith` names a parent process (the
 * starter) whose lock this process may use. Throws DataFolderBusyError when someone else holds it.
 */
export function holdDataFolder(folder: string, what: string, sharedWith?: number): void {
  const held = ((globalThis as Held)[HELD] ??= new Set());
  if (held.has(folder)) return;
  ensurePrivateFolder(folder);
  const file = lockFile(folder);
  for (let attempt = 0; attempt < 3; attempt++) {
    const holder = dataFolderHolder(folder);
    if (holder && (holder.pid === sharedWith || holder.pid === process.pid)) return;
    if (holder) throw new DataFolderBusyError(folder, holder);
    // A lock left by a dead process: remove it, then race the others to create ours.
    fs.rmSync(file, { force: true });
    const mine: LockHolder = { pid: process.pid, what, since: new Date().toISOString() };
    try {
      fs.writeFileSync(file, JSON.stringify(mine), { flag: "wx", mode: 0o600 });
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === "EEXIST") continue;
      throw error;
    }
    held.add(folder);
    process.once("exit", () => releaseDataFolder(folder));
    return;
  }
  const holder = dataFolderHolder(folder);
  throw new DataFolderBusyError(folder, holder ?? { pid: 0, what: "another process", since: "just now" });
}

/** Removes this process's lock (also done at exit). */
export function releaseDataFolder(folder: string): void {
  const held = (globalThis as Held)[HELD];
  if (!held?.delete(folder)) return;
  try {
    const holder = JSON.parse(fs.readFileSync(lockFile(folder), "utf8")) as LockHolder;
    if (holder.pid === process.pid) fs.rmSync(lockFile(folder), { force: true });
  } catch {
    // Already gone.
  }
}
