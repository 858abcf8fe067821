import { describe, expect, it } from "vitest";
import { demoMarkerFor } from "@/app/_components/demo-marker";
import { parseEnv } from "@/lib/env";
import { PRODUCTION_SETTINGS } from "../../support/env";

const production = PRODUCTION_SETTINGS;

describe("the demo marker", () => {
  it("shows in development and tests", () => {
    for (const NODE_ENV of ["development", "test"]) {
      expect(demoMarkerFor(parseEnv({ NODE_ENV }))?.props).toMatchObject({ "data-testid": "demo-marker", children: "demo" });
    }
  });

  it("shows in a production build started with DEMO=1, even with every production setting given", () => {
    expect(demoMarkerFor(parseEnv({ NODE_ENV: "production", DEMO: "1" }))).not.toBeNull();
    expect(demoMarkerFor(parseEnv({ ...production, DEMO: "1" }))).not.toBeNull();
  });

  it("never shows in production", () => {
    expect(demoMarkerFor(parseEnv(production))).toBeNull();
    expect(demoMarkerFor(parseEnv({ ...production, DEMO: "0" }))).toBeNull();
  });
});
