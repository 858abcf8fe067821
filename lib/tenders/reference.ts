/** Tender references read "RC-2027-004": the year it was drafted and a sequence within that year. */
const PATTERN = /^RC-(\d{4})-(\d{3,})$/;

export function formatReference(year: number, sequence: number): string {
  return `RC-${year}-${String(sequence).padStart(3, "0")}`;
}

/** The next free reference of a year, after the highest one already taken. */
export function nextReference(taken: readonly string[], year: number): string {
  let highest = 0;
  for (const reference of taken) {
    const match = PATTERN.exec(reference);
    if (match && Number(match[1]) === year) highest = Math.max(highest, Number(match[2]));
  }
  return formatReference(year, highest + 1);
}
