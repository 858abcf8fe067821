import Link from "next/link";

export function Logo() {
  return (
    <Link href="/" className="inline-flex items-center gap-2 text-ink no-underline hover:no-underline">
      <svg width="22" height="22" viewBox="0 0 22 22" aria-hidden>
        <rect x="1" y="1" width="20" height="20" rx="4" fill="#0f5e6b" />
        <path d="M5 15 L9 7 L13 13 L17 5" stroke="#fff" strokeWidth="2" fill="none" strokeLinecap="round" />
      </svg>
      <span className="text-base font-semibold tracking-tight">Ratecourt</span>
    </Link>
  );
}
