// Pure rules for vendor offers: engine input mapping, submission rules, versions, records. No I/O.
export * from "./claim-input";
export * from "./evaluate";
export * from "./records";
export * from "./rules";
