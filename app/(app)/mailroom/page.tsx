import type { Metadata } from "next";
import { FormStatus } from "@/app/_components/form-status";
import { notFound } from "next/navigation";
import { DateTime } from "@/app/_components/date-time";
import { FilterForm, FilterText } from "@/app/_components/list-filters";
import { Pager, pageHref } from "@/app/_components/pager";
import { findCapturedMail } from "@/lib/mail";
import { orPage, pageQuery, pageViewer } from "@/lib/server/pages";
import { authorize } from "@/lib/server/session";
import { ensureLocalServices, mailroomEnabled } from "@/lib/server/services";
import { mailroomQuerySchema } from "@/lib/validation/mailroom";

export const metadata: Metadata = { title: "Mailroom" };

type Search = Promise<Record<string, string | string[] | undefined>>;

export default async function MailroomPage({ searchParams }: { searchParams: Search }) {
  if (!mailroomEnabled()) notFound();
  const viewer = await pageViewer();
  await orPage((async () => authorize(viewer, "use", "Mailroom"))());
  await ensureLocalServices();
  const { query, problem } = pageQuery(await searchParams, mailroomQuerySchema);
  const found = findCapturedMail(query);
  const { page: _page, size, ...filters } = query;
  const keep = { ...filters, size: size === mailroomQuerySchema.parse({}).size ? undefined : size };
  const filtered = Boolean(filters.to || filters.subject);
  return (
    <div className="space-y-4">
      <div>
        <h1>Mailroom</h1>
        <p className="text-sm text-ink-soft">
          E-mail the system sent, caught by the local mail server. Development only: with a real mail server configured this page does not exist.
        </p>
      </div>
      <FilterForm action="/mailroom" label="Find mail" filtered={filtered}>
        <FilterText id="mail-to" name="to" label="Recipient contains" value={query.to} maxLength={254} />
        <FilterText id="mail-subject" name="subject" label="Subject contains" value={query.subject} />
      </FilterForm>
      <FormStatus result={{ ok: false, message: problem ?? undefined }} />
      {found.total === 0 ? <p className="text-sm text-ink-soft">{filtered ? "No mail matches these filters." : "No mail yet."}</p> : null}
      <ul className="space-y-3">
        {found.mail.map((m) => (
          <li key={m.id} className="panel" aria-label={`Mail: ${m.subject}`}>
            <div className="flex flex-wrap items-baseline gap-x-4 text-sm">
              <strong>{m.subject}</strong>
              <span className="text-ink-soft">to {m.to.join(", ")}</span>
              <span className="ml-auto text-xs text-ink-soft">
                <DateTime value={m.receivedAt} />
              </span>
            </div>
            <pre className="mt-2 whitespace-pre-wrap font-sans text-sm text-ink [overflow-wrap:anywhere]">{m.text}</pre>
          </li>
        ))}
      </ul>
      {found.total > 0 ? <Pager info={found} noun={["message", "messages"]} href={(page) => pageHref("/mailroom", keep, page)} /> : null}
    </div>
  );
}
