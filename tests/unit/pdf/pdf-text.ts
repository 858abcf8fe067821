// Reads our PDFs back with an independent parser (Mozilla's pdf.js), not the library that wrote
// them: a memo that only pdf-lib could read back would pass unseen.
import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";

interface Item {
  str: string;
  transform: number[];
  hasEOL?: boolean;
}

/** The text of each page, one drawn line per line (items on one baseline joined, top to bottom). */
export async function pdfPageTexts(bytes: Uint8Array): Promise<string[]> {
  // pdf.js takes ownership of the buffer it is given: hand it a copy.
  const doc = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false, verbosity: 0 }).promise;
  try {
    const pages: string[] = [];
    for (let n = 1; n <= doc.numPages; n++) {
      const page = await doc.getPage(n);
      const { items } = await page.getTextContent();
      const lines: { y: number; x: number; text: string }[] = [];
      for (const item of items as Item[]) {
        if (!("str" in item) || item.str === "") continue;
        const [, , , , x, y] = item.transform;
        lines.push({ y, x, text: item.str });
      }
      // Drawn order within a page is top to bottom for our renderer; keep it, merging pieces of one line.
      const merged: { y: number; text: string }[] = [];
      for (const piece of lines) {
        const last = merged.at(-1);
        if (last && Math.abs(last.y - piece.y) < 0.5) last.text += piece.text;
        else merged.push({ y: piece.y, text: piece.text });
      }
      pages.push(merged.map((l) => l.text).join("\n"));
    }
    return pages;
  } finally {
    await doc.destroy();
  }
}

export async function pdfText(bytes: Uint8Array): Promise<string> {
  return (await pdfPageTexts(bytes)).join("\n");
}
