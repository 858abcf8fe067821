/**
 * What a slow page shows while the server prepares it (the loading.tsx files): a few quiet bars in
 * the page's shape and one sentence for screen readers. No motion for people who ask for none.
 */
export function PageSkeleton({ what, rows = 4, panels = 1 }: { what: string; rows?: number; panels?: number }) {
  return (
    <div role="status" aria-live="polite" className="space-y-4">
      <span className="sr-only">{`Preparing ${what}…`}</span>
      {Array.from({ length: panels }, (_, panel) => (
        <div key={panel} aria-hidden="true" className="panel space-y-3 motion-safe:animate-pulse">
          <div className="h-4 w-1/3 rounded bg-paper-sunk" />
          {Array.from({ length: rows }, (_, row) => (
            <div key={row} className="h-3 rounded bg-paper-sunk" style={{ width: `${92 - ((row * 17) % 40)}%` }} />
          ))}
        </div>
      ))}
    </div>
  );
}
