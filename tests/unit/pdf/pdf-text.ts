// Offline text extraction for the PDFs our renderer writes: content streams are decoded with
// pdf-lib, glyph codes mapped back to text through each font's ToUnicode CMap.
import { decodePDFRawStream, PDFArray, PDFDict, PDFDocument, PDFName, PDFRawStream, type PDFObject } from "pdf-lib";

const hexToText = (hex: string) => {
  const units: number[] = [];
  for (let i = 0; i + 4 <= hex.length; i += 4) units.push(parseInt(hex.slice(i, i + 4), 16));
  return String.fromCharCode(...units);
};

function parseToUnicode(cmap: string): Map<number, string> {
  const map = new Map<number, string>();
  for (const block of cmap.matchAll(/beginbfchar([\s\S]*?)endbfchar/g)) {
    for (const [, code, text] of block[1].matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>/g)) map.set(parseInt(code, 16), hexToText(text));
  }
  for (const block of cmap.matchAll(/beginbfrange([\s\S]*?)endbfrange/g)) {
    for (const [, lo, hi, rest] of block[1].matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>\s*(\[[^\]]*\]|<[0-9a-fA-F]+>)/g)) {
      const start = parseInt(lo, 16);
      const end = parseInt(hi, 16);
      if (rest.startsWith("[")) {
        [...rest.matchAll(/<([0-9a-fA-F]+)>/g)].forEach((m, i) => map.set(start + i, hexToText(m[1])));
      } else {
        const base = hexToText(rest.slice(1, -1));
        for (let c = start; c <= end; c++) map.set(c, base.slice(0, -1) + String.fromCharCode(base.charCodeAt(base.length - 1) + c - start));
      }
    }
  }
  return map;
}

const decode = (object: PDFObject | undefined): string =>
  object instanceof PDFRawStream ? Buffer.from(decodePDFRawStream(object).decode()).toString("latin1") : "";

/** The text of each page, one drawn line per line. */
export async function pdfPageTexts(bytes: Uint8Array): Promise<string[]> {
  const doc = await PDFDocument.load(bytes, { updateMetadata: false });
  const ctx = doc.context;
  return doc.getPages().map((page) => {
    const fonts = new Map<string, Map<number, string>>();
    const fontDict = page.node.Resources()?.lookup(PDFName.of("Font"));
    if (fontDict instanceof PDFDict) {
      for (const [name, ref] of fontDict.entries()) {
        const font = ctx.lookup(ref);
        const toUnicode = font instanceof PDFDict ? ctx.lookup(font.get(PDFName.of("ToUnicode"))) : undefined;
        fonts.set(name.asString().slice(1), parseToUnicode(decode(toUnicode)));
      }
    }
    const contents = page.node.Contents();
    const streams = contents instanceof PDFArray ? contents.asArray().map((r) => ctx.lookup(r)) : [contents];
    const lines: string[] = [];
    let current = new Map<number, string>();
    for (const source of streams.map((s) => decode(s as PDFObject))) {
      for (const m of source.matchAll(/\/([^\s/]+)\s+[\d.]+\s+Tf|<([0-9a-fA-F]*)>\s*Tj/g)) {
        if (m[1]) current = fonts.get(m[1]) ?? new Map();
        else {
          let line = "";
          for (let i = 0; i + 4 <= m[2].length; i += 4) line += current.get(parseInt(m[2].slice(i, i + 4), 16)) ?? "\uFFFD";
          lines.push(line);
        }
      }
    }
    return lines.join("\n");
  });
}

export async function pdfText(bytes: Uint8Array): Promise<string> {
  return (await pdfPageTexts(bytes)).join("\n");
}
