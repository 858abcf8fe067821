import { readFile } from "node:fs/promises";
import path from "node:path";

// The app's own font, shipped with it as an npm package: the same static Inter weights as the web
// pages (app/layout.tsx), which use their WOFF 2 files. Here the WOFF 1 files: fontkit subsets
// them into a TrueType font that PDF readers accept, while on WOFF 2 @pdf-lib/fontkit's subsetting
// fails ("Index out of range"). A variable font would not do either: its subset keeps only the
// default outlines (fontkit writes no instance), and the memo would lose its 600 weight.
const FONT_DIR = ["node_modules", "@fontsource", "inter", "files"];
export const FONT_FILES = {
  regular: "inter-latin-400-normal.woff",
  bold: "inter-latin-600-normal.woff",
} as const;

const cache = new Map<string, Promise<Uint8Array>>();

/** The bytes of one weight of the memo font, read once per process. */
export function fontBytes(weight: keyof typeof FONT_FILES): Promise<Uint8Array> {
  // Read from the installed package at run time; nothing for the build to trace.
  const file = path.join(/*turbopackIgnore: true*/ process.cwd(), ...FONT_DIR, FONT_FILES[weight]);
  let bytes = cache.get(file);
  if (!bytes) {
    bytes = readFile(file).then((buffer) => new Uint8Array(buffer));
    bytes.catch(() => cache.delete(file));
    cache.set(file, bytes);
  }
  return bytes;
}
