import type { Metadata } from "next";
import { FormStatus } from "@/app/_components/form-status";
import Link from "next/link";
import { FilterForm, FilterSelect, FilterText } from "@/app/_components/list-filters";
import { Pager, pageHref } from "@/app/_components/pager";
import { listOrganisations, listPeople } from "@/lib/server/people";
import { orPage, pageQuery, pageViewer } from "@/lib/server/pages";
import { peopleQuerySchema } from "@/lib/validation/people";
import { ROLES } from "@/policies/vocabulary";
import { CreateUserForm } from "./_components/create-user-form";
import { PeopleGrid } from "./_components/people-grid";

export const metadata: Metadata = { title: "People" };

type Search = Promise<Record<string, string | string[] | undefined>>;

/** One page of people; the filters and page live in the address. */
export default async function PeoplePage({ searchParams }: { searchParams: Search }) {
  const viewer = await pageViewer();
  const { query, problem } = pageQuery(await searchParams, peopleQuerySchema);
  const people = await orPage(listPeople(viewer, query));
  const organisations = await listOrganisations(viewer);
  const { page: _page, size, ...filters } = query;
  const keep = { ...filters, size: size === peopleQuerySchema.parse({}).size ? undefined : size };
  const filtered = Object.values(filters).some(Boolean);
  return (
    <div className="space-y-5">
      <h1>People</h1>
      <FilterForm action="/people" label="Find people" filtered={filtered}>
        <FilterText id="people-q" name="q" label="Name or e-mail contains" value={query.q} />
        <FilterSelect
          id="people-org"
          name="organisationId"
          label="Organisation"
          value={query.organisationId}
          any="Any organisation"
          options={organisations.map((o) => [o.id, o.name])}
        />
        <FilterSelect id="people-role" name="role" label="Role" value={query.role} any="Any role" options={ROLES.map((r) => [r, r])} />
        <FilterSelect
          id="people-status"
          name="status"
          label="Status"
          value={query.status}
          any="Any status"
          options={[
            ["active", "active"],
            ["deactivated", "deactivated"],
          ]}
        />
      </FilterForm>
      <FormStatus result={{ ok: false, message: problem ?? undefined }} />
      <PeopleGrid people={people.users} selfId={viewer.actor.id} />
      <Pager info={people} noun={["person", "people"]} href={(page) => pageHref("/people", keep, page)} />
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
