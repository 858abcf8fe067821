import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { ClaimNumbers } from "@/app/_components/claim-numbers";
import { evaluateClaim } from "@/lib/bounds";

const text = (html: string) =>
  html
    .replace(/<[^>]+>/g, " ")
    .replace(/&#x27;/g, "'")
    .replace(/\s+/g, " ");

describe("the numbers behind a verdict", () => {
  it("show the 1959 bound, Gallager's guarantee and the energy limits of a BI-AWGN claim, with margins against its Eb/N0", () => {
    const result = evaluateClaim({ channel: { model: "biawgn", ebn0Db: 2 }, code: { n: 1024, k: 512 }, target: { metric: "bler", value: 1e-4 } });
    const shown = text(renderToStaticMarkup(<ClaimNumbers result={result} />));
    expect(shown).toContain("Least possible BLER, equal-energy codewords (1959 sphere packing)");
    expect(shown).toContain("BLER Gallager's random-coding bound guarantees");
    expect(shown).toMatch(
      new RegExp(
        `Least Eb/N0 the 1959 bound allows Eb/N0 ${result.thresholds.spherePacking!.toFixed(2)} dB ${(result.thresholds.spherePacking! - 2).toFixed(2)} dB`,
      ),
    );
    expect(shown).toContain("Least energy per bit for k bits, any modulation");
    expect(shown).toContain("Reached by orthogonal signalling");
  });

  it("add no radio rows to a BSC claim", () => {
    const result = evaluateClaim({ channel: { model: "bsc", p: 1e-3 }, code: { n: 2048, k: 1640 }, target: { metric: "bler", value: 1e-4 } });
    const shown = text(renderToStaticMarkup(<ClaimNumbers result={result} />));
    expect(shown).not.toContain("1959");
    expect(shown).not.toContain("orthogonal signalling");
  });
});
