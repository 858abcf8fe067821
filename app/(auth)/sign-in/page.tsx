import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { safeReturnPath } from "@/lib/return-path";
import { getViewer } from "@/lib/server/session";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const { next } = await searchParams;
  if (await getViewer()) redirect(safeReturnPath(next));
  return (
    <div className="panel w-full max-w-sm space-y-4 p-6">
      <div>
        <h1>Sign in</h1>
        <p className="mt-1 text-sm text-ink-soft">Tenders for radio modules, every coding claim checked.</p>
      </div>
      <SignInForm next={safeReturnPath(next)} />
    </div>
  );
}
