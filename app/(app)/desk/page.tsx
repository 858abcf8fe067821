import type { Metadata } from "next";
import Link from "next/link";
import { DateTime } from "@/app/_components/date-time";
import { StateTag } from "@/app/_components/state-tag";
import { getDesk } from "@/lib/server/desk";
import { pageViewer } from "@/lib/server/pages";

export const metadata: Metadata = { title: "Desk" };

export default async function DeskPage() {
  const viewer = await pageViewer();
  const sections = await getDesk(viewer);
  return (
    <div className="space-y-6">
      <div>
        <h1>Desk</h1>
        <p className="text-sm text-ink-soft">What waits for you, {viewer.name.split(" ")[0]}.</p>
      </div>
      {sections.length === 0 ? <p className="text-sm text-ink-soft">Nothing waits for you.</p> : null}
      {sections.map((section) => (
        <section key={section.title} className="panel" aria-label={section.title}>
          <h2>{section.title}</h2>
          {section.tenders.length === 0 ? (
            <p className="mt-2 text-sm text-ink-soft">{section.empty}</p>
          ) : (
            <ul className="mt-2 divide-y divide-ink-faint/15">
              {section.tenders.map((t) => (
                <li key={t.id} className="py-2 text-sm">
                  <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
                    <span className="w-28 font-mono text-xs text-ink-soft">{t.reference}</span>
                    <Link href={`/tenders/${t.id}${section.tab ? `/${section.tab}` : ""}`} className="flex-1">
                      {t.title}
                    </Link>
                    <StateTag state={t.state} />
                    <span className="text-xs text-ink-soft">
                      closes <DateTime value={t.closesAt} zone={t.closesZone} />
                    </span>
                  </div>
                  {section.notes?.[t.id] ? <p className="mt-1 pl-[7.75rem] text-xs text-verdict-evidence">{section.notes[t.id]}</p> : null}
                </li>
              ))}
            </ul>
          )}
          {section.more ? (
            <p className="mt-2 text-sm">
              <Link href={section.more.href}>{section.more.count.toLocaleString("en-GB")} more in the Tenders list</Link>
            </p>
          ) : null}
        </section>
      ))}
    </div>
  );
}
