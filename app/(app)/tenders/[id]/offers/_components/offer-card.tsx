import { DateTime } from "@/app/_components/date-time";
import { formatMoney } from "@/lib/format";
import { codeRate, type ChannelModel } from "@/lib/offers";
import type { OfferView } from "@/lib/server/offers";
import { ClaimVerdicts } from "./claim-verdicts";

const KIND_LABELS = { datasheet: "Datasheet", "test-report": "Test report" } as const;

/** The code as stated, with the rate worked out whichever way it was given. */
export function CodeSummary({ offer }: { offer: Pick<OfferView, "codeFamily" | "decision" | "n" | "k" | "rate" | "overhead"> }) {
  const rate = codeRate(offer);
  return (
    <span className="tabular-nums">
      {offer.codeFamily}, {offer.decision} decision
      {offer.n ? `, n = ${offer.n.toLocaleString("en-GB")} bits` : ""}
      {offer.k ? `, k = ${offer.k.toLocaleString("en-GB")} bits` : ""}
      {offer.overhead !== null && offer.overhead !== undefined ? `, overhead ${(offer.overhead * 100).toFixed(1)} %` : ""}
      {rate !== null ? `, rate ${rate.toFixed(4)} bits per channel use` : ""}
    </span>
  );
}

export function DocumentList({ documents }: { documents: OfferView["documents"] }) {
  if (documents.length === 0) return <p className="text-sm text-ink-soft">No documents.</p>;
  return (
    <ul className="text-sm">
      {documents.map((d) => (
        <li key={d.id} className="flex flex-wrap gap-x-3">
          <a href={`/api/v1/documents/${d.id}`}>{d.fileName}</a>
          <span className="text-ink-soft">
            {KIND_LABELS[d.kind]}, {(d.size / 1024).toFixed(0)} KB
          </span>
          <span className="font-mono text-xs text-ink-muted" title="SHA-256">
            {d.sha256.slice(0, 16)}…
          </span>
        </li>
      ))}
    </ul>
  );
}

/** The sealed envelope, when the policies let this viewer have it (the vendor, or the buyer once opened). */
function Envelope({ offer }: { offer: OfferView }) {
  if (offer.unitPrice === undefined || offer.currency === undefined) return null;
  const currency = String(offer.currency);
  return (
    <dl className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm md:grid-cols-4" aria-label="Commercial envelope">
      <div>
        <dt className="label">Unit price</dt>
        <dd className="tabular-nums">{formatMoney(Number(offer.unitPrice), currency)}</dd>
      </div>
      <div>
        <dt className="label">Lead time</dt>
        <dd>{offer.leadTimeWeeks} weeks</dd>
      </div>
      <div>
        <dt className="label">Warranty</dt>
        <dd>{offer.warrantyMonths} months</dd>
      </div>
      <div>
        <dt className="label">Price breaks</dt>
        <dd className="tabular-nums">
          {(offer.priceBreaks ?? []).length === 0
            ? "none"
            : offer.priceBreaks!.map((b) => `from ${b.minQuantity.toLocaleString("en-GB")}: ${formatMoney(b.unitPrice, currency)}`).join("; ")}
        </dd>
      </div>
    </dl>
  );
}

export function OfferCard({ offer, model }: { offer: OfferView; model: ChannelModel }) {
  return (
    <section className="panel space-y-3" aria-label={offer.vendorName}>
      <div className="flex flex-wrap items-baseline gap-3">
        <h2 className="flex-1">{offer.vendorName}</h2>
        {offer.status === "withdrawn" ? <span className="rounded-sm border border-ink-faint px-1.5 text-xs">Withdrawn</span> : null}
        <span className="text-xs text-ink-soft">
          Version {offer.version}
          {offer.submittedAt ? (
            <>
              , submitted <DateTime value={offer.submittedAt} />
            </>
          ) : null}
        </span>
      </div>
      <p className="text-sm">
        <strong>{offer.moduleName}</strong> <span className="font-mono text-xs text-ink-soft">{offer.partNumber}</span>
        <br />
        <CodeSummary offer={offer as OfferView & { codeFamily: string; decision: "hard" | "soft" }} />
      </p>
      <ClaimVerdicts claims={offer.claims} model={model} />
      <div>
        <h3 className="label">Documents</h3>
        <DocumentList documents={offer.documents} />
      </div>
      <Envelope offer={offer} />
    </section>
  );
}
