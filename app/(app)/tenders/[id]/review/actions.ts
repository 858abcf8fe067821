"use server";

import { declarationSchema, signoffSchema } from "@/lib/validation/review";
import { createDeclaration } from "@/lib/server/declarations";
import { signTechnical } from "@/lib/server/signoff";
import { runForm, type FormResult } from "@/lib/server/form-action";

const paths = (tenderId: string) => [`/tenders/${tenderId}/review`, `/tenders/${tenderId}`, "/review", "/desk"];

export async function declareAction(tenderId: string, values: unknown): Promise<FormResult> {
  return runForm(declarationSchema, values, (viewer, input) => createDeclaration(viewer, String(tenderId), input), paths(tenderId), "Declaration recorded.", {
    tenderId,
  });
}

export async function signoffAction(tenderId: string, values: unknown): Promise<FormResult> {
  return runForm(
    signoffSchema,
    values,
    (viewer, input) => signTechnical(viewer, String(tenderId), input),
    paths(tenderId),
    "Technical evaluation signed. The tender is now in commercial evaluation.",
    { tenderId },
  );
}
