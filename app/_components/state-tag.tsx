/** The words for each tender state, shared by the tag and the state filters. */
export const STATE_LABELS: Record<string, string> = {
  draft: "Draft",
  open: "Open for offers",
  technical: "Technical evaluation",
  commercial: "Commercial evaluation",
  approval: "In approval",
  awarded: "Awarded",
  cancelled: "Cancelled",
};

export function StateTag({ state }: { state: string }) {
  return (
    <span className="inline-block rounded-full bg-paper-sunk px-2 py-0.5 text-xs font-medium text-ink-soft" data-state={state}>
      {STATE_LABELS[state] ?? state}
    </span>
  );
}
