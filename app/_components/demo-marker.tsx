import { connection } from "next/server";
import { env, type Env } from "@/lib/env";

/** The mark itself for these settings: shown in demo mode (development, tests, DEMO=1), never in production. */
export function demoMarkerFor(settings: Pick<Env, "demoMode">) {
  if (!settings.demoMode) return null;
  return (
    <div
      role="note"
      data-testid="demo-marker"
      title="Demo: invented data, local mail and storage. Not for real tenders."
      className="pointer-events-none fixed bottom-2 left-2 z-50 rounded border border-verdict-evidence/50 bg-paper-raised/90 px-1.5 py-0.5 text-[11px] font-medium uppercase tracking-wide text-verdict-evidence"
    >
      demo
    </div>
  );
}

/** A small "demo" mark on every page in demo mode. */
export async function DemoMarker() {
  // Read at request time: a page rendered at build time must not keep the build's settings.
  await connection();
  return demoMarkerFor(env());
}
