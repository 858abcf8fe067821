// The shell's accessibility basics: a skip link to the one main landmark, the current page marked
// in the navigation, secondary text at 4.5:1 or more, and tender states told apart by shape as
// well as colour.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import config from "@/tailwind.config";
import { STATE_LOOK } from "@/app/_components/state-look";
import { currentNavHref } from "@/lib/nav";
import { TENDER_STATES } from "@/policies/vocabulary";

// Contrast ratio as WCAG 2.2 defines it (success criterion 1.4.3, "relative luminance" and
// "contrast ratio" in its glossary): (L1 + 0.05) / (L2 + 0.05) over sRGB relative luminances.
const luminance = (hex: string) => {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
};
const contrast = (a: string, b: string) => {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
};

const colours = config.theme.extend.colors;
const PAPERS = Object.values(colours.paper);

const sources = (dir: string): string[] =>
  readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? sources(full) : /\.tsx?$/.test(name) ? [full] : [];
  });
const APP = sources(path.resolve("app"));
const read = (file: string) => readFileSync(path.resolve(file), "utf8");

describe("text contrast", () => {
  it("gives every text grey 4.5:1 or more on every paper colour", () => {
    for (const [name, ink] of Object.entries({ ink: colours.ink.DEFAULT, soft: colours.ink.soft, muted: colours.ink.muted })) {
      for (const paper of PAPERS) expect(contrast(ink, paper), `${name} on ${paper}`).toBeGreaterThanOrEqual(4.5);
    }
    // The faint grey stays for borders: it would not pass as text.
    expect(contrast(colours.ink.faint, colours.paper.raised)).toBeLessThan(4.5);
  });

  it("uses the faint grey for no text", () => {
    const offenders = [...APP, ...sources(path.resolve("lib"))].filter((f) => /\btext-ink-faint\b/.test(read(f)));
    expect(offenders).toEqual([]);
  });
});

describe("the tender state pill", () => {
  it("has a look for every state, with its text at 4.5:1 or more on its ground", () => {
    expect(Object.keys(STATE_LOOK).sort()).toEqual([...TENDER_STATES].sort());
    for (const [state, look] of Object.entries(STATE_LOOK)) expect(contrast(look.ink, look.ground), state).toBeGreaterThanOrEqual(4.5);
  });

  it("gives each state its own colour and its own shape, so that grey-scale still tells them apart", () => {
    const shapes = Object.values(STATE_LOOK).map((l) => `${l.fill}/${l.outline}/${l.struck}`);
    expect(new Set(shapes).size).toBe(TENDER_STATES.length);
    expect(new Set(Object.values(STATE_LOOK).map((l) => l.ink)).size).toBe(TENDER_STATES.length);
  });
});

describe("landmarks and the skip link", () => {
  it("renders <main> in one component only, used once by each shell and never by a page inside one", () => {
    expect(APP.filter((f) => /<main[\s>]/.test(read(f))).map((f) => path.relative(".", f))).toEqual(["app/_components/main.tsx"]);
    const shells = ["app/(app)/layout.tsx", "app/(auth)/layout.tsx", "app/memo-check/page.tsx", "app/error.tsx", "app/not-found.tsx", "app/forbidden.tsx"];
    for (const shell of shells) expect(read(shell).match(/<Main[\s>]/g), shell).toHaveLength(1);
    const inside = APP.filter((f) => /app\/\((app|auth)\)\//.test(f) && !shells.includes(path.relative(".", f)));
    expect(inside.filter((f) => /<Main[\s>]/.test(read(f)))).toEqual([]);
  });

  it("puts the skip link first in the root layout, pointing at the main landmark", () => {
    const root = read("app/layout.tsx");
    expect(root.indexOf("<SkipLink />")).toBeGreaterThan(-1);
    expect(root.indexOf("<SkipLink />")).toBeLessThan(root.indexOf("{children}"));
    expect(read("app/_components/skip-link.tsx")).toContain("href={`#${MAIN_ID}`}");
  });
});

describe("the current page in the navigation", () => {
  const items = ["/desk", "/tenders", "/review", "/explorer", "/memo-check"].map((href) => ({ href, label: href }));

  it("is the item whose path the page is in", () => {
    expect(currentNavHref(items, "/desk")).toBe("/desk");
    expect(currentNavHref(items, "/tenders/abc/review")).toBe("/tenders");
    expect(currentNavHref(items, "/review/claims/xyz")).toBe("/review");
  });

  it("is none for a page outside the navigation, and never a mere prefix of a word", () => {
    expect(currentNavHref(items, "/people")).toBeNull();
    expect(currentNavHref([...items, { href: "/ten", label: "x" }], "/tenders")).toBe("/tenders");
    expect(currentNavHref(items, "/desks")).toBeNull();
  });
});
