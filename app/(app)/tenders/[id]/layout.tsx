import { DateTime } from "@/app/_components/date-time";
import { StateTag } from "@/app/_components/state-tag";
import { pageViewer, pageTender } from "@/lib/server/pages";
import { tenderTabs } from "./_components/tabs";
import { TenderTabs } from "./_components/tender-tabs";

/** The frame of every tender page: who, what, its state and closing time, and the tabs. */
export default async function TenderLayout({ children, params }: { children: React.ReactNode; params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await pageViewer();
  const tender = await pageTender(id);
  return (
    <div className="space-y-4">
      <header className="space-y-1">
        <div className="flex flex-wrap items-baseline gap-3">
          <span className="font-mono text-sm text-ink-soft">{tender.reference}</span>
          <h1 className="flex-1">{tender.title}</h1>
          <StateTag state={tender.state} />
        </div>
        <p className="text-xs text-ink-soft">
          Closing time <DateTime value={tender.closesAt} zone={tender.closesZone} />
        </p>
      </header>
      <TenderTabs tabs={tenderTabs(viewer, tender)} />
      <div>{children}</div>
    </div>
  );
}
