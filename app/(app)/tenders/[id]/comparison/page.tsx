import type { Metadata } from "next";
import { forbidden } from "next/navigation";
import { asSubject } from "@/policies";
import { Cautions } from "@/app/_components/cautions";
import { SensitivityCaution } from "@/app/_components/sensitivity-summary";
import { orPage, pageViewer, pageTender } from "@/lib/server/pages";
import { getComparison } from "@/lib/server/comparison";
import { listRecommendations } from "@/lib/server/recommendations";
import { ComparisonView } from "./_components/comparison-view";

export const metadata: Metadata = { title: "Comparison" };

/** The Comparison tab: read on the server through lib/server/comparison, which authorises itself too. */
export default async function ComparisonPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await pageViewer();
  const tender = await pageTender(id);
  if (!viewer.ability.can("read", asSubject("Score", { tenderId: id }))) forbidden();
  const [data, recommendations] = await Promise.all([
    orPage(getComparison(viewer, tender.id)),
    viewer.ability.can("read", "Recommendation") ? orPage(listRecommendations(viewer, tender.id)) : [],
  ]);
  return (
    <div className="space-y-4">
      <Cautions />
      {tender.operatingPoints.some((p) => p.sensitivity) ? <SensitivityCaution /> : null}
      <ComparisonView tenderId={tender.id} reference={tender.reference} data={data} recommendations={recommendations} />
    </div>
  );
}
