"use server";

import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { signOut } from "@/lib/server/sign-in";

export async function signOutAction() {
  await signOut(await headers());
  redirect("/sign-in");
}
