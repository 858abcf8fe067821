// Public surface of the bounds engine: pure functions, no I/O.
export * from "./version";
export * from "./schema";
export { evaluateClaim } from "./verdict";
export { resolveClaim, type OperatingPoint, type Model, type Unit } from "./resolve";
export type { Finding, Severity } from "./findings";
export * from "./channels";
export * from "./biawgn";
export * from "./bsc";
export * from "./bec";
export * from "./normal";
export * from "./residual";
export * from "./gallager";
export * from "./conversions";
export * from "./thresholds";
export * from "./evidence";
export * from "./curves";
export { h2, h2inv, logQ, qFunc, qInv, qInvLog, LOG10_ZERO, toLog10 } from "./special";
export { sciLn, sci } from "./format";
