import type { Metadata } from "next";
import { DateTime } from "@/app/_components/date-time";
import { ForbiddenError } from "@/lib/server/errors";
import { listAddenda } from "@/lib/server/addenda";
import { listObjections } from "@/lib/server/objections";
import { orPage, pageViewer } from "@/lib/server/pages";
import { AcknowledgeButton, AddendumForm, ObjectionAnswerForm, ObjectionForm } from "./_components/notice-forms";

export const metadata: Metadata = { title: "Notices" };

const unlessForbidden = <T,>(work: Promise<T>) => work.catch((error: unknown) => (error instanceof ForbiddenError ? null : Promise.reject(error)));

/** Addenda to every bidder, and, once awarded, the standstill period and the objections to the award. */
export default async function NoticesPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ thread?: string }> }) {
  const { id } = await params;
  const { thread } = await searchParams;
  const viewer = await pageViewer();
  const [addenda, objections] = await orPage(Promise.all([unlessForbidden(listAddenda(viewer, id)), unlessForbidden(listObjections(viewer, id))]));
  const vendor = viewer.actor.organisationKind === "vendor";
  const standstill = objections?.standstill ?? null;

  return (
    <div className="space-y-4">
      {addenda ? (
        <section className="panel space-y-3" aria-label="Addenda">
          <h2>Addenda</h2>
          <p className="text-xs text-ink-soft">
            Answers that matter to every bidder, sent to all invited vendors without the name of whoever asked. Vendors acknowledge each before they submit.
          </p>
          {addenda.addenda.length === 0 ? <p className="text-sm text-ink-soft">No addendum yet.</p> : null}
          {addenda.addenda.map((a) => (
            <article key={a.id} className="border-t border-ink-faint/20 pt-2">
              <h3 className="text-sm font-semibold">
                Addendum {a.number}: {a.title}
              </h3>
              <p className="text-xs text-ink-soft">
                Published <DateTime value={a.publishedAt} />
              </p>
              <p className="mt-1 whitespace-pre-wrap text-sm">{a.body}</p>
              {"acknowledgedAt" in a ? (
                a.acknowledgedAt ? (
                  <p className="text-xs text-verdict-plausible">
                    Acknowledged <DateTime value={a.acknowledgedAt} />
                  </p>
                ) : (
                  <AcknowledgeButton tenderId={id} addendumId={a.id} number={a.number} />
                )
              ) : (
                <p className="text-xs text-ink-soft">Acknowledged by: {a.acknowledgedBy?.length ? a.acknowledgedBy.join(", ") : "no vendor yet"}</p>
              )}
            </article>
          ))}
          {addenda.mayPublish ? (
            <>
              {thread ? (
                <p className="text-xs text-ink-soft">This addendum answers a clarification thread; the vendor who asked is not named to the others.</p>
              ) : null}
              <AddendumForm tenderId={id} threadId={thread} />
            </>
          ) : null}
        </section>
      ) : null}

      {objections && standstill ? (
        <section className="panel space-y-3" aria-label="Standstill and objections">
          <h2>Standstill and objections</h2>
          <p className="text-sm">
            {standstill.final
              ? `The standstill period of ${standstill.days} days ended on ${standstill.endsWords}: the award is final.`
              : `The award becomes final at the end of a standstill period of ${standstill.days} days, on ${standstill.endsWords}. Until then vendors may object in writing.`}
          </p>
          {objections.objections.length === 0 ? <p className="text-sm text-ink-soft">No objection lodged.</p> : null}
          {objections.objections.map((o) => (
            <article key={o.id} className="border-t border-ink-faint/20 pt-2">
              <p className="text-xs text-ink-soft">
                {vendor ? "Your objection" : o.vendorName}, <DateTime value={o.lodgedAt} />
              </p>
              <p className="whitespace-pre-wrap text-sm">{o.body}</p>
              {o.answer && o.answeredAt ? (
                <div className="mt-2 border-l-2 border-ink-faint/40 pl-3">
                  <p className="text-xs text-ink-soft">
                    Answer of the purchasing team, <DateTime value={o.answeredAt} />
                  </p>
                  <p className="whitespace-pre-wrap text-sm">{o.answer}</p>
                </div>
              ) : o.mayAnswer ? (
                <ObjectionAnswerForm tenderId={id} objectionId={o.id} />
              ) : null}
            </article>
          ))}
          {objections.mayLodge ? <ObjectionForm tenderId={id} /> : null}
        </section>
      ) : null}
      {!addenda && !objections ? <p className="panel text-sm">Nothing here for your role.</p> : null}
    </div>
  );
}
