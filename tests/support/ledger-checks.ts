// Drives the admin's full ledger check through its route handlers, as the Ledger check page does.
import { expect } from "vitest";
import { POST as startPost } from "@/app/api/v1/ledger/checks/route";
import { POST as stepPost } from "@/app/api/v1/ledger/checks/[id]/route";
import { params, request } from "./app";

export const startCheck = (headers?: Headers) => startPost(request("/api/v1/ledger/checks", { method: "POST", headers }), undefined);

export const stepCheck = (headers: Headers, id: string, entries?: string) =>
  stepPost(request(`/api/v1/ledger/checks/${id}${entries ? `?entries=${entries}` : ""}`, { method: "POST", headers }), params({ id }));

/** Starts a full check and steps it to the end; `onStep` sees each answer. */
export async function runFullCheck(admin: Headers, entries?: number, onStep: (check: { checked: number }) => void = () => {}) {
  const started = await startCheck(admin);
  expect(started.status).toBe(201);
  let check = await started.json();
  while (check.status === "running") {
    const response = await stepCheck(admin, check.id, entries ? String(entries) : undefined);
    expect(response.status).toBe(200);
    check = await response.json();
    onStep(check);
  }
  return check;
}
