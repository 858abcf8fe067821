import { readFile } from "node:fs/promises";
import path from "node:path";

// The app's own font, shipped with it as an npm package (static weights: WOFF 1, which
// fontkit subsets into a TrueType font that PDF readers accept; WOFF 2 does not subset).
// The web's @fontsource-variable/inter cannot stand in: it ships only WOFF 2, on which
// @pdf-lib/fontkit's subsetting fails ("Index out of range"), and one variable file, whose subset
// would keep only the default outlines (fontkit writes no instance): the memo would lose its 600 weight.
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
