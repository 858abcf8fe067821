import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { ledgerEntries, organisations, tenders } from "@/db/schema";
import { GET as listGet, POST as createPost } from "@/app/api/v1/tenders/route";
import { GET as tenderGet, PATCH as tenderPatch } from "@/app/api/v1/tenders/[id]/route";
import { POST as openPost } from "@/app/api/v1/tenders/[id]/open/route";
import { POST as cancelPost } from "@/app/api/v1/tenders/[id]/cancel/route";
import { startLocalServices, type LocalServices } from "@/lib/dev/services";
import { clearCapturedMail, flushMail, listCapturedMail } from "@/lib/mail";
import { verifyLedger } from "@/lib/server/ledger";
import { closeDueTenders } from "@/lib/server/tenders";
import { closeDb, freshDatabase, params, request, signInAll } from "../support/app";
import { tenderInput } from "../support/tender-input";

let db: Db;
let services: LocalServices;
let dataDir: string;
const org: Record<string, string> = {};
const as: Record<string, Headers> = {};

beforeAll(async () => {
  dataDir = mkdtempSync(path.join(tmpdir(), "ratecourt-tenders-"));
  services = await startLocalServices({ dataDir, smtpPort: 0, s3Port: 0 });
  db = await freshDatabase();
  for (const o of await db.select().from(organisations)) org[o.name] = o.id;
  Object.assign(as, await signInAll("buyer", "engineer", "approver", "admin", "kestrelink", "oxbow"));
});
afterAll(async () => {
  await flushMail();
  await closeDb();
  await services.stop();
  rmSync(dataDir, { recursive: true, force: true });
});
beforeEach(() => clearCapturedMail());

const inAWeek = () => new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);
const draftBody = (extra: Record<string, unknown> = {}) =>
  tenderInput({ closesLocal: `${inAWeek()}T12:00`, invitedOrgIds: [org["Kestrelink Radio"], org["Marram Telemetry"]], ...extra });

const post = (headers: Headers, body: unknown) => createPost(request("/api/v1/tenders", { method: "POST", headers, body }), undefined);
const patch = (headers: Headers, id: string, body: unknown) =>
  tenderPatch(request(`/api/v1/tenders/${id}`, { method: "PATCH", headers, body }), params({ id }));
const open = (headers: Headers, id: string) => openPost(request(`/api/v1/tenders/${id}/open`, { method: "POST", headers }), params({ id }));
const cancel = (headers: Headers, id: string, body: unknown) =>
  cancelPost(request(`/api/v1/tenders/${id}/cancel`, { method: "POST", headers, body }), params({ id }));
const get = (headers: Headers, id: string) => tenderGet(request(`/api/v1/tenders/${id}`, { headers }), params({ id }));
const row = async (id: string) => (await db.select().from(tenders).where(eq(tenders.id, id)))[0];
/** The mail sent so far about the tender with this reference, and who it went to. */
const mailOf = async (reference: string) => {
  await flushMail();
  return listCapturedMail().filter((m) => m.subject.includes(reference));
};
const recipients = (mail: { to: string[] }[]) => mail.flatMap((m) => m.to).sort();
const closingTimePassed = (id: string) =>
  db
    .update(tenders)
    .set({ closesAt: new Date(Date.now() - 1000) })
    .where(eq(tenders.id, id));
const entries = (tenderId: string, action: string) =>
  db
    .select()
    .from(ledgerEntries)
    .where(and(eq(ledgerEntries.tenderId, tenderId), eq(ledgerEntries.action, action)));
const tenderCount = async () => (await db.select().from(tenders)).length;

async function createDraft(extra: Record<string, unknown> = {}): Promise<string> {
  const response = await post(as.buyer, draftBody(extra));
  expect(response.status).toBe(201);
  return (await response.json()).id;
}

describe("drafting a tender", () => {
  it("lets the buyer create a numbered draft, stored with its closing instant, and records it", async () => {
    const response = await post(as.buyer, draftBody());
    expect(response.status).toBe(201);
    const tender = await response.json();
    expect(tender.reference).toMatch(new RegExp(`^RC-${new Date().getUTCFullYear()}-\\d{3}$`));
    expect(tender.state).toBe("draft");
    expect(tender.invitedOrgIds.sort()).toEqual([org["Kestrelink Radio"], org["Marram Telemetry"]].sort());
    const stored = await row(tender.id);
    // Noon in Berlin is 11:00 or 10:00 UTC, depending on the season.
    expect([10, 11]).toContain(stored.closesAt.getUTCHours());
    expect(stored.closesZone).toBe("Europe/Berlin");
    const [created] = await entries(tender.id, "tender.created");
    expect(created.data).toMatchObject({ reference: tender.reference, invited: ["Kestrelink Radio", "Marram Telemetry"] });
    expect(created.actorLabel).toBe("Ines Calloway");
  });

  it("marks a draft safety-relevant when the buyer says so, records the change, and defaults to not", async () => {
    expect((await row(await createDraft())).safetyRelevant).toBe(false);
    const id = await createDraft({ safetyRelevant: true });
    expect((await row(id)).safetyRelevant).toBe(true);
    expect((await patch(as.buyer, id, { safetyRelevant: "yes" })).status).toBe(400);
    expect((await patch(as.buyer, id, { safetyRelevant: false })).status).toBe(200);
    expect((await row(id)).safetyRelevant).toBe(false);
    const [updated] = await entries(id, "tender.updated");
    expect(JSON.stringify(updated.data)).toMatch(/safetyRelevant/);
  });

  it("gives each new draft its own reference", async () => {
    const a = await (await post(as.buyer, draftBody())).json();
    const b = await (await post(as.buyer, draftBody())).json();
    expect(a.reference).not.toBe(b.reference);
  });

  it("refuses engineers, approvers, admins and vendors (403), writing nothing", async () => {
    const before = await tenderCount();
    for (const who of ["engineer", "approver", "admin", "kestrelink"]) {
      const response = await post(as[who], draftBody());
      expect(response.status, who).toBe(403);
    }
    expect(await tenderCount()).toBe(before);
  });

  it("answers 400 naming the fields, and 401 when signed out", async () => {
    const before = await tenderCount();
    const response = await post(
      as.buyer,
      draftBody({
        currency: "euro",
        operatingPoints: [{ label: "x", value: 0.7 }],
        weights: { technical: 0, evidence: 0, price: 0, leadTime: 0, warranty: 0 },
      }),
    );
    expect(response.status).toBe(400);
    expect(Object.keys((await response.json()).fieldErrors)).toEqual(expect.arrayContaining(["currency", "operatingPoints.0.value", "weights"]));
    expect((await post(new Headers(), draftBody())).status).toBe(401);
    expect(await tenderCount()).toBe(before);
  });

  it("invites vendor organisations only", async () => {
    const response = await post(as.buyer, draftBody({ invitedOrgIds: [org["Tarnwell Water Authority"]] }));
    expect(response.status).toBe(400);
    expect((await response.json()).fieldErrors).toHaveProperty("invitedOrgIds");
  });

  it("edits a draft and records the changed fields", async () => {
    const id = await createDraft();
    const response = await patch(as.buyer, id, { quantity: 300, invitedOrgIds: [org["Oxbow Wireless"]] });
    expect(response.status).toBe(200);
    expect((await row(id)).quantity).toBe(300);
    const [updated] = await entries(id, "tender.updated");
    expect(updated.data.fields).toEqual(["invitedOrgIds", "quantity"]);
    expect(updated.data.changes).toMatchObject({ quantity: { from: 250, to: 300 } });
  });

  it("refuses an edit that breaks the draft as a whole, and changes nothing", async () => {
    const id = await createDraft();
    // A penalty rule needs points; the draft has none, so the change alone is not enough.
    const response = await patch(as.buyer, id, { impossibleRule: "penalty" });
    expect(response.status).toBe(400);
    expect((await response.json()).fieldErrors).toHaveProperty(["impossiblePenalty"]);
    expect((await row(id)).impossibleRule).toBe("disqualify");
    expect(await entries(id, "tender.updated")).toHaveLength(0);
  });
});

describe("opening a tender", () => {
  it("refuses to open without invitations, saying why (409)", async () => {
    const id = await createDraft({ invitedOrgIds: [] });
    const response = await open(as.buyer, id);
    expect(response.status).toBe(409);
    expect((await response.json()).error).toMatch(/Invite at least one vendor organisation/);
    expect((await row(id)).state).toBe("draft");
  });

  it("opens, records it and e-mails each invited user once", async () => {
    const id = await createDraft();
    const response = await open(as.buyer, id);
    expect(response.status).toBe(200);
    const stored = await row(id);
    expect(stored.state).toBe("open");
    expect(stored.openedAt).toBeInstanceOf(Date);
    expect(await entries(id, "tender.opened")).toHaveLength(1);

    const mail = await mailOf(stored.reference);
    expect(recipients(mail)).toEqual(["offers@marram.example", "sales@kestrelink.example"]);
    expect(mail[0].subject).toContain("Culvert sensor radios");
    expect(mail[0].text).toContain("(Europe/Berlin)");
    expect(mail[0].text).toContain(`/tenders/${id}`);
  });

  it("locks requirements once open: an edit answers 409 and changes nothing", async () => {
    const id = await createDraft();
    expect((await open(as.buyer, id)).status).toBe(200);
    const response = await patch(as.buyer, id, { weights: { technical: 0, evidence: 0, price: 100, leadTime: 0, warranty: 0 } });
    expect(response.status).toBe(409);
    expect((await response.json()).error).toMatch(/locked/);
    expect((await row(id)).weights).toEqual({ technical: 40, evidence: 15, price: 30, leadTime: 10, warranty: 5 });
    expect(await entries(id, "tender.updated")).toHaveLength(0);
    expect((await open(as.buyer, id)).status).toBe(409);
  });

  it("lets no engineer or vendor open a tender (403)", async () => {
    const id = await createDraft();
    expect((await open(as.engineer, id)).status).toBe(403);
    expect((await row(id)).state).toBe("draft");
  });
});

describe("who sees a tender", () => {
  it("hides it from a vendor not invited, and shows an invited one only its own invitation", async () => {
    const id = await createDraft();
    await open(as.buyer, id);
    expect((await get(as.oxbow, id)).status).toBe(403);
    const oxbowList = await (await listGet(request("/api/v1/tenders?size=100", { headers: as.oxbow }), undefined)).json();
    expect(oxbowList.tenders.map((t: { id: string }) => t.id)).not.toContain(id);

    const seen = await (await get(as.kestrelink, id)).json();
    expect(seen.invitedOrgIds).toEqual([org["Kestrelink Radio"]]);
    expect(seen.invited).toEqual([{ id: org["Kestrelink Radio"], name: "Kestrelink Radio" }]);
  });

  it("keeps drafts from vendors, even invited ones", async () => {
    const id = await createDraft();
    expect((await get(as.kestrelink, id)).status).toBe(403);
    expect((await get(as.buyer, id)).status).toBe(200);
    expect((await get(as.buyer, "no-such-tender")).status).toBe(404);
  });
});

describe("cancelling a tender", () => {
  it("needs a reason of at least ten characters, and changes nothing without one", async () => {
    const id = await createDraft();
    expect((await cancel(as.buyer, id, {})).status).toBe(400);
    expect((await cancel(as.buyer, id, { reason: "no money" })).status).toBe(400);
    expect((await row(id)).state).toBe("draft");
    expect(await entries(id, "tender.cancelled")).toHaveLength(0);
  });

  it("cancels an open tender with its reason, and tells the invited vendors and the buyers", async () => {
    const id = await createDraft();
    await open(as.buyer, id);
    await flushMail();
    clearCapturedMail();
    expect((await cancel(as.kestrelink, id, { reason: "Vendors may not cancel tenders." })).status).toBe(403);
    const response = await cancel(as.buyer, id, { reason: "The culvert programme was postponed a year." });
    expect(response.status).toBe(200);
    const stored = await row(id);
    expect(stored.state).toBe("cancelled");
    expect(stored.cancelReason).toBe("The culvert programme was postponed a year.");
    const [entry] = await entries(id, "tender.cancelled");
    expect(entry.data).toMatchObject({ from: "open", reason: "The culvert programme was postponed a year." });

    const mail = await mailOf(stored.reference);
    expect(recipients(mail)).toEqual(["buyer@tarnwell.example", "offers@marram.example", "sales@kestrelink.example"]);
    expect(mail[0].text).toContain("postponed a year");
    expect((await cancel(as.buyer, id, { reason: "Cancelling it a second time." })).status).toBe(409);
  });
});

describe("closing on time", () => {
  it("moves an open tender past its closing time to technical evaluation, by the system", async () => {
    const id = await createDraft();
    await open(as.buyer, id);
    const later = await createDraft();
    await open(as.buyer, later);
    await closingTimePassed(id);

    expect(await closeDueTenders(db)).toBe(1);
    expect((await row(id)).state).toBe("technical");
    expect((await row(later)).state).toBe("open");
    const [closed] = await entries(id, "tender.closed");
    expect(closed.actorId).toBeNull();
    expect(closed.actorLabel).toBe("system");
    expect(await closeDueTenders(db)).toBe(0);
  });

  it("closes on read: the list itself moves a tender whose time has come", async () => {
    const id = await createDraft();
    await open(as.buyer, id);
    await closingTimePassed(id);
    const list = await (await listGet(request("/api/v1/tenders?size=100", { headers: as.engineer }), undefined)).json();
    expect(list.tenders.find((t: { id: string }) => t.id === id)?.state).toBe("technical");
    expect(await entries(id, "tender.closed")).toHaveLength(1);
  });
});

describe("closing on read of one tender", () => {
  it("closes a tender whose time has come when it alone is read, once, and then reads it closed", async () => {
    const id = await createDraft();
    await open(as.buyer, id);
    await closingTimePassed(id);
    const [first, second] = await Promise.all([get(as.engineer, id), get(as.buyer, id)]);
    expect((await first.json()).state).toBe("technical");
    expect((await second.json()).state).toBe("technical");
    expect(await entries(id, "tender.closed")).toHaveLength(1);
  });
});

describe("the ledger", () => {
  it("still verifies as one chain after all of the above", async () => {
    const report = await verifyLedger(db);
    // The whole report, so that a failure says where the chain broke and why.
    expect(report).toMatchObject({ ok: true });
    expect(report.entries).toBeGreaterThan(20);
  });
});
