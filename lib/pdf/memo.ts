import fontkit from "@pdf-lib/fontkit";
import { PDFDocument, rgb } from "pdf-lib";
import { drawVerdictShape, VERDICT_WORDS, type Verdict } from "./badges";
import { fontBytes } from "./font";
import { A4, MARGIN, PageWriter } from "./writer";

/** Everything the award memo prints, already worded (lib/approvals/memo-content.ts builds it). */
export interface MemoDocument {
  identifier: string;
  /** A preview carries a mark on every page and is never stored. */
  draft: boolean;
  /** The award time (or the preview's time): also the PDF's creation and modification date. */
  issuedAt: Date;
  issuedAtText: string;
  /** The ledger head the memo was issued at, in words; null on a preview. */
  ledgerLine: string | null;
  tender: {
    reference: string;
    title: string;
    buyerOrganisation: string;
    description: string;
    facts: { label: string; value: string }[];
    operatingPoints: string[];
  };
  offers: {
    vendorName: string;
    module: string;
    code: string;
    claims: { point: string; claim: string; verdict: Verdict; review: string; evidence: string; sensitivity?: string | null }[];
  }[];
  technical: {
    signatures: { name: string; at: string; statement: string }[];
    declarations: { name: string; at: string; statement: string; conflicts: string }[];
  };
  scores: { rank: string; vendorName: string; total: string; note: string }[];
  /** deviations: each departure from the offer's price or the tender's quantity, beside the computed figure, with its reason. */
  recommendation: { vendorName: string; module: string; value: string; quantity: string; deviations: string[]; justification: string; prepared: string };
  approvals: { name: string; at: string; comment: string }[];
  approvalsNeeded: number;
  cautions: string;
}

export const MEMO_PRODUCER = "Ratecourt award memo renderer 1";

async function openDocument(memo: MemoDocument) {
  // updateMetadata: false keeps pdf-lib from stamping the current time: same input, same bytes.
  const doc = await PDFDocument.create({ updateMetadata: false });
  doc.registerFontkit(fontkit);
  const [regular, bold] = await Promise.all([fontBytes("regular"), fontBytes("bold")]);
  const fonts = { regular: await doc.embedFont(regular, { subset: true }), bold: await doc.embedFont(bold, { subset: true }) };
  doc.setTitle(`Award memo ${memo.identifier}: ${memo.tender.title}`);
  doc.setSubject(`Award of tender ${memo.tender.reference}`);
  doc.setAuthor(memo.tender.buyerOrganisation);
  doc.setCreator("Ratecourt");
  doc.setProducer(MEMO_PRODUCER);
  doc.setKeywords([memo.identifier, memo.tender.reference]);
  doc.setCreationDate(memo.issuedAt);
  doc.setModificationDate(memo.issuedAt);
  return { doc, fonts };
}

function verdictTable(w: PageWriter, memo: MemoDocument): void {
  w.heading("Verdicts on the coding claims");
  for (const offer of memo.offers) {
    w.ensure(60);
    w.text(`${offer.vendorName}: ${offer.module}`, { bold: true, size: 10, gap: 0 });
    w.text(offer.code, { soft: true, size: 8.5, gap: 3 });
    w.row(
      [
        { text: "Operating point", x: 0, width: 120, bold: true },
        { text: "Claim", x: 125, width: 150, bold: true },
        { text: "Verdict", x: 280, width: 100, bold: true },
        { text: "Review", x: 385, width: w.contentWidth - 385, bold: true },
      ],
      8.5,
    );
    for (const claim of offer.claims) {
      const { top } = w.row(
        [
          { text: claim.point, x: 0, width: 120 },
          { text: claim.claim, x: 125, width: 150 },
          { text: VERDICT_WORDS[claim.verdict], x: 293, width: 90 },
          { text: claim.review, x: 385, width: w.contentWidth - 385 },
        ],
        8.5,
      );
      drawVerdictShape(w.page, claim.verdict, MARGIN + 284, top - 6.3);
      if (claim.sensitivity) w.text(claim.sensitivity, { soft: true, size: 8, indent: 12, gap: 2 });
      w.text(`Lab evidence: ${claim.evidence}`, { soft: true, size: 8, indent: 12, gap: 2 });
    }
    w.y -= 6;
  }
}

function technicalEvaluation(w: PageWriter, memo: MemoDocument): void {
  w.heading("Technical evaluation");
  for (const s of memo.technical.signatures) {
    w.text(`Signed by ${s.name}, ${s.at}`, { bold: true, gap: 0 });
    w.text(s.statement, { soft: true, indent: 12 });
  }
  if (memo.technical.signatures.length === 0) w.text("Not signed.", { soft: true });
  w.text("Conflict-of-interest declarations", { bold: true, gap: 0 });
  for (const d of memo.technical.declarations) w.text(`${d.name}, ${d.at}: ${d.conflicts}. ${d.statement}`, { size: 8.5, indent: 12, gap: 1 });
  if (memo.technical.declarations.length === 0) w.text("None.", { soft: true, indent: 12 });
}

function scoresAndDecision(w: PageWriter, memo: MemoDocument): void {
  w.heading("Scores");
  w.row([
    { text: "Rank", x: 0, width: 40, bold: true },
    { text: "Vendor", x: 45, width: 170, bold: true },
    { text: "Total score", x: 220, width: 80, bold: true },
    { text: "Note", x: 305, width: w.contentWidth - 305, bold: true },
  ]);
  for (const s of memo.scores) {
    w.row([
      { text: s.rank, x: 0, width: 40 },
      { text: s.vendorName, x: 45, width: 170 },
      { text: s.total, x: 220, width: 80 },
      { text: s.note, x: 305, width: w.contentWidth - 305, soft: true },
    ]);
  }
  if (memo.scores.length === 0) w.text("No score sheet was recorded with the recommendation.", { soft: true });

  const r = memo.recommendation;
  w.heading("Recommendation");
  w.text(`Award to ${r.vendorName}, ${r.module}: ${r.quantity} for ${r.value}.`, { bold: true });
  for (const line of r.deviations) w.text(line, { indent: 12 });
  w.text(r.justification);
  w.text(r.prepared, { soft: true, size: 8.5 });

  w.heading(`Approvals (${memo.approvals.length} of ${memo.approvalsNeeded} needed)`);
  for (const a of memo.approvals) {
    w.text(`Approved by ${a.name}, ${a.at}`, { bold: true, gap: 0 });
    if (a.comment) w.text(a.comment, { soft: true, indent: 12 });
    w.y -= 3;
  }
  if (memo.approvals.length === 0) w.text("Not yet approved.", { soft: true });
}

/** Renders the award memo as PDF bytes; the same document always gives the same bytes. */
export async function renderMemo(memo: MemoDocument): Promise<Uint8Array> {
  const { doc, fonts } = await openDocument(memo);
  const w = new PageWriter(doc, fonts);

  w.text(memo.tender.buyerOrganisation, { soft: true, size: 9 });
  w.text(`Award memo ${memo.identifier}`, { bold: true, size: 17, gap: 1 });
  w.text(`${memo.tender.reference}: ${memo.tender.title}`, { bold: true, size: 12.5 });
  w.text(memo.draft ? `Preview of ${memo.issuedAtText}: not approved, not an award.` : `Issued ${memo.issuedAtText}`, {
    soft: true,
    gap: memo.ledgerLine ? 0 : undefined,
  });
  if (memo.ledgerLine) w.text(memo.ledgerLine, { soft: true, size: 8.5 });

  w.heading("Requirements");
  if (memo.tender.description) w.text(memo.tender.description, { gap: 4 });
  for (const fact of memo.tender.facts)
    w.row([
      { text: fact.label, x: 0, width: 150, soft: true },
      { text: fact.value, x: 155, width: w.contentWidth - 155 },
    ]);
  w.text("Operating points", { soft: true, gap: 0 });
  for (const point of memo.tender.operatingPoints) w.text(point, { indent: 12, gap: 0 });

  verdictTable(w, memo);
  technicalEvaluation(w, memo);
  scoresAndDecision(w, memo);

  w.heading("Cautions");
  w.text(memo.cautions, { size: 8.5 });

  if (memo.draft) {
    for (const page of doc.getPages()) {
      page.drawText("PREVIEW", { x: A4.width / 2 - 120, y: A4.height / 2, size: 72, font: fonts.bold, color: rgb(0.85, 0.85, 0.85), opacity: 0.35 });
    }
  }
  w.footers(`Ratecourt award memo ${memo.identifier}`, (i, n) => `page ${i + 1} of ${n}`);
  return doc.save({ useObjectStreams: false });
}
