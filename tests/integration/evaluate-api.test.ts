import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST } from "@/app/api/v1/evaluate/route";
import { evaluateClaim } from "@/lib/bounds";
import { closeDb, freshDatabase, request, signInAs } from "../support/app";

let headers: Headers;
beforeAll(async () => {
  await freshDatabase();
  headers = await signInAs("engineer@tarnwell.example");
});
afterAll(closeDb);

const honest = { channel: { model: "bsc", p: 1e-3 }, code: { n: 2048, k: 1640 }, target: { metric: "bler", value: 1e-4 } };
const beyond = { channel: { model: "bsc", p: 1e-2 }, code: { overhead: 0.07 }, target: { metric: "ber", value: 1e-12 } };
const call = (body: unknown, h: Headers | undefined = headers) => POST(request("/api/v1/evaluate", { method: "POST", headers: h, body }), undefined);

describe("POST /api/v1/evaluate", () => {
  it("returns the engine's result for one claim, the same as calling the engine", async () => {
    const response = await call(honest);
    expect(response.status).toBe(200);
    const result = await response.json();
    expect(result).toEqual(JSON.parse(JSON.stringify(evaluateClaim(honest as never))));
    expect(result).toHaveProperty("engineVersion");
    expect(["impossible", "needs-evidence", "plausible"]).toContain(result.verdict);
  });

  it("returns results in order for an array", async () => {
    const response = await call([honest, beyond, honest]);
    expect(response.status).toBe(200);
    const results = await response.json();
    expect(results).toHaveLength(3);
    expect(results[1].verdict).toBe("impossible");
    expect(results[0]).toEqual(results[2]);
  });

  it("accepts exactly 1,000 claims and refuses 1,001 with a message", async () => {
    const ok = await call(Array.from({ length: 1000 }, () => beyond));
    expect(ok.status).toBe(200);
    expect(await ok.json()).toHaveLength(1000);
    const tooMany = await call(Array.from({ length: 1001 }, () => beyond));
    expect(tooMany.status).toBe(400);
    expect((await tooMany.json()).error).toMatch(/At most 1000 claims/);
  });

  it("names the field and its position for bad input", async () => {
    const response = await call([honest, { ...honest, code: { n: 100, k: 200 } }]);
    expect(response.status).toBe(400);
    const body = await response.json();
    expect(body.error).toContain("[1] code.k: must be at most n (100)");
    expect(body.fieldErrors).toHaveProperty(["1.code.k"]);
  });

  it("refuses unknown models and out-of-range values with the allowed range", async () => {
    const unknown = await call({ ...honest, channel: { model: "awgn-plus", p: 0.1 } });
    expect(unknown.status).toBe(400);
    expect((await unknown.json()).error).toMatch(/channel/);
    const range = await call({ ...honest, channel: { model: "bsc", p: 0.7 } });
    expect(range.status).toBe(400);
    expect((await range.json()).error).toMatch(/channel.p: must be at most 0.5/);
  });

  it("answers 400 for malformed JSON and 401 when signed out", async () => {
    const malformed = await POST(request("/api/v1/evaluate", { method: "POST", headers, rawBody: "[{" }), undefined);
    expect(malformed.status).toBe(400);
    const signedOut = await call(honest, new Headers());
    expect(signedOut.status).toBe(401);
  });
  it("judges a sensitivity claim with the radio fields, the same as the engine, and refuses bad radio input in its place", async () => {
    const radio = {
      channel: { model: "biawgn", sensitivityDbm: -121.5, bitRate: 1200, noiseFigureDb: 2, assumedNoiseFigureDb: 4 },
      code: { n: 1024, k: 512, modulation: "qpsk" },
      target: { metric: "bler", value: 1e-4 },
    };
    const response = await call(radio);
    expect(response.status).toBe(200);
    const result = await response.json();
    expect(result).toEqual(JSON.parse(JSON.stringify(evaluateClaim(radio as never))));
    expect(Object.keys(result)).toEqual(expect.arrayContaining(["spherePacking", "energy", "implied"]));
    expect(result.thresholds.spherePacking).toBeCloseTo(1.0953, 4);
    const bad = await call([radio, { ...radio, channel: { ...radio.channel, bitRate: -1 } }]);
    expect(bad.status).toBe(400);
    expect(JSON.stringify(await bad.json())).toMatch(/channel\.bitRate: must be above 0/);
  });
});
