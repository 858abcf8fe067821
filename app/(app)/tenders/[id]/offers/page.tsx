import type { Metadata } from "next";
import Link from "next/link";
import { Cautions } from "@/app/_components/cautions";
import { offersSealed } from "@/policies";
import { submissionRefusal } from "@/lib/offers";
import { ForbiddenError } from "@/lib/server/errors";
import { listOffers } from "@/lib/server/offers";
import { orPage, pageViewer, pageTender } from "@/lib/server/pages";
import { OfferCard } from "./_components/offer-card";

export const metadata: Metadata = { title: "Offers" };

export default async function OffersPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await pageViewer();
  const tender = await pageTender(id);
  const vendor = viewer.actor.organisationKind === "vendor";
  // An engineer or approver who has not declared yet gets the way forward rather than a bare refusal.
  const offers = await orPage(
    listOffers(viewer, id).catch((error: unknown) => {
      if (error instanceof ForbiddenError && !vendor) return null;
      throw error;
    }),
  );
  const open = submissionRefusal(tender, new Date()) === null;
  const envelopesSealed = !vendor && tender.envelopesOpenedAt === null;
  const sealed = !vendor && offersSealed(tender);

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-3">
        <h2 className="flex-1">Offers</h2>
        {vendor && open ? (
          <Link className="btn" href={`/tenders/${id}/offer`}>
            {offers && offers.length > 0 ? "Open the offer form" : "Submit an offer"}
          </Link>
        ) : null}
      </div>
      {envelopesSealed ? (
        <p className="text-sm text-ink-soft">Commercial envelopes stay sealed until the buyer opens them after the technical sign-off.</p>
      ) : null}
      {sealed ? (
        <p className="panel text-sm">Offers stay sealed to the buying side until the tender closes; nothing of them can be read before then.</p>
      ) : offers === null ? (
        <p className="panel text-sm">Declare any conflict of interest on this tender (Review tab) before you read its offers.</p>
      ) : offers.length === 0 ? (
        <p className="panel text-sm text-ink-soft">{vendor ? "Your organisation has not submitted an offer to this tender." : "No offers to show."}</p>
      ) : (
        offers.map((offer) => <OfferCard key={offer.id} offer={offer} model={tender.channelModel} />)
      )}
      <Cautions />
    </div>
  );
}
