"use client";

import { useState, useTransition } from "react";
import type { FormResult } from "@/lib/server/form-action";
import { FormStatus } from "@/app/_components/form-status";
import { formatMoney } from "@/lib/format";
import type { ApprovalBandInput } from "@/lib/validation/approvals";
import { removeBandAction } from "../actions";
import { BandForm } from "./band-form";
import { ScrollBox } from "@/app/_components/scroll-box";

type BandRow = ApprovalBandInput & { id: string };

/** The value bands; an admin changes or removes them in place. */
export function BandsTable({ bands, editable }: { bands: BandRow[]; editable: boolean }) {
  const [editing, setEditing] = useState<string | null>(null);
  const [result, setResult] = useState<FormResult>({});
  const [pending, startTransition] = useTransition();
  const remove = (id: string) => startTransition(async () => setResult(await removeBandAction(id)));
  return (
    <div className="space-y-3">
      <ScrollBox label="Value bands">
        <table className="data-table" aria-label="Value bands">
          <thead>
            <tr>
              <th>Currency</th>
              <th className="text-right">From (inclusive)</th>
              <th className="text-right">Up to (exclusive)</th>
              <th className="text-right">Approvals needed</th>
              <th className="text-right">Least approver limit</th>
              {editable ? (
                <th>
                  <span className="sr-only">Change</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {bands.map((b) => (
              <tr key={b.id}>
                <td>{b.currency}</td>
                <td className="text-right tabular-nums">{formatMoney(b.minValue, b.currency)}</td>
                <td className="text-right tabular-nums">{b.maxValue === null ? "no upper limit" : formatMoney(b.maxValue, b.currency)}</td>
                <td className="text-right tabular-nums">{b.approvalsNeeded}</td>
                <td className="text-right tabular-nums">{formatMoney(b.minApproverLimit, b.currency)}</td>
                {editable ? (
                  <td className="whitespace-nowrap text-right">
                    <button
                      type="button"
                      className="btn-quiet"
                      onClick={() => setEditing(editing === b.id ? null : b.id)}
                      aria-label={`Change the band from ${b.minValue}`}
                    >
                      Change
                    </button>{" "}
                    <button
                      type="button"
                      className="btn-quiet"
                      disabled={pending}
                      onClick={() => remove(b.id)}
                      aria-label={`Remove the band from ${b.minValue}`}
                    >
                      Remove
                    </button>
                  </td>
                ) : null}
              </tr>
            ))}
            {bands.length === 0 ? (
              <tr>
                <td colSpan={6} className="text-ink-soft">
                  No band yet: no recommendation can be approved.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </ScrollBox>
      <FormStatus result={result} />
      {editable && editing ? (
        <section className="panel" aria-label="Change band">
          <h2>Change band</h2>
          <BandForm key={editing} band={bands.find((b) => b.id === editing)!} onDone={() => setEditing(null)} />
        </section>
      ) : null}
    </div>
  );
}
