import { CAUTIONS, SAFETY_CAUTION } from "@/lib/cautions";

export { CAUTIONS };

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
    <aside
      role="note"
      aria-label="Cautions"
      className={`rounded-md border-l-4 border-verdict-evidence/60 bg-paper-raised px-4 py-2.5 text-xs leading-relaxed text-ink-soft ${className}`}
    >
      {safety ? (
        <p className="mb-1.5 font-semibold text-ink" data-caution="safety">
          {SAFETY_CAUTION}
        </p>
      ) : null}
      <strong className="mr-1 font-semibold text-ink">Cautions.</strong>
      {CAUTIONS}
    </aside>
  );
}
