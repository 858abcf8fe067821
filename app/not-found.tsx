import Link from "next/link";
import { Main } from "./_components/main";

export default function NotFound() {
  return (
    <Main className="mx-auto max-w-lg px-6 py-24 text-center">
      <h1>Not found</h1>
      <p className="mt-2 text-sm text-ink-soft">There is nothing at this address, or it is no longer here.</p>
      <p className="mt-6">
        <Link href="/">Back to your desk</Link>
      </p>
    </Main>
  );
}
