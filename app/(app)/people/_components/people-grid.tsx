"use client";

import { useMemo, useState, useTransition } from "react";
import type { ColDef } from "ag-grid-community";
import { DataGrid } from "@/app/_components/data-grid";
import { formOptionalDecimal } from "@/lib/numbers";
import { ROLES, type OrganisationKind } from "@/policies/vocabulary";
import { updateUserAction, type FormResult } from "../actions";

export interface PersonRow {
  id: string;
  name: string;
  email: string;
  active: boolean;
  approvalLimit: number | null;
  organisationName: string;
  organisationKind: OrganisationKind;
  roles: string[];
}

export function PeopleGrid({ people, selfId }: { people: PersonRow[]; selfId: string }) {
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const selected = people.find((p) => p.id === selectedId) ?? null;
  const columns = useMemo<ColDef<PersonRow>[]>(
    () => [
      { field: "name", headerName: "Name", flex: 1.2 },
      { field: "email", headerName: "E-mail", flex: 1.5 },
      { field: "organisationName", headerName: "Organisation", flex: 1.2 },
      { headerName: "Roles", valueGetter: (p) => p.data?.roles.join(", "), flex: 1 },
      { headerName: "Status", valueGetter: (p) => (p.data?.active ? "active" : "deactivated"), width: 120 },
      {
        field: "approvalLimit",
        headerName: "Approval limit",
        type: "rightAligned",
        width: 150,
        valueFormatter: (p) => (p.value == null ? "" : Number(p.value).toLocaleString("en-GB")),
      },
    ],
    [],
  );
  return (
    <div className="space-y-3">
      <DataGrid<PersonRow>
        label="People"
        rowData={people}
        columnDefs={columns}
        getRowId={(p) => p.data.id}
        // One page from the server, in the server's order: filters and paging are above and below the grid.
        defaultColDef={{ sortable: false }}
        rowSelection={{ mode: "singleRow", checkboxes: false, enableClickSelection: true }}
        onSelectionChanged={(e) => setSelectedId(e.api.getSelectedRows()[0]?.id ?? null)}
        height={360}
        empty={{ title: "No people in this view", hint: "Create one with the New account form on this page; it appears here at once." }}
      />
      {selected ? (
        <PersonEditor key={selected.id} person={selected} isSelf={selected.id === selfId} />
      ) : (
        <p className="text-sm text-ink-soft">Select a person to change roles, approval limit or access.</p>
      )}
    </div>
  );
}

function PersonEditor({ person, isSelf }: { person: PersonRow; isSelf: boolean }) {
  const [roles, setRoles] = useState<string[]>(person.roles);
  const [limit, setLimit] = useState(person.approvalLimit == null ? "" : String(person.approvalLimit));
  const [result, setResult] = useState<FormResult>({});
  const [pending, startTransition] = useTransition();
  const allowed = person.organisationKind === "vendor" ? ["vendor"] : ROLES.filter((r) => r !== "vendor");
  const save = (values: Record<string, unknown>) => startTransition(async () => setResult(await updateUserAction(person.id, values)));

  return (
    <section className="panel space-y-3" aria-label={`Edit ${person.name}`}>
      <h2>
        {person.name} <span className="font-normal text-ink-soft">· {person.email}</span>
      </h2>
      {result.message ? (
        <p role={result.ok ? "status" : "alert"} className={`text-sm ${result.ok ? "text-verdict-plausible" : "text-verdict-impossible"}`}>
          {result.message}
        </p>
      ) : null}
      <fieldset className="flex flex-wrap items-center gap-3 text-sm">
        <legend className="label">Roles</legend>
        {allowed.map((role) => (
          <label key={role} className="inline-flex items-center gap-1">
            <input
              type="checkbox"
              checked={roles.includes(role)}
              onChange={(e) => setRoles(e.target.checked ? [...roles, role] : roles.filter((r) => r !== role))}
            />{" "}
            {role}
          </label>
        ))}
        <button type="button" className="btn-quiet" disabled={pending} onClick={() => save({ roles })}>
          Save roles
        </button>
      </fieldset>
      <div className="flex items-end gap-2 text-sm">
        <div>
          <label className="label" htmlFor="limit">
            Approval limit
          </label>
          <input id="limit" className="field w-40" inputMode="decimal" value={limit} onChange={(e) => setLimit(e.target.value)} />
        </div>
        <button type="button" className="btn-quiet" disabled={pending} onClick={() => save({ approvalLimit: formOptionalDecimal(limit) })}>
          Save limit
        </button>
      </div>
      {!isSelf ? (
        <button type="button" className="btn-quiet" disabled={pending} onClick={() => save({ active: !person.active })}>
          {person.active ? "Deactivate account" : "Reactivate account"}
        </button>
      ) : null}
    </section>
  );
}
