import Link from "next/link";
import { DateTime } from "@/app/_components/date-time";
import type { ThreadDetail } from "@/lib/server/threads";
import { CloseThreadForm } from "./close-thread-form";
import { ReplyForm } from "./reply-form";

/** Clarification threads with their messages, oldest first, and a reply box where the viewer may post. */
export function ThreadList({ threads, path, empty }: { threads: ThreadDetail[]; path: string; empty: string }) {
  if (threads.length === 0) return <p className="text-sm text-ink-soft">{empty}</p>;
  return (
    <ul className="space-y-4">
      {threads.map((t) => (
        <li key={t.id} aria-label={`Thread: ${t.subject}`} className="rounded-md border border-ink-faint/25 p-3">
          <h3 className="text-sm font-semibold">
            {t.subject} <span className="font-normal text-ink-soft">· {t.tenderReference}</span>
          </h3>
          <ol className="mt-2 space-y-2">
            {t.messages.map((m) => (
              <li key={m.id} className="text-sm">
                <div className="text-xs text-ink-soft">
                  {m.authorLabel} · <DateTime value={m.createdAt} />
                </div>
                <p className="whitespace-pre-wrap">{m.body}</p>
              </li>
            ))}
          </ol>
          {t.closedAt ? (
            <p className="mt-2 text-xs text-ink-soft" data-closed="true">
              Closed <DateTime value={t.closedAt} />: {t.closeReason}
            </p>
          ) : null}
          {t.mayPost ? <ReplyForm threadId={t.id} path={path} subject={t.subject} /> : null}
          {t.mayClose ? <CloseThreadForm threadId={t.id} path={path} subject={t.subject} /> : null}
          {t.mayPublishAddendum ? (
            <Link className="mt-2 inline-block text-sm" href={`/tenders/${t.tenderId}/notices?thread=${t.id}`}>
              Publish the answer to every bidder as an addendum
            </Link>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
