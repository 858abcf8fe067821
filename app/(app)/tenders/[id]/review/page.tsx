import type { Metadata } from "next";
import { FormStatus } from "@/app/_components/form-status";
import Link from "next/link";
import { Cautions } from "@/app/_components/cautions";
import { DateTime } from "@/app/_components/date-time";
import { VerdictBadge } from "@/app/_components/verdict-badge";
import { formatCondition, formatSci } from "@/lib/format";
import { EVIDENCE_LABELS, MARK_LABELS } from "@/lib/review/labels";
import { ForbiddenError, NotFoundError } from "@/lib/server/errors";
import { getDeclaration, listDeclarableVendors } from "@/lib/server/declarations";
import { pageQuery, pageViewer, pageTender } from "@/lib/server/pages";
import { Pager, pageHref } from "@/app/_components/pager";
import { MAX_PAGE_SIZE, pagingSchema } from "@/lib/validation/paging";
import { listClaimQueue, type QueueRow } from "@/lib/server/review";
import { getSignoffState } from "@/lib/server/signoff";
import { tenderSubject } from "@/lib/server/tenders";
import { listThreads } from "@/lib/server/threads";
import { ThreadList } from "@/app/(app)/threads/_components/thread-list";
import { DeclarationForm } from "./_components/declaration-form";
import { SignoffCard } from "./_components/signoff-card";
import { ScrollBox } from "@/app/_components/scroll-box";

export const metadata: Metadata = { title: "Review" };

/** A part of the page this viewer may not see is left out rather than failing the page. */
async function ifAllowed<T>(work: Promise<T>): Promise<T | null> {
  try {
    return await work;
  } catch (error) {
    if (error instanceof ForbiddenError || error instanceof NotFoundError) return null;
    throw error;
  }
}

/** The tab pages its claims a hundred at a time (a tender's offers times its operating points). */
const tabPagingSchema = pagingSchema.extend({ size: pagingSchema.shape.size.default(MAX_PAGE_SIZE) });

export default async function TenderReviewPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { id } = await params;
  const { query: paging, problem } = pageQuery(await searchParams, tabPagingSchema);
  const viewer = await pageViewer();
  const tender = await pageTender(id);
  const vendor = viewer.actor.organisationKind === "vendor";
  const declares = !vendor && viewer.actor.roles.some((r) => r === "engineer" || r === "approver");
  const declaration = declares ? await ifAllowed(getDeclaration(viewer, id)) : null;
  const mayDeclare = declares && !declaration && viewer.ability.can("declare", tenderSubject(tender));
  const vendors = mayDeclare ? await listDeclarableVendors(viewer, id) : [];
  const claims = await ifAllowed(listClaimQueue(viewer, { tenderId: id, ...paging }));
  const signoff = vendor ? null : await ifAllowed(getSignoffState(viewer, id));
  const threads = viewer.ability.can("list", "Thread") ? await ifAllowed(listThreads(viewer, { tenderId: id })) : null;

  return (
    <div className="space-y-5">
      {declares ? (
        <section className="panel space-y-2" aria-label="Declaration">
          <h2>Conflict of interest</h2>
          {declaration ? (
            <p className="text-sm">
              You declared{" "}
              {declaration.conflictedOrgIds.length === 0
                ? "no conflict"
                : `a conflict with ${declaration.conflictedOrgIds.length} vendor${declaration.conflictedOrgIds.length === 1 ? "" : "s"}, whose offers stay hidden from you`}{" "}
              on <DateTime value={declaration.createdAt} />.
            </p>
          ) : mayDeclare ? (
            <DeclarationForm tenderId={id} vendors={vendors} />
          ) : (
            <p className="text-sm text-ink-soft">Declarations open once the tender is published.</p>
          )}
        </section>
      ) : null}

      <FormStatus result={{ ok: false, message: problem ?? undefined }} />
      {claims ? <ClaimsTable claims={claims.claims} vendor={vendor} /> : null}
      {claims && claims.pages > 1 ? <Pager info={claims} noun={["claim", "claims"]} href={(page) => pageHref(`/tenders/${id}/review`, {}, page)} /> : null}

      {signoff ? <SignoffCard tenderId={id} state={signoff} /> : null}

      {threads ? (
        <section className="panel space-y-3" aria-label={vendor ? "Questions from the evaluators" : "Clarification threads"}>
          <h2>{vendor ? "Questions from the evaluators" : "Clarification threads"}</h2>
          <ThreadList threads={threads} path={`/tenders/${id}/review`} empty="No question has been asked on this tender." />
        </section>
      ) : null}
      <Cautions safety={tender.safetyRelevant} />
    </div>
  );
}

function ClaimsTable({ claims, vendor }: { claims: QueueRow[]; vendor: boolean }) {
  return (
    <section className="panel" aria-label={vendor ? "Your claims" : "Claims of this tender"}>
      <h2>{vendor ? "Your claims and their marks" : "Claims of this tender"}</h2>
      {claims.length === 0 ? (
        <p className="text-sm text-ink-soft">No claim to show.</p>
      ) : (
        <ScrollBox label={vendor ? "Your claims" : "Claims"} className="mt-2">
          <table className="data-table">
            <thead>
              <tr>
                <th>Verdict</th>
                {vendor ? null : <th>Vendor</th>}
                <th>Operating point</th>
                <th>Claimed</th>
                <th>Mark</th>
                {vendor ? null : <th>Evidence</th>}
                <th>
                  <span className="sr-only">Open</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {claims.map((c) => (
                <tr key={c.id}>
                  <td>
                    <VerdictBadge verdict={c.verdict} />
                  </td>
                  {vendor ? null : <td>{c.vendorName}</td>}
                  <td>
                    {c.pointLabel}: {formatCondition(c.channelModel, c.channelValue)}
                  </td>
                  <td className="tabular-nums">{c.metric === "ncg" ? `NCG ${c.value} dB` : `${c.metric.toUpperCase()} ${formatSci(c.value)}`}</td>
                  <td>{c.mark ? MARK_LABELS[c.mark as keyof typeof MARK_LABELS] : "Not marked"}</td>
                  {vendor ? null : <td>{c.evidence ? EVIDENCE_LABELS[c.evidence] : ""}</td>}
                  <td>
                    {vendor ? null : (
                      <Link href={`/review/claims/${c.id}`} aria-label={`Open claim ${c.vendorName} ${c.pointLabel}`}>
                        Open
                      </Link>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </ScrollBox>
      )}
    </section>
  );
}
