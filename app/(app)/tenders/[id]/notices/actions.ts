"use server";

import { z } from "zod";
import { acknowledgeAddendum, publishAddendum } from "@/lib/server/addenda";
import { answerObjection, lodgeObjection } from "@/lib/server/objections";
import { runForm, type FormResult } from "@/lib/server/form-action";
import { addendumSchema, objectionAnswerSchema, objectionSchema } from "@/lib/validation/notices";

const page = (tenderId: string) => `/tenders/${String(tenderId)}/notices`;

export async function publishAddendumAction(tenderId: string, values: unknown): Promise<FormResult> {
  return runForm(
    addendumSchema,
    values,
    (viewer, input) => publishAddendum(viewer, String(tenderId), input),
    [page(tenderId)],
    "Addendum published to every invited vendor.",
    { tenderId },
  );
}

export async function acknowledgeAddendumAction(tenderId: string, addendumId: string): Promise<FormResult> {
  return runForm(z.object({}), {}, (viewer) => acknowledgeAddendum(viewer, String(addendumId)), [page(tenderId)], "Acknowledged for your organisation.", {
    tenderId,
    addendumId,
  });
}

export async function lodgeObjectionAction(tenderId: string, values: unknown): Promise<FormResult> {
  return runForm(
    objectionSchema,
    values,
    (viewer, input) => lodgeObjection(viewer, String(tenderId), input),
    [page(tenderId)],
    "Objection lodged; the purchasing team has been told.",
    { tenderId },
  );
}

export async function answerObjectionAction(tenderId: string, objectionId: string, values: unknown): Promise<FormResult> {
  return runForm(
    objectionAnswerSchema,
    values,
    (viewer, input) => answerObjection(viewer, String(objectionId), input),
    [page(tenderId)],
    "Answer sent to the vendor.",
    { tenderId, objectionId },
  );
}
