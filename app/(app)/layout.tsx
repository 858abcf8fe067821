import { CompactMenu } from "@/app/_components/compact-menu";
import { Logo } from "@/app/_components/logo";
import { Main } from "@/app/_components/main";
import { MainNav } from "@/app/_components/main-nav";
import { navFor } from "@/lib/nav";
import { mailroomEnabled } from "@/lib/server/services";
import { pageViewer } from "@/lib/server/pages";
import { signOutAction } from "./actions";

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const viewer = await pageViewer();
  const items = navFor(viewer.ability, viewer.actor.roles, { mailroom: mailroomEnabled() });
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-ink-faint/20 bg-paper-raised">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2.5 sm:px-6 md:flex-nowrap">
          <Logo />
          <CompactMenu>
            <MainNav items={items} />
            <div className="text-xs leading-tight md:text-right" data-testid="who">
              <div className="font-medium text-ink">{viewer.name}</div>
              <div className="text-ink-soft">
                {viewer.organisationName} · {viewer.actor.roles.join(", ")}
              </div>
            </div>
            <form action={signOutAction}>
              <button type="submit" className="btn-quiet">
                Sign out
              </button>
            </form>
          </CompactMenu>
        </div>
      </header>
      <Main className="mx-auto w-full min-w-0 max-w-7xl flex-1 px-4 py-6 sm:px-6">{children}</Main>
    </div>
  );
}
