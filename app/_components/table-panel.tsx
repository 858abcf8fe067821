import type { ReactNode } from "react";

/** A column heading; a right-aligned one (numbers) names its class. */
export type TableColumn = string | { label: string; className: string };

/**
 * A panel holding one titled table, with a single row saying `empty` when it has no rows: the
 * shape of every read-only table on the overview pages.
 */
export function TablePanel({
  label,
  title,
  columns,
  empty,
  isEmpty,
  children,
}: {
  label: string;
  title: ReactNode;
  columns: TableColumn[];
  empty: string;
  isEmpty: boolean;
  children: ReactNode;
}) {
  return (
    <section className="panel overflow-x-auto" aria-label={label}>
      <h2>{title}</h2>
      <table className="data-table mt-2">
        <thead>
          <tr>
            {columns.map((c) =>
              typeof c === "string" ? (
                <th key={c}>{c}</th>
              ) : (
                <th key={c.label} className={c.className}>
                  {c.label}
                </th>
              ),
            )}
          </tr>
        </thead>
        <tbody>
          {children}
          {isEmpty ? (
            <tr>
              <td colSpan={columns.length} className="text-ink-soft">
                {empty}
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </section>
  );
}
