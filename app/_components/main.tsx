/** The one main landmark of a page, which the skip link (root layout) jumps to. Every shell uses this, never a bare <main>. */
export const MAIN_ID = "main";

export function Main({ className, children }: { className?: string; children: React.ReactNode }) {
  return (
    <main id={MAIN_ID} tabIndex={-1} className={`focus:outline-none ${className ?? ""}`}>
      {children}
    </main>
  );
}
