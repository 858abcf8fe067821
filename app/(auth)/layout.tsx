import { Cautions } from "@/app/_components/cautions";
import { Logo } from "@/app/_components/logo";
import { Main } from "@/app/_components/main";

export default function SignedOutLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-ink-faint/20 bg-paper-raised px-6 py-3">
        <Logo />
      </header>
      <Main className="flex flex-1 items-start justify-center px-4 py-16">{children}</Main>
      <footer className="border-t border-ink-faint/20 px-6 py-4">
        <Cautions placement="footer" />
      </footer>
    </div>
  );
}
