import type { ReactNode } from "react";

/** What is wrong with the values in the address, one line each, under an optional lead sentence. */
export function InputIssues({ issues, lead }: { issues: string[]; lead?: ReactNode }) {
  return (
    <div role="alert" className="rounded-md border border-verdict-impossible/40 px-3 py-2 text-sm text-verdict-impossible">
      {lead ? <p>{lead}</p> : null}
      <ul className="list-disc pl-5">
        {issues.map((m) => (
          <li key={m}>{m}</li>
        ))}
      </ul>
    </div>
  );
}
