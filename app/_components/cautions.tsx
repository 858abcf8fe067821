import { SAFETY_CAUTION } from "@/lib/tenders/safety";

/** The cautions every page that shows verdicts or memos carries (PRODUCT.md, "Cautions the product shows"). */
export const CAUTIONS =
  "Verdicts judge coding claims against mathematical limits; they do not certify a module's radio-regulatory approval, safety, or fitness for life-safety or medical use, and they do not replace qualification testing. Awards follow your organisation's purchasing policy and the procurement law that applies to it.";

/**
 * As a quiet line in the footer of every page, or as a marked note beside verdicts and memos,
 * where the reader is deciding something.
 */
export function Cautions({ className = "", placement = "beside", safety = false }: { className?: string; placement?: "footer" | "beside"; safety?: boolean }) {
  if (placement === "footer") {
    return (
      <p role="note" aria-label="Cautions" className={`text-xs leading-relaxed text-ink-soft ${className}`}>
        {CAUTIONS}
      </p>
    );
  }
  return (
    <aside role="note" aria-label="Cautions" className={`rounded-md border-l-4 border-verdict-evidence/60 bg-paper-raised px-4 py-2.5 text-xs leading-relaxed text-ink-soft ${className}`}>
      {safety ? <p className="mb-1.5 font-semibold text-ink" data-caution="safety">{SAFETY_CAUTION}</p> : null}
      <strong className="mr-1 font-semibold text-ink">Cautions.</strong>
      {CAUTIONS}
    </aside>
  );
}
