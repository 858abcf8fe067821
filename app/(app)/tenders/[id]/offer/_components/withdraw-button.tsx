"use client";

import { useState, useTransition } from "react";
import { withdrawOfferAction } from "../actions";

export function WithdrawButton({ tenderId, offerId }: { tenderId: string; offerId: string }) {
  const [message, setMessage] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();
  const withdraw = () => {
    if (!window.confirm("Withdraw this offer? It stays on record as withdrawn; you may submit again until closing.")) return;
    startTransition(async () => setMessage((await withdrawOfferAction(tenderId, offerId)).message ?? null));
  };
  return (
    <div>
      <button type="button" className="btn-quiet" onClick={withdraw} disabled={pending}>
        {pending ? "Withdrawing…" : "Withdraw offer"}
      </button>
      {message ? (
        <p role="status" className="text-sm">
          {message}
        </p>
      ) : null}
    </div>
  );
}
