import type { Metadata } from "next";
import Link from "next/link";
import { Cautions } from "@/app/_components/cautions";
import { Logo } from "@/app/_components/logo";
import { Main } from "@/app/_components/main";
import { MemoCheckForm } from "./_components/memo-check-form";

export const metadata: Metadata = { title: "Memo check" };

/** Public: anyone holding an award memo (or its fingerprint) can check that Ratecourt issued it, unchanged. */
export default function MemoCheckPage() {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-ink-faint/20 bg-paper-raised">
        <div className="mx-auto flex max-w-3xl items-center justify-between px-6 py-2.5">
          <Logo />
          <Link href="/sign-in" className="text-sm">
            Sign in
          </Link>
        </div>
      </header>
      <Main className="mx-auto w-full max-w-3xl flex-1 space-y-4 px-6 py-6">
        <h1>Memo check</h1>
        <p className="text-sm text-ink-soft">
          Every award memo Ratecourt issues is recorded with its SHA-256 fingerprint at the moment of the award. Upload a memo file, or paste its fingerprint,
          to learn whether it is an authentic memo, for which tender, approved by whom and when. A file changed by even one byte no longer matches. The file is
          only hashed, not kept.
        </p>
        <MemoCheckForm />
      </Main>
      <footer className="border-t border-ink-faint/20 bg-paper-raised">
        <div className="mx-auto max-w-3xl px-6 py-4">
          <Cautions />
        </div>
      </footer>
    </div>
  );
}
