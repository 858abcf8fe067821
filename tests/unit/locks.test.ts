import { describe, expect, it } from "vitest";
import fs from "node:fs";
import path from "node:path";
import { ADVISORY_LOCKS } from "@/db/locks";

const root = path.resolve(import.meta.dirname, "../..");

function sourceFiles(dir: string): string[] {
  return fs.readdirSync(path.join(root, dir), { withFileTypes: true }).flatMap((entry) => {
    const rel = path.join(dir, entry.name);
    if (entry.isDirectory()) return entry.name === "node_modules" ? [] : sourceFiles(rel);
    return /\.tsx?$/.test(entry.name) ? [rel] : [];
  });
}

describe("advisory locks", () => {
  it("each use has its own id", () => {
    const ids = Object.values(ADVISORY_LOCKS);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it("are taken only through db/locks.ts, never with a number written in place", () => {
    const offenders = ["app", "lib", "db"].flatMap(sourceFiles).filter((file) => /pg_advisory\w*\(\s*\d/.test(fs.readFileSync(path.join(root, file), "utf8")));
    expect(offenders).toEqual([]);
  });
});
