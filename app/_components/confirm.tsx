"use client";

import { useRef, useState, type ReactNode } from "react";

export interface ConfirmRequest {
  /** The question: "Open the envelopes?" */
  title: string;
  /** What will happen, in plain words, including that it cannot be undone. */
  consequences: ReactNode;
  /** The confirming button's label: the act itself ("Open the envelopes"). */
  action: string;
}

/**
 * Asks before an irreversible step: ask(request, run) opens a modal saying what will happen and
 * runs `run` only on confirmation. The server rules never depend on it; it spares a slip.
 */
export function useConfirm(): { ask: (request: ConfirmRequest, run: () => void) => void; dialog: ReactNode } {
  const ref = useRef<HTMLDialogElement>(null);
  const [request, setRequest] = useState<ConfirmRequest | null>(null);
  const pending = useRef<(() => void) | null>(null);
  const close = () => ref.current?.close();
  const ask = (next: ConfirmRequest, run: () => void) => {
    pending.current = run;
    setRequest(next);
    queueMicrotask(() => ref.current?.showModal());
  };
  const confirm = () => {
    close();
    pending.current?.();
    pending.current = null;
  };
  const dialog = (
    <dialog ref={ref} aria-labelledby="confirm-title" className="max-w-lg rounded border border-ink-faint/30 bg-white p-5 shadow-lg backdrop:bg-black/30">
      {request ? (
        <div className="space-y-3">
          <h2 id="confirm-title">{request.title}</h2>
          <div className="text-sm">{request.consequences}</div>
          <div className="flex justify-end gap-2">
            <button type="button" className="btn-quiet" onClick={close}>
              Go back
            </button>
            <button type="button" className="btn" onClick={confirm}>
              {request.action}
            </button>
          </div>
        </div>
      ) : null}
    </dialog>
  );
  return { ask, dialog };
}
