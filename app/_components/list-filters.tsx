import Link from "next/link";
import type { ReactNode } from "react";

/**
 * The filters above a server-paged list: a plain GET form, so that the filters land in the
 * address (shareable, and working without scripts) and a new filter starts again at page 1.
 */
export function FilterForm({ action, label, filtered, children }: { action: string; label: string; filtered: boolean; children: ReactNode }) {
  return (
    <form method="get" action={action} className="flex flex-wrap items-end gap-3" aria-label={label}>
      {children}
      <button type="submit" className="btn-quiet">
        Show
      </button>
      {filtered ? (
        <Link href={action} className="text-sm">
          Clear the filters
        </Link>
      ) : null}
    </form>
  );
}

export function FilterText({ id, name, label, value, maxLength = 200 }: { id: string; name: string; label: string; value?: string; maxLength?: number }) {
  return (
    <div>
      <label className="label" htmlFor={id}>
        {label}
      </label>
      <input id={id} name={name} className="field w-56" defaultValue={value ?? ""} maxLength={maxLength} />
    </div>
  );
}

/** A choice among options, the first being "any" (no filter). */
export function FilterSelect({
  id,
  name,
  label,
  value,
  any,
  options,
}: {
  id: string;
  name: string;
  label: string;
  value?: string;
  any: string;
  options: [string, string][];
}) {
  return (
    <div>
      <label className="label" htmlFor={id}>
        {label}
      </label>
      <select id={id} name={name} className="field" defaultValue={value ?? ""}>
        <option value="">{any}</option>
        {options.map(([v, text]) => (
          <option key={v} value={v}>
            {text}
          </option>
        ))}
      </select>
    </div>
  );
}
