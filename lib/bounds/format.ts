// Number formatting for findings: plain English, probabilities in scientific notation.
import { LOG10E } from "./special";

/** A probability given by its natural log, e.g. "1.2e-6"; works far below the double range. */
export function sciLn(lnValue: number): string {
  if (lnValue === -Infinity) return "0";
  const l10 = lnValue * LOG10E;
  // Beyond a million decades the mantissa has no digits left in a double: give the power alone.
  if (Math.abs(l10) >= 1e6) return `10^(${l10.toPrecision(4)})`;
  let e = Math.floor(l10);
  let m = 10 ** (l10 - e);
  if (Number(m.toFixed(1)) >= 10) {
    m /= 10;
    e += 1;
  }
  return `${m.toFixed(1)}e${e}`;
}

/** A plain probability in scientific notation. */
export function sci(x: number): string {
  return x === 0 ? "0" : sciLn(Math.log(x));
}

/** A rate or capacity, 4 decimals. */
export function fmtRate(x: number): string {
  return x.toFixed(4);
}

export function fmtDb(x: number): string {
  return `${x.toFixed(2)} dB`;
}

/** A channel parameter in its unit. */
export function fmtChannel(x: number, unit: "p" | "e" | "ebn0Db" | "esn0Db"): string {
  if (unit === "p") return `p = ${sci(x)}`;
  if (unit === "e") return `e = ${x < 1e-3 ? sci(x) : x.toFixed(4)}`;
  return `${unit === "ebn0Db" ? "Eb/N0" : "Es/N0"} = ${fmtDb(x)}`;
}

/** n and k for messages; a real log2 M shows two decimals. */
export function fmtCode(n: number, k: number): string {
  return `n = ${n}, k = ${Number.isInteger(k) ? k : k.toFixed(2)}`;
}
