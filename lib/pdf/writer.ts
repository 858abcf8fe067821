import { rgb, type PDFDocument, type PDFFont, type PDFPage } from "pdf-lib";

export const A4 = { width: 595.28, height: 841.89 } as const;
export const MARGIN = 50;
const FOOTER_SPACE = 40;
export const INK = rgb(0.11, 0.13, 0.16);
export const SOFT = rgb(0.38, 0.41, 0.45);
export const RULE = rgb(0.8, 0.82, 0.85);

export interface Fonts {
  regular: PDFFont;
  bold: PDFFont;
}

export interface TextStyle {
  size?: number;
  bold?: boolean;
  soft?: boolean;
  indent?: number;
  width?: number;
  gap?: number;
}

/** Characters the embedded font lacks are replaced, so nothing silently prints as a blank box. */
export function printable(font: PDFFont, text: string): string {
  const set = new Set(font.getCharacterSet());
  return [...text.replace(/[\r\n\t]+/g, " ")]
    .map((ch) => (set.has(ch.codePointAt(0)!) ? ch : ch === "≤" ? "<=" : ch === "≥" ? ">=" : ch === "∞" ? "inf" : "?"))
    .join("");
}

/** Splits text into lines no wider than width at the given size. */
export function wrap(font: PDFFont, text: string, size: number, width: number): string[] {
  const lines: string[] = [];
  for (const paragraph of text.split(/\n/)) {
    let line = "";
    for (const word of paragraph.split(/\s+/).filter(Boolean)) {
      const candidate = line ? `${line} ${word}` : word;
      if (line && font.widthOfTextAtSize(candidate, size) > width) {
        lines.push(line);
        line = word;
      } else line = candidate;
    }
    lines.push(line);
  }
  return lines;
}

/** A top-to-bottom writer over A4 pages that starts a new page when the current one is full. */
export class PageWriter {
  page!: PDFPage;
  y = 0;
  readonly contentWidth = A4.width - 2 * MARGIN;

  constructor(
    readonly doc: PDFDocument,
    readonly fonts: Fonts,
  ) {
    this.newPage();
  }

  newPage(): void {
    this.page = this.doc.addPage([A4.width, A4.height]);
    this.y = A4.height - MARGIN;
  }

  /** Makes room for a block of the given height, on a new page if needed. */
  ensure(height: number): void {
    if (this.y - height < MARGIN + FOOTER_SPACE) this.newPage();
  }

  text(content: string, style: TextStyle = {}): void {
    const size = style.size ?? 9.5;
    const font = style.bold ? this.fonts.bold : this.fonts.regular;
    const indent = style.indent ?? 0;
    const width = style.width ?? this.contentWidth - indent;
    const leading = size * 1.35;
    for (const line of wrap(font, printable(font, content), size, width)) {
      this.ensure(leading);
      this.y -= leading;
      this.page.drawText(line, { x: MARGIN + indent, y: this.y + size * 0.25, size, font, color: style.soft ? SOFT : INK });
    }
    this.y -= style.gap ?? 2;
  }

  heading(content: string): void {
    this.ensure(40);
    this.y -= 10;
    this.text(content, { size: 12, bold: true, gap: 2 });
    this.page.drawLine({ start: { x: MARGIN, y: this.y }, end: { x: A4.width - MARGIN, y: this.y }, thickness: 0.6, color: RULE });
    this.y -= 4;
  }

  /** One row of cells at fixed x offsets; the tallest wrapped cell sets the row height. */
  row(cells: { text: string; x: number; width: number; bold?: boolean; soft?: boolean }[], size = 9): { top: number; bottom: number } {
    const leading = size * 1.35;
    const wrapped = cells.map((cell) => {
      const font = cell.bold ? this.fonts.bold : this.fonts.regular;
      return { cell, font, lines: wrap(font, printable(font, cell.text), size, cell.width) };
    });
    const height = Math.max(1, ...wrapped.map((w) => w.lines.length)) * leading + 3;
    this.ensure(height);
    const top = this.y;
    for (const { cell, font, lines } of wrapped) {
      lines.forEach((line, i) =>
        this.page.drawText(line, { x: MARGIN + cell.x, y: top - (i + 1) * leading + size * 0.25, size, font, color: cell.soft ? SOFT : INK }),
      );
    }
    this.y = top - height;
    return { top, bottom: this.y };
  }

  /** Writes the footer on every page once the content is complete. */
  footers(left: string, right: (index: number, count: number) => string): void {
    const pages = this.doc.getPages();
    pages.forEach((page, index) => {
      const size = 8;
      const font = this.fonts.regular;
      page.drawLine({ start: { x: MARGIN, y: MARGIN }, end: { x: A4.width - MARGIN, y: MARGIN }, thickness: 0.5, color: RULE });
      page.drawText(printable(font, left), { x: MARGIN, y: MARGIN - 14, size, font, color: SOFT });
      const r = printable(font, right(index, pages.length));
      page.drawText(r, { x: A4.width - MARGIN - font.widthOfTextAtSize(r, size), y: MARGIN - 14, size, font, color: SOFT });
    });
  }
}
