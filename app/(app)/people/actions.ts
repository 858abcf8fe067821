"use server";

import { revalidatePath } from "next/cache";
import { createUserSchema, updateUserSchema, createOrganisationSchema } from "@/lib/validation/people";
import { fieldErrorsOf } from "@/lib/validation/messages";
import { createOrganisation, createUser, updateUser } from "@/lib/server/people";
import { requireViewer } from "@/lib/server/session";
import { AppError } from "@/lib/server/errors";

export interface FormResult {
  ok?: boolean;
  message?: string;
  fieldErrors?: Record<string, string[]>;
}

async function run(work: () => Promise<unknown>, okMessage: string): Promise<FormResult> {
  try {
    await work();
  } catch (error) {
    if (error instanceof AppError) return { message: error.message, fieldErrors: error.fieldErrors };
    throw error;
  }
  revalidatePath("/people");
  return { ok: true, message: okMessage };
}

export async function createUserAction(values: unknown): Promise<FormResult> {
  const parsed = createUserSchema.safeParse(values);
  if (!parsed.success) return { message: "Check the highlighted fields.", fieldErrors: fieldErrorsOf(parsed.error) };
  return run(async () => createUser(await requireViewer(), parsed.data), `Account created for ${parsed.data.email}.`);
}

export async function updateUserAction(userId: string, values: unknown): Promise<FormResult> {
  const parsed = updateUserSchema.safeParse(values);
  if (!parsed.success) return { message: "Check the highlighted fields.", fieldErrors: fieldErrorsOf(parsed.error) };
  return run(async () => updateUser(await requireViewer(), String(userId), parsed.data), "Saved.");
}

export async function createOrganisationAction(values: unknown): Promise<FormResult> {
  const parsed = createOrganisationSchema.safeParse(values);
  if (!parsed.success) return { message: "Check the highlighted fields.", fieldErrors: fieldErrorsOf(parsed.error) };
  return run(async () => createOrganisation(await requireViewer(), parsed.data), `${parsed.data.name} added.`);
}
