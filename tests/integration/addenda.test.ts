import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, count, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { ledgerEntries, offers, tenders } from "@/db/schema";
import { GET as addendaGet, POST as addendaPost } from "@/app/api/v1/tenders/[id]/addenda/route";
import { POST as acknowledgePost } from "@/app/api/v1/addenda/[id]/acknowledge/route";
import { POST as submitPost } from "@/app/api/v1/tenders/[id]/offers/route";
import { clearCapturedMail } from "@/lib/mail";
import { mailAbout } from "../support/mail";
import { closeDb, freshDatabase, params, request, signInAs } from "../support/app";
import { weirsOffer } from "../support/offer-fixtures";

let db: Db;
let weirs = "";
let reference = "";

const offer = weirsOffer("Weir module");
const ADDENDUM = { title: "Mounting height", body: "The gauges are mounted 4 m above the weir crest; quote antennas for that height." };

const publish = async (email: string, body: unknown) =>
  addendaPost(request(`/api/v1/tenders/${weirs}/addenda`, { method: "POST", headers: await signInAs(email), body }), params({ id: weirs }));
const list = async (email: string) =>
  (await addendaGet(request(`/api/v1/tenders/${weirs}/addenda`, { headers: await signInAs(email) }), params({ id: weirs }))).json();
const submit = async (email: string) =>
  submitPost(request(`/api/v1/tenders/${weirs}/offers`, { method: "POST", headers: await signInAs(email), body: offer }), params({ id: weirs }));
const acknowledge = async (email: string, id: string) =>
  acknowledgePost(request(`/api/v1/addenda/${id}/acknowledge`, { method: "POST", headers: await signInAs(email) }), params({ id }));
const offersOf = async () => (await db.select({ n: count() }).from(offers).where(eq(offers.tenderId, weirs)))[0].n;

beforeAll(async () => {
  db = await freshDatabase();
  [{ id: weirs, reference }] = await db.select({ id: tenders.id, reference: tenders.reference }).from(tenders).where(eq(tenders.reference, "RC-2027-003"));
});
afterAll(closeDb);

describe("addenda", () => {
  let addendumId = "";

  it("the buyer publishes one to every invited vendor, without the name of whoever asked, with a ledger entry", async () => {
    clearCapturedMail();
    const published = await publish("buyer@tarnwell.example", ADDENDUM);
    expect(published.status).toBe(201);
    addendumId = (await published.json()).id;
    const [entry] = await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.tenderId, weirs), eq(ledgerEntries.action, "addendum.published")));
    expect(entry.data).toMatchObject({ title: ADDENDUM.title });
    const mail = await mailAbout(`${reference}: addendum`, 4);
    expect(mail.every((m) => m.text.includes(ADDENDUM.body) && /Acknowledge it on the Notices tab/.test(m.text))).toBe(true);
    // One e-mail per vendor address: no bidder learns who else was invited.
    expect(mail.map((m) => m.to.join()).sort()).toEqual([
      "bids@oxbow.example",
      "offers@marram.example",
      "sales@kestrelink.example",
      "tenders@quillfield.example",
    ]);
  });

  it("vendors read it without the thread it came from; a role that may not publish is refused", async () => {
    const seen = await list("bids@oxbow.example");
    expect(seen.addenda).toEqual([expect.objectContaining({ number: 1, title: ADDENDUM.title, acknowledgedAt: null })]);
    expect(seen.addenda[0]).not.toHaveProperty("threadId");
    expect(seen.mayPublish).toBe(false);
    expect((await publish("bids@oxbow.example", ADDENDUM)).status).toBe(403);
    expect((await publish("approver@tarnwell.example", ADDENDUM)).status).toBe(403);
    expect((await publish("buyer@tarnwell.example", { title: "x", body: "" })).status).toBe(400);
  });

  it("a vendor cannot submit until it has acknowledged every addendum, and is told which", async () => {
    const before = await offersOf();
    const refused = await submit("bids@oxbow.example");
    expect(refused.status).toBe(409);
    expect((await refused.json()).error).toMatch(/Acknowledge addendum 1 "Mounting height" on the tender's Notices tab before you submit/);
    expect(await offersOf()).toBe(before);

    expect((await acknowledge("bids@oxbow.example", addendumId)).status).toBe(200);
    expect((await acknowledge("bids@oxbow.example", addendumId)).status).toBe(200);
    const acks = await db
      .select()
      .from(ledgerEntries)
      .where(and(eq(ledgerEntries.tenderId, weirs), eq(ledgerEntries.action, "addendum.acknowledged")));
    expect(acks).toHaveLength(1);
    expect((await submit("bids@oxbow.example")).status).toBe(201);
    expect((await list("buyer@tarnwell.example")).addenda[0].acknowledgedBy).toEqual(["Oxbow Wireless"]);
  });

  it("only an invited vendor acknowledges, and a missing addendum is not found", async () => {
    expect((await acknowledge("engineer@tarnwell.example", addendumId)).status).toBe(403);
    expect((await acknowledge("bids@oxbow.example", "no-such-addendum")).status).toBe(404);
  });
});
