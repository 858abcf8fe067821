// The database schema, one file per part of a tender's life; drizzle-kit reads this index.
export * from "./people";
export * from "./tenders";
export * from "./offers";
export * from "./evaluation";
export * from "./award";
export * from "./ledger";
export * from "./notices";
export * from "./sign-in";
