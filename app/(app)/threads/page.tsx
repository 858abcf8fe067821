import type { Metadata } from "next";
import { orPage, pageViewer } from "@/lib/server/pages";
import { listThreads } from "@/lib/server/threads";
import { ThreadList } from "./_components/thread-list";

export const metadata: Metadata = { title: "Questions" };

/** Every clarification thread this person may read: a vendor's own organisation's, an engineer's declared tenders'. */
export default async function ThreadsPage() {
  const viewer = await pageViewer();
  const threads = await orPage(listThreads(viewer, {}));
  return (
    <div className="space-y-4">
      <div>
        <h1>Questions from the evaluators</h1>
        <p className="text-sm text-ink-soft">
          Clarification threads between the buyer&apos;s engineers and the vendor. Each message is recorded in the tender&apos;s ledger.
        </p>
      </div>
      <ThreadList threads={threads} path="/threads" empty="No question has been asked." />
    </div>
  );
}
