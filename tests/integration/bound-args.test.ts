// Server actions that take ids (or a path) as separate, bound arguments check them for bad text
// (NUL, a lone surrogate) in one place, attemptForm, before any lib/server function runs; and
// every such action hands all of its bound arguments to it.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { attemptForm } from "@/lib/server/form-action";
import { openTenderAction } from "@/app/(app)/tenders/actions";
import { withdrawOfferAction } from "@/app/(app)/tenders/[id]/offer/actions";
import { acknowledgeAddendumAction } from "@/app/(app)/tenders/[id]/notices/actions";
import { postMessageAction } from "@/app/(app)/threads/actions";

const BAD_IDS = { nul: "tender\u0000", surrogate: "tender\ud800" };

describe("bound arguments of server actions", () => {
  it.each(Object.entries(BAD_IDS))("are refused with %s before the work runs", async (_, id) => {
    let ran = false;
    const outcome = await attemptForm(z.object({}), {}, async () => ((ran = true), 1), { tenderId: id });
    expect(ran).toBe(false);
    expect(outcome).toEqual({
      ok: false,
      result: { message: expect.stringMatching(/^The tenderId of this request contains a NUL character or a broken Unicode character/) },
    });
  });

  it("are refused when they are not text", async () => {
    const outcome = await attemptForm(z.object({}), {}, async () => 1, { tenderId: { id: "x" } });
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(outcome.result.message).toBe("The tenderId of this request is missing or not text: reload the page and try again.");
  });

  it("are refused by the actions themselves, whichever argument holds the bad text", async () => {
    expect((await openTenderAction(BAD_IDS.nul)).message).toMatch(/^The tenderId of this request contains/);
    expect((await withdrawOfferAction("tender-1", BAD_IDS.surrogate)).message).toMatch(/^The offerId of this request contains/);
    expect((await acknowledgeAddendumAction("tender-1", BAD_IDS.nul)).message).toMatch(/^The addendumId of this request contains/);
    expect((await postMessageAction("thread-1", BAD_IDS.surrogate, { body: "A clean message." })).message).toMatch(/^The path of this request contains/);
  });

  it("are all handed to attemptForm or runForm by every action", () => {
    const files: string[] = [];
    const walk = (dir: string) => {
      for (const name of readdirSync(dir)) {
        const full = path.join(dir, name);
        if (statSync(full).isDirectory()) walk(full);
        else if (name === "actions.ts") files.push(full);
      }
    };
    walk(path.resolve("app"));
    expect(files.length).toBeGreaterThan(5);
    const unchecked: string[] = [];
    for (const file of files) {
      const source = readFileSync(file, "utf8");
      const actions = [...source.matchAll(/export async function (\w+)\(([^)]*)\)[^{]*\{([\s\S]*?)\n\}/g)];
      for (const [, name, params, body] of actions) {
        const bound = params
          .split(",")
          .map((p) => p.split(":")[0].trim())
          .filter((p) => p && !["values", "_prev", "formData"].includes(p));
        if (bound.length === 0) continue;
        const handed = new RegExp(`\\{\\s*${bound.join(",\\s*")},?\\s*\\},?\\s*\\)`);
        if (!/(?:runForm|attemptForm)\(/.test(body) || !handed.test(body)) unchecked.push(`${path.relative(".", file)} ${name}(${bound.join(", ")})`);
      }
    }
    expect(unchecked).toEqual([]);
  });
});
