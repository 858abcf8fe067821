import Link from "next/link";
import { Main } from "./_components/main";

export default function Forbidden() {
  return (
    <Main className="mx-auto max-w-lg px-6 py-24 text-center">
      <h1>Forbidden</h1>
      <p className="mt-2 text-sm text-ink-soft">Your roles do not give you access to this page or record.</p>
      <p className="mt-6">
        <Link href="/">Back to your desk</Link>
      </p>
    </Main>
  );
}
