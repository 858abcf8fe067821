// Tests never write into the working tree's data folder: a notice starts the local mail and
// object-store fakes, and they write into the test process's own folder.
import { existsSync, statSync } from "node:fs";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb, dataDir } from "@/lib/server/database";
import { notify } from "@/lib/server/notify";
import { flushMail, listCapturedMail } from "@/lib/mail";

const treeData = path.resolve(".data");
const modified = () => (existsSync(path.join(treeData, "mailroom.json")) ? statSync(path.join(treeData, "mailroom.json")).mtimeMs : 0);

afterAll(closeDb);

describe("the test data folder", () => {
  it("is a folder of the test process's own, outside the working tree", () => {
    expect(dataDir()).not.toBe(treeData);
    expect(path.relative(path.resolve("."), dataDir()).startsWith("..")).toBe(true);
  });

  it("receives the mail a notice sends, and the working tree's .data/ is left alone", async () => {
    const before = modified();
    notify([{ to: ["someone@tarnwell.example"], subject: "Data folder check", text: "Where does this go?" }]);
    for (let i = 0; i < 100 && !listCapturedMail().some((m) => m.subject === "Data folder check"); i++) {
      await flushMail();
      await new Promise((r) => setTimeout(r, 50));
    }
    expect(listCapturedMail().some((m) => m.subject === "Data folder check")).toBe(true);
    expect(existsSync(path.join(dataDir(), "mailroom.json"))).toBe(true);
    expect(modified()).toBe(before);
  });
});
