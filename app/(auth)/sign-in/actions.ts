"use server";

import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { signInSchema } from "@/lib/validation/auth";
import { fieldErrorsOf } from "@/lib/validation/messages";
import { signIn } from "@/lib/server/sign-in";
import { AppError } from "@/lib/server/errors";
import { safeReturnPath } from "@/lib/return-path";

export interface SignInState {
  message?: string;
  fieldErrors?: Record<string, string[]>;
  values?: { email: string };
}

export async function signInAction(_prev: SignInState, formData: FormData): Promise<SignInState> {
  const raw = { email: String(formData.get("email") ?? ""), password: String(formData.get("password") ?? "") };
  const parsed = signInSchema.safeParse(raw);
  if (!parsed.success) {
    return { message: "Check the highlighted fields.", fieldErrors: fieldErrorsOf(parsed.error), values: { email: raw.email } };
  }
  try {
    await signIn(parsed.data, await headers());
  } catch (error) {
    if (error instanceof AppError) return { message: error.message, values: { email: raw.email } };
    throw error;
  }
  redirect(safeReturnPath(formData.get("next")));
}
