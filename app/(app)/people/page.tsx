import type { Metadata } from "next";
import Link from "next/link";
import { listOrganisations, listPeople } from "@/lib/server/people";
import { orPage, pageViewer } from "@/lib/server/pages";
import { CreateUserForm } from "./_components/create-user-form";
import { PeopleGrid } from "./_components/people-grid";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage() {
  const viewer = await pageViewer();
  const people = await orPage(listPeople(viewer));
  const organisations = await listOrganisations(viewer);
  return (
    <div className="space-y-5">
      <h1>People</h1>
      <PeopleGrid people={people} selfId={viewer.actor.id} />
      <div className="grid gap-5 md:grid-cols-2">
        <CreateUserForm organisations={organisations.map((o) => ({ id: o.id, name: o.name, kind: o.kind }))} />
        <section className="panel" aria-label="Organisations">
          <h2>Organisations</h2>
          <ul className="mt-2 text-sm">
            {organisations.map((o) => (
              <li key={o.id} className="flex justify-between py-1">
                <Link href={`/organisations/${o.id}`}>{o.name}</Link>
                <span className="text-ink-soft">{o.kind === "buyer" ? "buying company" : "vendor"}</span>
              </li>
            ))}
          </ul>
        </section>
      </div>
    </div>
  );
}
