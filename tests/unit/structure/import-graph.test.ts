// The import graph of app, lib, db and policies has no cycle (issue 12): the database client
// opens and migrates only, and the bootstrap step that seeds the demo sits above the data layer.
// Every static import, re-export and dynamic import counts, type-only ones too, as madge counts
// them (`npx madge --circular --extensions ts,tsx app lib db policies` says the same).
import { existsSync, readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../../..");
const ROOTS = ["app", "lib", "db", "policies"];

const sources = (dir: string): string[] =>
  readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? sources(full) : /\.tsx?$/.test(name) && !name.endsWith(".d.ts") ? [full] : [];
  });

/** A specifier resolved to one of our files, or null for a package or a non-source file. */
function resolve(from: string, spec: string): string | null {
  const base = spec.startsWith("@/") ? path.join(root, spec.slice(2)) : spec.startsWith(".") ? path.resolve(path.dirname(from), spec) : null;
  if (!base) return null;
  for (const file of [base, `${base}.ts`, `${base}.tsx`, path.join(base, "index.ts"), path.join(base, "index.tsx")]) {
    if (/\.tsx?$/.test(file) && existsSync(file) && statSync(file).isFile()) return file;
  }
  return null;
}

const SPECIFIERS = [/\bfrom\s+"([^"]+)"/g, /^\s*import\s+"([^"]+)"/gm, /\bimport\(\s*(?:\/\*.*?\*\/\s*)?"([^"]+)"\s*\)/g];

function importGraph(): Map<string, string[]> {
  const graph = new Map<string, string[]>();
  for (const file of ROOTS.flatMap((dir) => sources(path.join(root, dir)))) {
    const text = readFileSync(file, "utf8");
    const targets = SPECIFIERS.flatMap((pattern) => [...text.matchAll(pattern)].map((m) => resolve(file, m[1])));
    graph.set(file, [...new Set(targets.filter((t): t is string => t !== null))]);
  }
  return graph;
}

/** One cycle per strongly connected component of more than one file (Tarjan), or a file importing itself. */
function cycles(graph: Map<string, string[]>): string[][] {
  let next = 0;
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const found: string[][] = [];
  const visit = (v: string) => {
    index.set(v, next);
    low.set(v, next++);
    stack.push(v);
    onStack.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!index.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v)!, index.get(w)!));
    }
    if (low.get(v) !== index.get(v)) return;
    const component: string[] = [];
    let w: string;
    do {
      w = stack.pop()!;
      onStack.delete(w);
      component.push(path.relative(root, w));
    } while (w !== v);
    if (component.length > 1 || graph.get(v)?.includes(v)) found.push(component.sort());
  };
  for (const v of graph.keys()) if (!index.has(v)) visit(v);
  return found;
}

describe("the import graph", () => {
  const graph = importGraph();

  it("reads the project's own imports", () => {
    expect(graph.size).toBeGreaterThan(200);
    expect(graph.get(path.join(root, "lib/server/database.ts"))).toContain(path.join(root, "db/seed.ts"));
  });

  it("has no cycle", () => {
    expect(cycles(graph)).toEqual([]);
  });

  it("keeps the database client below the data layer and the seed", () => {
    const client = graph.get(path.join(root, "db/client.ts")) ?? [];
    expect(client.map((f) => path.relative(root, f)).filter((f) => f.startsWith("lib/server/") || f.startsWith("db/seed"))).toEqual([]);
  });
});
