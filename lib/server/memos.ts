import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import { asSubject, defineAbilityFor } from "@/policies";
import { getDb, type Queryable } from "./database";
import {
  approvals,
  claims,
  declarations,
  evidenceRuns,
  marks,
  memoPreviews,
  memos,
  offers,
  organisations,
  technicalSignoffs,
  tenders,
  users,
} from "@/db/schema";
import { CAUTIONS } from "@/lib/cautions";
import { memoDocument, type MemoFacts } from "@/lib/approvals/memo-content";
import { memoIdentifier } from "@/lib/approvals/routing";
import type { Head } from "@/lib/ledger/head";
import { renderMemo } from "@/lib/pdf/memo";
import { latestMarks } from "@/lib/review/marks";
import { countedStatus } from "@/lib/review/evidence";
import { getObject, isObjectNotFound, putObject, sha256Hex } from "@/lib/storage";
import { ConflictError, ForbiddenError, NotFoundError } from "./errors";
import { currentHead } from "./ledger-anchors";
import { issuedHead, type IssuedHead } from "./ledger-check";
import { getCurrentRecommendation, type RecommendationRow } from "./recommendations";
import { ensureLocalServices } from "./services";
import { authorize, type Viewer } from "./session";
import { getTender, type TenderRow } from "./tenders";

export type MemoRow = typeof memos.$inferSelect;

/** The approvals given to a recommendation, with the approvers' names, oldest first. */
export async function approvalsGiven(db: Queryable, recommendationId: string) {
  return db
    .select({ id: approvals.id, approverId: approvals.approverId, name: users.name, decidedAt: approvals.decidedAt, comment: approvals.comment })
    .from(approvals)
    .innerJoin(users, eq(users.id, approvals.approverId))
    .where(and(eq(approvals.recommendationId, recommendationId), eq(approvals.decision, "approved")))
    .orderBy(asc(approvals.decidedAt), asc(users.name));
}

/**
 * The tender's current offers with every claim, its latest mark (with the comment) and its lab
 * runs, each counted by the channel rule: the record, not one viewer's view.
 */
export async function currentOffersWithClaims(db: Queryable, tender: Pick<TenderRow, "id" | "channelModel">) {
  const tenderId = tender.id;
  const rows = await db
    .select({ offer: offers, vendorName: organisations.name })
    .from(offers)
    .innerJoin(organisations, eq(organisations.id, offers.vendorOrgId))
    .where(and(eq(offers.tenderId, tenderId), eq(offers.status, "submitted")))
    .orderBy(asc(organisations.name));
  const ids = rows.map((r) => r.offer.id);
  const claimRows = ids.length ? await db.select().from(claims).where(inArray(claims.offerId, ids)).orderBy(asc(claims.pointIndex)) : [];
  const claimIds = claimRows.map((c) => c.id);
  const latest = latestMarks(claimIds.length ? await db.select().from(marks).where(inArray(marks.claimId, claimIds)) : []);
  const runRows = claimIds.length
    ? await db.select().from(evidenceRuns).where(inArray(evidenceRuns.claimId, claimIds)).orderBy(asc(evidenceRuns.recordedAt))
    : [];
  const runsOf = (c: (typeof claimRows)[number]) =>
    runRows
      .filter((r) => r.claimId === c.id)
      .map((r) => ({ ...r, status: countedStatus(tender.channelModel, r.channelValue, c.channelValue, r.status).status }));
  return rows.map(({ offer, vendorName }) => ({
    ...offer,
    vendorName,
    claims: claimRows
      .filter((c) => c.offerId === offer.id)
      .map((c) => ({ ...c, mark: latest.get(c.id)?.mark ?? null, markComment: latest.get(c.id)?.comment ?? "", runs: runsOf(c) })),
  }));
}

/** Who signed the technical evaluation, and who declared on the tender: what the memo records of the review. */
async function technicalRecord(db: Queryable, tenderId: string) {
  const signatures = await db
    .select({ name: users.name, signedAt: technicalSignoffs.signedAt, statement: technicalSignoffs.statement })
    .from(technicalSignoffs)
    .innerJoin(users, eq(users.id, technicalSignoffs.signedBy))
    .where(eq(technicalSignoffs.tenderId, tenderId))
    .orderBy(asc(technicalSignoffs.signedAt));
  const declared = await db
    .select({ name: users.name, createdAt: declarations.createdAt, statement: declarations.statement, conflictedOrgIds: declarations.conflictedOrgIds })
    .from(declarations)
    .innerJoin(users, eq(users.id, declarations.userId))
    .where(eq(declarations.tenderId, tenderId))
    .orderBy(asc(declarations.createdAt));
  return { signatures, declarations: declared.map(({ conflictedOrgIds, ...d }) => ({ ...d, conflicts: conflictedOrgIds.length })) };
}

interface RenderOptions {
  identifier: string;
  draft: boolean;
  issuedAt: Date;
  approvals: { name: string; decidedAt: Date; comment: string }[];
  /** An issued memo prints the ledger head it was issued at; a preview has none. */
  ledgerHead?: Head | null;
}

/** What the memo of a recommendation prints, read from the database as it stands. */
async function memoFactsFor(db: Queryable, tender: TenderRow, rec: RecommendationRow, options: RenderOptions): Promise<MemoFacts> {
  const [buyer] = await db
    .select({ name: organisations.name })
    .from(users)
    .innerJoin(organisations, eq(organisations.id, users.organisationId))
    .where(eq(users.id, tender.createdBy));
  const [preparer] = await db.select({ name: users.name }).from(users).where(eq(users.id, rec.preparedBy));
  const offerList = await currentOffersWithClaims(db, tender);
  const [chosen] = await db
    .select({ moduleName: offers.moduleName, vendorName: organisations.name })
    .from(offers)
    .innerJoin(organisations, eq(organisations.id, offers.vendorOrgId))
    .where(eq(offers.id, rec.offerId));
  return {
    identifier: options.identifier,
    draft: options.draft,
    issuedAt: options.issuedAt,
    zone: tender.closesZone,
    buyerOrganisation: buyer?.name ?? "",
    tender,
    offers: offerList,
    scoreSheet: rec.scoreSheet,
    recommendation: {
      ...rec,
      vendorName: chosen?.vendorName ?? "",
      moduleName: chosen?.moduleName ?? "",
      preparedBy: preparer?.name ?? "",
      preparedAt: rec.preparedAt,
    },
    approvals: options.approvals,
    approvalsNeeded: rec.approvalsNeeded ?? options.approvals.length,
    safetyRelevant: tender.safetyRelevant,
    technical: await technicalRecord(db, tender.id),
    cautions: CAUTIONS,
    ledgerHead: options.ledgerHead,
  };
}

/** Renders the memo of a recommendation from the database as it stands. */
export async function renderMemoFor(db: Queryable, tender: TenderRow, rec: RecommendationRow, options: RenderOptions): Promise<Uint8Array> {
  return renderMemo(memoDocument(await memoFactsFor(db, tender, rec, options)));
}

/**
 * Renders the final memo once, stores it and records its fingerprint. Call inside the transaction
 * that awards the tender; the object is written first, so a failed commit leaves at most an
 * unreferenced object, never a memo row without its file.
 */
export async function issueMemo(tx: Queryable, tender: TenderRow, rec: RecommendationRow, issuedAt: Date): Promise<MemoRow> {
  const identifier = memoIdentifier(tender.reference);
  const given = await approvalsGiven(tx, rec.id);
  const ledgerHead = await currentHead(tx);
  const bytes = await renderMemoFor(tx, tender, rec, { identifier, draft: false, issuedAt, approvals: given, ledgerHead });
  await ensureLocalServices();
  const stored = await putObject(`memos/${tender.id}/${identifier}.pdf`, bytes, "application/pdf");
  const [row] = await tx
    .insert(memos)
    .values({
      identifier,
      tenderId: tender.id,
      recommendationId: rec.id,
      sha256: stored.sha256,
      storageKey: stored.key,
      size: stored.size,
      ledgerSeq: ledgerHead?.seq ?? null,
      ledgerHash: ledgerHead?.hash ?? null,
      createdAt: issuedAt,
    })
    .returning();
  return row;
}

const memoSubject = (tenderId: string) => asSubject("Memo", { tenderId });

/**
 * Preview renders in this process (the seam the tests count through): rendering is the slow part
 * of a Sign-off visit, so a test can tell a reused preview from a fresh one without timing it.
 */
let previewRenders = 0;
export const memoPreviewRenders = () => previewRenders;

/** Renders in flight, so that visits arriving together render once. */
const rendering = new Map<string, Promise<Uint8Array>>();
const EPOCH = new Date(0);

/**
 * A preview of the memo as it would read now, approvals so far included. Rendered once per
 * recommendation and version of what it prints, then reused: its inputs (everything the memo
 * prints except its date) are read and hashed on each visit, and only a change to them (a mark,
 * a lab run, a decision, a signature, a declaration...) renders it again. The preview carries the
 * date it was rendered. Kept in `memo_previews` so that every app instance shares it; never the
 * issued memo, which is rendered once more on the final approval.
 */
export async function previewMemo(viewer: Viewer, tenderId: string, now = new Date()) {
  const tender = await getTender(viewer, tenderId);
  authorize(viewer, "read", memoSubject(tenderId), "Only the buying team and approvers declared on this tender read its memo.");
  const db = await getDb();
  const rec = await getCurrentRecommendation(db, tenderId);
  if (!rec) throw new ConflictError("There is no recommendation to preview yet.");
  const given = await approvalsGiven(db, rec.id);
  const identifier = `${tender.reference}-PREVIEW`;
  const fileName = `${identifier}.pdf`;
  const facts = await memoFactsFor(db, tender, rec, { identifier, draft: true, issuedAt: now, approvals: given });
  const inputsHash = sha256Hex(JSON.stringify(memoDocument({ ...facts, issuedAt: EPOCH })));
  const [stored] = await db.select().from(memoPreviews).where(eq(memoPreviews.recommendationId, rec.id));
  if (stored?.inputsHash === inputsHash) return { fileName, bytes: stored.pdf, renderedAt: stored.renderedAt, reused: true };

  const key = `${rec.id}:${inputsHash}`;
  let job = rendering.get(key);
  if (!job) {
    job = (async () => {
      previewRenders++;
      const bytes = await renderMemo(memoDocument(facts));
      await db
        .insert(memoPreviews)
        .values({ recommendationId: rec.id, inputsHash, pdf: bytes, renderedAt: now })
        .onConflictDoUpdate({ target: memoPreviews.recommendationId, set: { inputsHash, pdf: bytes, renderedAt: now } });
      return bytes;
    })().finally(() => rendering.delete(key));
    rendering.set(key, job);
  }
  return { fileName, bytes: await job, renderedAt: now, reused: false };
}

/** The memo record of an awarded tender, or null before the award. */
export async function getMemo(viewer: Viewer, tenderId: string): Promise<MemoRow | null> {
  await getTender(viewer, tenderId);
  authorize(viewer, "read", memoSubject(tenderId), "Only the buying team and approvers declared on this tender read its memo.");
  const [row] = await (await getDb()).select().from(memos).where(eq(memos.tenderId, tenderId));
  return row ?? null;
}

/** The stored memo file, exactly the bytes whose fingerprint was recorded. */
export async function getMemoFile(viewer: Viewer, tenderId: string) {
  const memo = await getMemo(viewer, tenderId);
  if (!memo) throw new NotFoundError("This tender has no award memo yet.");
  try {
    await ensureLocalServices();
    return { fileName: `${memo.identifier}.pdf`, bytes: await getObject(memo.storageKey), memo };
  } catch (error) {
    if (isObjectNotFound(error)) throw new NotFoundError("The memo file is missing from storage.");
    throw error;
  }
}

export type MemoCheckResult =
  | { authentic: false; sha256: string }
  | {
      authentic: true;
      sha256: string;
      identifier: string;
      tender: { reference: string; title: string };
      awardedAt: string;
      approvedBy: { name: string; at: string }[];
      ledgerHead: IssuedHead | null;
    };

/** Public: is this file (or fingerprint) an award memo Ratecourt issued? Says for which tender, approved by whom and when. */
export async function checkMemo(viewer: Viewer | null, input: { bytes: Uint8Array } | { sha256: string }): Promise<MemoCheckResult> {
  const ability = viewer?.ability ?? defineAbilityFor(null);
  if (!ability.can("verify", "MemoCheck")) throw new ForbiddenError("Memo check is not available to this account.");
  const sha256 = "bytes" in input ? sha256Hex(input.bytes) : input.sha256;
  const db = await getDb();
  const [row] = await db
    .select({ memo: memos, reference: tenders.reference, title: tenders.title, awardedAt: tenders.awardedAt })
    .from(memos)
    .innerJoin(tenders, eq(tenders.id, memos.tenderId))
    .where(eq(memos.sha256, sha256));
  if (!row) return { authentic: false, sha256 };
  const given = await approvalsGiven(db, row.memo.recommendationId);
  return {
    authentic: true,
    sha256,
    identifier: row.memo.identifier,
    tender: { reference: row.reference, title: row.title },
    awardedAt: (row.awardedAt ?? row.memo.createdAt).toISOString(),
    approvedBy: given.map((a) => ({ name: a.name, at: a.decidedAt.toISOString() })),
    ledgerHead:
      row.memo.ledgerSeq === null || row.memo.ledgerHash === null ? null : await issuedHead(db, { seq: row.memo.ledgerSeq, hash: row.memo.ledgerHash }),
  };
}

/** A PDF response; inline for the preview, attachment for the download. */
export function pdfResponse(bytes: Uint8Array, fileName: string, disposition: "inline" | "attachment", extra: Record<string, string> = {}): Response {
  return new Response(Buffer.from(bytes), {
    headers: {
      "content-type": "application/pdf",
      "content-length": String(bytes.length),
      "content-disposition": `${disposition}; filename="${fileName.replace(/[^\w.-]/g, "_")}"`,
      "cache-control": "private, no-store",
      ...extra,
    },
  });
}
