"use server";

import { createOrganisation, createUser, updateUser } from "@/lib/server/people";
import { runForm, type FormResult } from "@/lib/server/form-action";
import { createOrganisationSchema, createUserSchema, updateUserSchema } from "@/lib/validation/people";

export type { FormResult };

export async function createUserAction(values: unknown): Promise<FormResult> {
  return runForm(createUserSchema, values, (viewer, input) => createUser(viewer, input), ["/people"], "Account created.");
}

export async function updateUserAction(userId: string, values: unknown): Promise<FormResult> {
  return runForm(updateUserSchema, values, (viewer, input) => updateUser(viewer, String(userId), input), ["/people"], "Saved.", { userId });
}

export async function createOrganisationAction(values: unknown): Promise<FormResult> {
  return runForm(createOrganisationSchema, values, (viewer, input) => createOrganisation(viewer, input), ["/people"], "Organisation added.");
}
