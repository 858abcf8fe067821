import type { Metadata } from "next";
import Link from "next/link";
import { listOrganisations } from "@/lib/server/people";
import { orPage, pageViewer, pageTender } from "@/lib/server/pages";
import { authorize } from "@/lib/server/session";
import { tenderSubject } from "@/lib/server/tenders";
import { zoneChoices } from "@/lib/tenders/closing";
import { draftInput } from "@/lib/tenders/draft";
import { editProblem } from "@/lib/tenders/states";
import { TenderForm } from "../../_components/tender-form";

export const metadata: Metadata = { title: "Edit tender" };

export default async function EditTenderPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await pageViewer();
  const tender = await pageTender(id);
  await orPage((async () => authorize(viewer, "update", "Tender", "Only the buying team edits tenders."))());
  const locked = editProblem(tender.state);
  if (locked) {
    return (
      <p role="note" className="panel text-sm">
        {locked} <Link href={`/tenders/${id}`}>Back to the requirements</Link>
      </p>
    );
  }
  await orPage((async () => authorize(viewer, "update", tenderSubject(tender)))());
  const vendors = (await listOrganisations(viewer)).filter((o) => o.kind === "vendor").map((o) => ({ id: o.id, name: o.name }));
  return <TenderForm tenderId={id} defaults={draftInput(tender)} vendors={vendors} zones={zoneChoices()} />;
}
