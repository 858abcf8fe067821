"use client";

import { Main } from "./_components/main";

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <Main className="mx-auto max-w-lg px-6 py-24 text-center">
      <h1>Something went wrong</h1>
      <p className="mt-2 text-sm text-ink-soft">
        The page could not be shown. Nothing you submitted was half-saved: every change is all or nothing.
        {error.digest ? ` Reference: ${error.digest}.` : ""}
      </p>
      <button type="button" className="btn mt-6" onClick={reset}>
        Try again
      </button>
    </Main>
  );
}
