import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { count, eq } from "drizzle-orm";
import { NextRequest } from "next/server";
import { approvalBands, ledgerEntries, tenders, users } from "@/db/schema";
import type { Db } from "@/db/client";
import { proxy } from "@/proxy";
import { BASE, closeDb, freshDatabase, signInAs } from "../support/app";

// Every route handler under /api/v1, found on disk, gets the same hostile requests: each must be
// refused with its 4xx, and nothing may change.

type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;
interface Route {
  file: string;
  url: string;
  paramNames: string[];
  method: string;
  handler: Handler;
  readsJson: boolean;
}

const apiRoot = path.resolve(import.meta.dirname, "../../app/api/v1");
const WRITES = new Set(["POST", "PUT", "PATCH", "DELETE"]);

async function routeHandlers(): Promise<Route[]> {
  const files: string[] = [];
  const walk = (dir: string) => {
    for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.name === "route.ts") files.push(full);
    }
  };
  walk(apiRoot);
  const routes: Route[] = [];
  for (const file of files) {
    const rel = path.relative(apiRoot, path.dirname(file)).split(path.sep).join("/");
    if (rel === "openapi.json") continue; // a static document, no input at all
    const mod = (await import(file)) as Record<string, Handler>;
    const source = fs.readFileSync(file, "utf8");
    const paramNames = [...rel.matchAll(/\[(\w+)\]/g)].map((m) => m[1]);
    for (const method of ["GET", "POST", "PUT", "PATCH", "DELETE"]) {
      if (!mod[method]) continue;
      routes.push({
        file: rel,
        url: `${BASE}/api/v1/${rel.replace(/\[(\w+)\]/g, "x")}`,
        paramNames,
        method,
        handler: mod[method],
        readsJson: method !== "DELETE" && source.includes("readJson"),
      });
    }
  }
  return routes;
}

let db: Db;
let admin: Headers;
let routes: Route[];
beforeAll(async () => {
  db = await freshDatabase();
  admin = await signInAs("admin@tarnwell.example");
  routes = await routeHandlers();
});
afterAll(closeDb);

const paramsOf = (route: Route, value: string) => ({ params: Promise.resolve(Object.fromEntries(route.paramNames.map((n) => [n, value]))) });
const someId = (route: Route) => paramsOf(route, crypto.randomUUID());

function call(route: Route, init: { headers?: Headers; body?: BodyInit; search?: string; params?: ReturnType<typeof paramsOf> } = {}) {
  const request = new Request(route.url + (init.search ?? ""), {
    method: route.method,
    headers: init.headers ?? admin,
    body: route.method === "GET" ? undefined : init.body,
    duplex: "half",
  } as RequestInit);
  return route.handler(request, init.params ?? someId(route));
}

const withHeaders = (extra: Record<string, string>, base = admin) => {
  const headers = new Headers(base);
  for (const [k, v] of Object.entries(extra)) headers.set(k, v);
  return headers;
};

async function snapshot() {
  const n = async (table: typeof tenders | typeof ledgerEntries | typeof approvalBands) => (await db.select({ n: count() }).from(table))[0].n;
  const [limits] = await db.select({ a: users.approvalLimit }).from(users).where(eq(users.email, "director@tarnwell.example"));
  return { tenders: await n(tenders), ledger: await n(ledgerEntries), bands: await n(approvalBands), limit: limits.a };
}

async function expectEvery(label: string, pick: (r: Route) => boolean, run: (r: Route) => Promise<Response>, status: number) {
  const before = await snapshot();
  const wrong: string[] = [];
  const chosen = routes.filter(pick);
  expect(chosen.length, label).toBeGreaterThan(0);
  for (const route of chosen) {
    const response = await run(route);
    if (response.status !== status) wrong.push(`${route.method} ${route.file}: ${response.status} ${await response.text()}`);
  }
  expect(wrong, label).toEqual([]);
  expect(await snapshot()).toEqual(before);
}

describe("bad bytes, on every route", () => {
  it("finds the route files", () => {
    expect(routes.length).toBeGreaterThan(30);
  });

  for (const [name, value] of [
    ["a NUL character", "\u0000"],
    ["a lone surrogate", "\ud800"],
    ["an undecodable %C0%AF", "%C0%AF"],
    ["an undecodable %ud800", "%ud800"],
  ]) {
    it(`answer 400 for ${name} in a URL id`, async () => {
      await expectEvery(
        name,
        (r) => r.paramNames.length > 0,
        (r) => call(r, { params: paramsOf(r, value), body: "{}", headers: withHeaders({ "content-type": "application/json" }) }),
        400,
      );
    });
  }

  it("answer 400 for a NUL character in a query parameter", async () => {
    await expectEvery(
      "query",
      (r) => r.method === "GET" && r.paramNames.length === 0,
      (r) => call(r, { search: "?tenderId=%00" }),
      400,
    );
  });

  for (const [name, text] of [
    ["a NUL character", '"a\\u0000b"'],
    ["a lone surrogate", '"a\\ud800b"'],
  ]) {
    it(`answer 400 for ${name} in any text field of a JSON body`, async () => {
      const body = `{"title":${text},"name":"x","nested":{"deep":[${text}]},"sha256":${text},"csv":${text}}`;
      await expectEvery(
        name,
        (r) => r.readsJson && WRITES.has(r.method),
        (r) => call(r, { body, headers: withHeaders({ "content-type": "application/json" }) }),
        400,
      );
    });
  }

  it("answer 413 for a JSON body past the limit that came without a Content-Length", async () => {
    const endless = () =>
      new ReadableStream<Uint8Array>({
        pull(controller) {
          controller.enqueue(new TextEncoder().encode(`"${"x".repeat(256 * 1024)}",`));
        },
      });
    await expectEvery(
      "chunked",
      (r) => r.readsJson && WRITES.has(r.method),
      (r) => call(r, { body: endless(), headers: withHeaders({ "content-type": "application/json" }) }),
      413,
    );
  });
});

describe("cross-site writes, on every route", () => {
  const json = { "content-type": "application/json" };
  it("refuse a foreign Origin with 403", async () => {
    await expectEvery(
      "foreign",
      (r) => WRITES.has(r.method),
      (r) => call(r, { body: "{}", headers: withHeaders({ ...json, origin: "https://evil.example" }) }),
      403,
    );
  });

  it('refuse "Origin: null" with 403', async () => {
    await expectEvery(
      "null",
      (r) => WRITES.has(r.method),
      (r) => call(r, { body: "{}", headers: withHeaders({ ...json, origin: "null" }) }),
      403,
    );
  });

  it("refuse a signed-in write without an Origin with 403", async () => {
    const headers = withHeaders(json);
    headers.delete("origin");
    await expectEvery(
      "none",
      (r) => WRITES.has(r.method),
      (r) => call(r, { body: "{}", headers }),
      403,
    );
  });

  it("refuse text/plain and form-encoded bodies with 415", async () => {
    const tender = JSON.stringify({ title: "Sneaked in" });
    for (const type of ["text/plain", "application/x-www-form-urlencoded"]) {
      await expectEvery(
        type,
        (r) => WRITES.has(r.method),
        (r) => call(r, { body: tender, headers: withHeaders({ "content-type": type }) }),
        415,
      );
    }
  });

  it("refuse multipart bodies outside the upload routes with 415", async () => {
    const form = () => {
      const f = new FormData();
      f.set("title", "Sneaked in");
      return f;
    };
    const uploads = /documents$|evidence\/import$|memo-check$/;
    await expectEvery(
      "multipart",
      (r) => r.readsJson && WRITES.has(r.method) && !uploads.test(r.file),
      (r) => call(r, { body: form() }),
      415,
    );
  });
});

describe("the proxy in front of pages and server actions", () => {
  const at = (url: string, init: RequestInit = {}) => proxy(new NextRequest(`${BASE}${url}`, init as ConstructorParameters<typeof NextRequest>[1]));
  const passes = (response: Response) => response.headers.get("x-middleware-next") === "1";

  it("answers 400 for page addresses that do not decode to clean text", async () => {
    for (const url of ["/tenders/%00", "/review/claims/%C0%AF", "/organisations/%ud800", "/tenders/%ED%A0%80/ledger", "/review?tenderId=%00"]) {
      const response = at(url);
      expect(response.status, url).toBe(400);
    }
    expect(passes(at("/tenders/3f0e1c2a-1111-4222-8333-944455556666/ledger"))).toBe(true);
  });

  it("answers 403 to a server action posted from another site, and lets our own through", async () => {
    const action = (origin: string | null) =>
      at("/tenders/new", {
        method: "POST",
        headers: { "next-action": "0123abcd", cookie: admin.get("cookie") ?? "", ...(origin ? { origin } : {}) },
        body: "[]",
      });
    expect(action("https://evil.example").status).toBe(403);
    expect(action("null").status).toBe(403);
    expect(action(null).status).toBe(403);
    expect(passes(action(BASE))).toBe(true);
  });
});
