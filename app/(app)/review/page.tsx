import type { Metadata } from "next";
import Link from "next/link";
import { Cautions } from "@/app/_components/cautions";
import { orPage, pageViewer } from "@/lib/server/pages";
import { listTendersForReview } from "@/lib/server/review";
import { ReviewQueue } from "./_components/review-queue";

export const metadata: Metadata = { title: "Review bench" };

export default async function ReviewBenchPage() {
  const viewer = await pageViewer();
  const tenders = await orPage(listTendersForReview(viewer));
  const undeclared = tenders.filter((t) => !t.declared);
  return (
    <div className="space-y-5">
      <div>
        <h1>Review bench</h1>
        <p className="text-sm text-ink-soft">
          Every claim of the tenders in technical evaluation, with the engine&apos;s verdict, your marks and the lab evidence. Prices are never shown here.
        </p>
      </div>
      {undeclared.length > 0 ? (
        <section className="panel" aria-label="Declarations to make">
          <h2>Declare before you review</h2>
          <p className="text-sm text-ink-soft">You see a tender&apos;s offers only after declaring any conflict of interest with its vendors.</p>
          <ul className="mt-2 space-y-1 text-sm">
            {undeclared.map((t) => (
              <li key={t.id} className="flex items-baseline gap-3">
                <span className="font-mono text-ink-soft">{t.reference}</span>
                <span className="flex-1">{t.title}</span>
                <Link href={`/tenders/${t.id}/review`} aria-label={`Declare to review ${t.reference}`}>
                  Declare to review
                </Link>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <ReviewQueue tenders={tenders.filter((t) => t.declared).map((t) => ({ id: t.id, reference: t.reference }))} />
      <Cautions />
    </div>
  );
}
