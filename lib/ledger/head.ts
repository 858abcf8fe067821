// How a ledger head is quoted where people read it (memos, notices, Memo check); no Node imports, so pages can use it.

/** An entry of the chain by its number and hash: the newest one, as of some moment. */
export interface Head {
  seq: number;
  hash: string;
}

/** How a head is quoted in memos and notices: the entry number and the first 12 hex digits of its hash. */
export function headLabel(head: Head): string {
  return `entry #${head.seq}, hash ${head.hash.slice(0, 12)}`;
}

/** The line that memos and notices carry. */
export function headLine(head: Head | null): string {
  return head ? `Ledger head when issued: ${headLabel(head)}.` : "Ledger head when issued: the ledger was empty.";
}
