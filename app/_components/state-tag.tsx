import { STATE_LOOK, type StateLook } from "./state-look";

/** The words for each tender state, shared by the tag and the state filters. */
export const STATE_LABELS: Record<string, string> = Object.fromEntries(Object.entries(STATE_LOOK).map(([state, look]) => [state, look.label]));

/** The dial: a ring filled by the share of the way the tender has come, or struck through when cancelled. */
function Dial({ look }: { look: StateLook }) {
  const { fill, struck, outline, ink } = look;
  // A wedge from twelve o'clock, clockwise, for fractions between 0 and 1.
  const angle = 2 * Math.PI * fill;
  const x = 6 + 4 * Math.sin(angle);
  const y = 6 - 4 * Math.cos(angle);
  return (
    <svg aria-hidden viewBox="0 0 12 12" width="12" height="12" className="shrink-0">
      <circle cx="6" cy="6" r="5" fill="none" stroke={ink} strokeWidth="1.5" strokeDasharray={outline === "dashed" ? "2 1.6" : undefined} />
      {fill >= 1 ? <circle cx="6" cy="6" r="4" fill={ink} /> : null}
      {fill > 0 && fill < 1 ? <path d={`M6 6 L6 2 A4 4 0 ${fill > 0.5 ? 1 : 0} 1 ${x.toFixed(3)} ${y.toFixed(3)} Z`} fill={ink} /> : null}
      {struck ? <line x1="2.5" y1="9.5" x2="9.5" y2="2.5" stroke={ink} strokeWidth="1.5" /> : null}
    </svg>
  );
}

/** A tender's state: its own colour and its own dial, so that the states read apart in grey-scale too. */
export function StateTag({ state }: { state: string }) {
  const look = STATE_LOOK[state as keyof typeof STATE_LOOK];
  if (!look)
    return (
      <span className="inline-block rounded-full border border-ink-faint px-2 py-0.5 text-xs font-medium text-ink-soft" data-state={state}>
        {state}
      </span>
    );
  return (
    <span
      className="inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-medium"
      style={{ color: look.ink, backgroundColor: look.ground, borderColor: look.edge, borderStyle: look.outline }}
      data-state={state}
    >
      <Dial look={look} />
      {look.label}
    </span>
  );
}
