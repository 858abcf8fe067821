import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { DateTime } from "@/app/_components/date-time";
import { listCapturedMail } from "@/lib/mail";
import { orPage, pageViewer } from "@/lib/server/pages";
import { authorize } from "@/lib/server/session";
import { ensureLocalServices, mailroomEnabled } from "@/lib/server/services";

export const metadata: Metadata = { title: "Mailroom" };

export default async function MailroomPage() {
  if (!mailroomEnabled()) notFound();
  const viewer = await pageViewer();
  await orPage((async () => authorize(viewer, "use", "Mailroom"))());
  await ensureLocalServices();
  const mail = listCapturedMail();
  return (
    <div className="space-y-4">
      <div>
        <h1>Mailroom</h1>
        <p className="text-sm text-ink-soft">E-mail the system sent, caught by the local mail server. Development only: with a real mail server configured this page does not exist.</p>
      </div>
      {mail.length === 0 ? <p className="text-sm text-ink-soft">No mail yet.</p> : null}
      <ul className="space-y-3">
        {mail.map((m) => (
          <li key={m.id} className="panel" aria-label={`Mail: ${m.subject}`}>
            <div className="flex flex-wrap items-baseline gap-x-4 text-sm">
              <strong>{m.subject}</strong>
              <span className="text-ink-soft">to {m.to.join(", ")}</span>
              <span className="ml-auto text-xs text-ink-soft"><DateTime value={m.receivedAt} /></span>
            </div>
            <pre className="mt-2 whitespace-pre-wrap font-sans text-sm text-ink">{m.text}</pre>
          </li>
        ))}
      </ul>
    </div>
  );
}
