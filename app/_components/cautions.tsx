/** The cautions every page that shows verdicts or memos carries (PRODUCT.md, "Cautions the product shows"). */
export const CAUTIONS =
  "Verdicts judge coding claims against mathematical limits; they do not certify a module's radio-regulatory approval, safety, or fitness for life-safety or medical use, and they do not replace qualification testing. Awards follow your organisation's purchasing policy and the procurement law that applies to it.";

export function Cautions({ className = "" }: { className?: string }) {
  return (
    <p role="note" aria-label="Cautions" className={`text-xs leading-relaxed text-ink-soft ${className}`}>
      {CAUTIONS}
    </p>
  );
}
