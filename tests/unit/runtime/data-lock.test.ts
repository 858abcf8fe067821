import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { spawnSync } from "node:child_process";
import { afterEach, describe, expect, it } from "vitest";
import { DataFolderBusyError, dataFolderHolder, holdDataFolder, releaseDataFolder } from "@/lib/runtime/data-lock";

const folders: string[] = [];
function folder(): string {
  const dir = path.join(fs.mkdtempSync(path.join(os.tmpdir(), "rc-lock-")), "data");
  folders.push(dir);
  return dir;
}

function writeLock(dir: string, pid: number) {
  fs.mkdirSync(dir, { recursive: true });
  fs.writeFileSync(path.join(dir, "server.lock"), JSON.stringify({ pid, what: "npm start", since: "2026-01-01T00:00:00Z" }));
}

/** A pid that is certainly not running: a child that has already exited. */
function deadPid(): number {
  return spawnSync(process.execPath, ["-e", "0"]).pid!;
}

afterEach(() => {
  for (const dir of folders.splice(0)) releaseDataFolder(dir);
});

describe("one process per data folder", () => {
  it("takes a free folder, makes it private, and gives it back", () => {
    const dir = folder();
    holdDataFolder(dir, "test");
    expect(dataFolderHolder(dir)?.pid).toBe(process.pid);
    expect(fs.statSync(dir).mode & 0o777).toBe(0o700);
    expect(fs.statSync(path.join(dir, "server.lock")).mode & 0o777).toBe(0o600);
    releaseDataFolder(dir);
    expect(dataFolderHolder(dir)).toBeNull();
  });

  it("refuses a folder that a live process holds, naming it", () => {
    const dir = folder();
    writeLock(dir, process.ppid);
    expect(() => holdDataFolder(dir, "second server")).toThrow(DataFolderBusyError);
    expect(() => holdDataFolder(dir, "second server")).toThrow(`in use by process ${process.ppid} (npm start`);
  });

  it("lets the server use the lock of the starter that runs it", () => {
    const dir = folder();
    writeLock(dir, process.ppid);
    expect(() => holdDataFolder(dir, "server", process.ppid)).not.toThrow();
  });

  it("takes over the lock of a process that crashed", () => {
    const dir = folder();
    writeLock(dir, deadPid());
    holdDataFolder(dir, "after a crash");
    expect(dataFolderHolder(dir)?.pid).toBe(process.pid);
  });
});
