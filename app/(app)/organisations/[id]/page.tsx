import type { Metadata } from "next";
import { getOrganisation } from "@/lib/server/people";
import { orPage, pageViewer } from "@/lib/server/pages";

export const metadata: Metadata = { title: "Organisation" };

export default async function OrganisationPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await pageViewer();
  const org = await orPage(getOrganisation(viewer, id));
  return (
    <div className="space-y-4">
      <h1>{org.name}</h1>
      <p className="text-sm text-ink-soft">
        {org.kind === "buyer" ? "Buying company" : "Vendor organisation"}
        {org.country ? ` · ${org.country}` : ""}
      </p>
      {org.members.length > 0 ? (
        <section className="panel">
          <h2>Members</h2>
          <ul className="mt-2 text-sm">
            {org.members.map((m) => (
              <li key={m.id}>
                {m.name} · {m.email}
                {m.active ? "" : " (deactivated)"}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
