const LABELS: Record<string, string> = {
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
      {LABELS[state] ?? state}
    </span>
  );
}
