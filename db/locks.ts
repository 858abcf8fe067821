// Every PostgreSQL advisory lock id the app takes, in one place, so that no two uses share one.
// Session locks (pg_advisory_lock) and transaction locks (pg_advisory_xact_lock) share one id space.

export const ADVISORY_LOCKS = {
  /** Held while a process applies the migrations (db/client.ts). */
  migrations: 72_011_947,
  /** Serialises ledger appends so that two writers never chain onto the same entry. */
  ledgerAppend: 72_011_948,
  /** Serialises first starts that load the demo data into an empty database. */
  demoSeed: 72_011_949,
  /** Serialises the hand-out of tender references (RC-yyyy-nnn). */
  tenderReference: 72_011_950,
} as const;

export type AdvisoryLock = keyof typeof ADVISORY_LOCKS;
