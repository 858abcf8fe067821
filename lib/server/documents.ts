import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import { asSubject, recordTenderState } from "@/policies";
import { getDb, type Queryable } from "./database";
import { documents, offers, tenders } from "@/db/schema";
import { documentRecord, offerRecord, submissionRefusal } from "@/lib/offers";
import { checkPdfUpload, deleteObject, getObject, isObjectNotFound, MAX_UPLOAD_BYTES, pdfFileName, putObject, sha256Hex } from "@/lib/storage";
import { documentKindSchema, type DocumentKind } from "@/lib/validation/offer";
import { describeZodError, fieldErrorsOf } from "@/lib/validation/messages";
import { AppError, ConflictError, InputError, NotFoundError } from "./errors";
import { isMultipart, readForm, singleFile } from "./http";
import { appendLedger } from "./ledger";
import { ensureLocalServices } from "./services";
import { authorize, ledgerActor, type Viewer } from "./session";
import { getTender } from "./tenders";

// Documents belong to a vendor's offers on one tender: each row names the version it was uploaded
// to (offerId), and every later version of that vendor's offer shows it too (documentsFor), so a
// resubmission carries its documents over without copying rows or objects.

export type DocumentRow = typeof documents.$inferSelect;
const LIMIT_MB = MAX_UPLOAD_BYTES / (1024 * 1024);
// Room for the multipart boundaries and the other fields around a file at the limit.
const MULTIPART_SLACK = 64 * 1024;

/** What a document looks like outside the server: no storage key. */
export const documentView = (d: DocumentRow) => ({
  id: d.id,
  offerId: d.offerId,
  kind: d.kind,
  fileName: d.fileName,
  size: d.size,
  sha256: d.sha256,
  uploadedAt: d.uploadedAt,
});
export type DocumentView = ReturnType<typeof documentView>;

/** Every document of some vendors on a tender, oldest first (unfiltered: callers authorise each). */
export async function documentsFor(db: Queryable, tenderId: string, vendorOrgIds: string[]): Promise<DocumentRow[]> {
  if (vendorOrgIds.length === 0) return [];
  return db
    .select()
    .from(documents)
    .where(and(eq(documents.tenderId, tenderId), inArray(documents.vendorOrgId, vendorOrgIds)))
    .orderBy(asc(documents.uploadedAt));
}

const tooLarge = () => new AppError(`The file is larger than ${LIMIT_MB} MB; upload a PDF of at most ${LIMIT_MB} MB.`, 413);
const notPdf = (message: string) => new AppError(message, 415);

/** Reads a multipart upload ("file", "kind"), counting the bytes as they arrive. */
async function readPdfUpload(request: Request): Promise<{ kind: DocumentKind; fileName: string; bytes: Uint8Array }> {
  if (!isMultipart(request)) throw new InputError('Send the document as multipart/form-data with a "file" field and a "kind" field.');
  const form = await readForm(request, MAX_UPLOAD_BYTES + MULTIPART_SLACK, tooLarge());
  const kind = documentKindSchema.safeParse(form.get("kind"));
  if (!kind.success) throw new InputError(describeZodError(kind.error), { kind: fieldErrorsOf(kind.error)._ ?? ["Choose a kind."] });
  const file = singleFile(form, "file", 'Attach the PDF in a field named "file".');
  if (file.size > MAX_UPLOAD_BYTES) throw tooLarge();
  const bytes = new Uint8Array(await file.arrayBuffer());
  const check = checkPdfUpload(bytes);
  if (!check.ok) {
    if (check.reason === "empty") throw new InputError("The file is empty.", { file: ["The file is empty."] });
    if (check.reason === "too-large") throw tooLarge();
    if (check.reason === "executable")
      throw notPdf(`This file is a program or archive (${check.kind}), not a PDF, whatever its name says; upload the PDF itself.`);
    throw notPdf("Only PDF files are accepted, and this file does not start like a PDF.");
  }
  return { kind: kind.data, fileName: pdfFileName(file.name), bytes };
}

/** Uploads a datasheet or test report to the vendor's current offer, while the tender is open. */
export async function uploadDocument(viewer: Viewer, offerId: string, request: Request, now = new Date()) {
  authorize(viewer, "create", "Document", "Only the vendor uploads documents to its offer.");
  const db = await getDb();
  const [offer] = await db.select().from(offers).where(eq(offers.id, offerId));
  if (!offer) throw new NotFoundError("No such offer.");
  const tender = await getTender(viewer, offer.tenderId);
  authorize(viewer, "read", asSubject("Offer", offerRecord(offer, tender)), "This offer belongs to another organisation.");
  const refusal = submissionRefusal(tender, now);
  if (refusal) throw new ConflictError(refusal);
  if (offer.status !== "submitted") throw new ConflictError("Documents go to the current version of your offer; this one was superseded or withdrawn.");
  const record = documentRecord({ id: "new", offerId: offer.id, tenderId: offer.tenderId, vendorOrgId: offer.vendorOrgId }, recordTenderState(tender));
  authorize(viewer, "create", asSubject("Document", record));

  const upload = await readPdfUpload(request);
  const sha256 = sha256Hex(upload.bytes);
  const storageKey = `tenders/${offer.tenderId}/vendors/${offer.vendorOrgId}/${crypto.randomUUID()}.pdf`;
  await ensureLocalServices();
  await putObject(storageKey, upload.bytes, "application/pdf");
  try {
    const row = await db.transaction(async (tx) => {
      const [inserted] = await tx
        .insert(documents)
        .values({
          offerId: offer.id,
          tenderId: offer.tenderId,
          vendorOrgId: offer.vendorOrgId,
          kind: upload.kind,
          fileName: upload.fileName,
          contentType: "application/pdf",
          size: upload.bytes.length,
          sha256,
          storageKey,
          uploadedBy: viewer.actor.id,
        })
        .returning();
      await appendLedger(tx, {
        tenderId: offer.tenderId,
        actor: ledgerActor(viewer),
        action: "document.uploaded",
        subjectType: "Document",
        subjectId: inserted.id,
        data: { offerId: offer.id, version: offer.version, kind: upload.kind, fileName: upload.fileName, size: upload.bytes.length, sha256 },
      });
      return inserted;
    });
    return documentView(row);
  } catch (error) {
    // No row, no object: nothing stays behind from a failed upload.
    await deleteObject(storageKey).catch(() => undefined);
    throw error;
  }
}

/** A document's bytes for download, after the policy check. */
export async function getDocumentFile(viewer: Viewer, documentId: string) {
  const db = await getDb();
  const [found] = await db
    .select({ row: documents, tender: { state: tenders.state, cancelledSealed: tenders.cancelledSealed } })
    .from(documents)
    .innerJoin(tenders, eq(tenders.id, documents.tenderId))
    .where(eq(documents.id, documentId));
  if (!found) throw new NotFoundError("No such document.");
  const { row } = found;
  authorize(viewer, "read", asSubject("Document", documentRecord(row, recordTenderState(found.tender))), "This document is not yours to read.");
  await ensureLocalServices();
  try {
    return { fileName: row.fileName, contentType: row.contentType, sha256: row.sha256, bytes: await getObject(row.storageKey) };
  } catch (error) {
    if (isObjectNotFound(error)) throw new NotFoundError("The stored file is missing.");
    throw error;
  }
}
