/**
 * A wide table's own scroll box: on a narrow screen the table scrolls sideways inside it and the page
 * does not. Focusable and named, so keyboard users can scroll it too (WCAG 2.1.1).
 */
export function ScrollBox({ label, className = "", children }: { label: string; className?: string; children: React.ReactNode }) {
  return (
    <div
      role="region"
      aria-label={label}
      // oxlint-disable-next-line jsx-a11y/no-noninteractive-tabindex -- a scrolling region must take focus to scroll by keyboard
      tabIndex={0}
      className={`relative max-w-full overflow-x-auto rounded focus-visible:outline-2 focus-visible:outline-accent ${className}`}
    >
      {children}
    </div>
  );
}
