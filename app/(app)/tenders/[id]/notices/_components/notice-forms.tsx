"use client";

import { useState, useTransition } from "react";
import { acknowledgeAddendumAction, answerObjectionAction, lodgeObjectionAction, publishAddendumAction } from "../actions";
import { addendumSchema, objectionAnswerSchema, objectionSchema } from "@/lib/validation/notices";
import { TextForm } from "./text-form";

/** threadId: the clarification it answers, kept for the buying side only (vendors never see who asked). */
export function AddendumForm({ tenderId, threadId }: { tenderId: string; threadId?: string }) {
  return (
    <TextForm
      extra={threadId ? { threadId } : {}}
      label="Publish an addendum"
      submit="Publish to every invited vendor"
      fields={[
        { name: "title", label: "Title" },
        { name: "body", label: "Addendum (do not name the vendor who asked)", rows: 5 },
      ]}
      schema={addendumSchema}
      send={(values) => publishAddendumAction(tenderId, values)}
    />
  );
}

export function ObjectionForm({ tenderId }: { tenderId: string }) {
  return (
    <TextForm
      label="Lodge an objection"
      submit="Lodge the objection"
      fields={[{ name: "body", label: "Your objection, in writing", rows: 6 }]}
      schema={objectionSchema}
      send={(values) => lodgeObjectionAction(tenderId, values)}
    />
  );
}

export function ObjectionAnswerForm({ tenderId, objectionId }: { tenderId: string; objectionId: string }) {
  return (
    <TextForm
      label="Answer the objection"
      submit="Send the answer to the vendor"
      fields={[{ name: "answer", label: "Your answer, in writing", rows: 4 }]}
      schema={objectionAnswerSchema}
      send={(values) => answerObjectionAction(tenderId, objectionId, values)}
    />
  );
}

export function AcknowledgeButton({ tenderId, addendumId, number }: { tenderId: string; addendumId: string; number: number }) {
  const [message, setMessage] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();
  return (
    <div>
      <button
        type="button"
        className="btn-quiet"
        disabled={pending}
        onClick={() => startTransition(async () => setMessage((await acknowledgeAddendumAction(tenderId, addendumId)).message ?? null))}
      >
        {pending ? "Acknowledging…" : `Acknowledge addendum ${number}`}
      </button>
      {message ? (
        <p role="status" className="text-sm">
          {message}
        </p>
      ) : null}
    </div>
  );
}
