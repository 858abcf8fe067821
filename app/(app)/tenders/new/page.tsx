import type { Metadata } from "next";
import { listOrganisations } from "@/lib/server/people";
import { orPage, pageViewer } from "@/lib/server/pages";
import { authorize } from "@/lib/server/session";
import { zoneChoices } from "@/lib/tenders/closing";
import { blankDraftInput } from "@/lib/tenders/draft";
import { TenderForm } from "../_components/tender-form";

export const metadata: Metadata = { title: "New tender" };

export default async function NewTenderPage() {
  const viewer = await pageViewer();
  await orPage((async () => authorize(viewer, "create", "Tender", "Only the buying team drafts tenders."))());
  const vendors = (await listOrganisations(viewer)).filter((o) => o.kind === "vendor").map((o) => ({ id: o.id, name: o.name }));
  return (
    <div className="space-y-4">
      <div>
        <h1>New tender</h1>
        <p className="text-sm text-ink-soft">A draft stays editable until you open it; opening locks the requirements and weights.</p>
      </div>
      <TenderForm defaults={blankDraftInput(new Date())} vendors={vendors} zones={zoneChoices()} />
    </div>
  );
}
