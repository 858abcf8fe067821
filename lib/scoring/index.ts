// Commercial evaluation: pure score functions, the score sheet, grid rows and workflow checks.
export * from "./types";
export * from "./criteria";
export { buildScoreSheet, confirmedImpossible } from "./sheet";
export { comparisonRows, csvCell, evidenceWord, formatMargin, type ComparisonRow, type PointCell } from "./rows";
export { comparisonProblem, envelopeOpeningProblem, recommendationProblem } from "./rules";
