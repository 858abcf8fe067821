"use client";

import { useRef, useState, useTransition } from "react";
import { useRouter } from "next/navigation";

/** Uploads a PDF to the current version through the route handler (server actions cap bodies). */
export function DocumentUpload({ offerId }: { offerId: string }) {
  const router = useRouter();
  const formRef = useRef<HTMLFormElement>(null);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, startTransition] = useTransition();

  const upload = (event: React.FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const body = new FormData(event.currentTarget);
    startTransition(async () => {
      const response = await fetch(`/api/v1/offers/${offerId}/documents`, { method: "POST", body });
      const json = (await response.json().catch(() => ({}))) as { error?: string; fileName?: string };
      if (!response.ok) {
        setMessage({ ok: false, text: json.error ?? `The upload failed (${response.status}).` });
        return;
      }
      setMessage({ ok: true, text: `${json.fileName} uploaded.` });
      formRef.current?.reset();
      router.refresh();
    });
  };

  return (
    <form ref={formRef} onSubmit={upload} className="flex flex-wrap items-end gap-3" aria-label="Upload a document">
      <div>
        <label className="label" htmlFor="doc-file">
          PDF file (at most 20 MB)
        </label>
        <input id="doc-file" name="file" type="file" accept="application/pdf,.pdf" required className="text-sm" />
      </div>
      <div>
        <label className="label" htmlFor="doc-kind">
          Kind
        </label>
        <select id="doc-kind" name="kind" className="field">
          <option value="datasheet">Datasheet</option>
          <option value="test-report">Test report</option>
        </select>
      </div>
      <button type="submit" className="btn-quiet" disabled={pending}>
        {pending ? "Uploading…" : "Upload"}
      </button>
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={`w-full text-sm ${message.ok ? "text-verdict-plausible" : "text-verdict-impossible"}`}>
          {message.text}
        </p>
      ) : null}
    </form>
  );
}
