import type { Metadata } from "next";
import Link from "next/link";
import { AssignEditorForm, CreateVenueForm, RemoveEditorButton } from "@/components/editor/VenueForms";
import { EmptyState } from "@/components/ui/EmptyState";
import { PageHeader, Section } from "@/components/ui/PageHeader";
import { pageRole } from "@/lib/authz";
import { listVenues, summarizeVenues } from "@/lib/venues";
import { assignEditorAction, createVenueAction, removeEditorAction } from "./actions";

export const metadata: Metadata = { title: "Venues · Administration" };

export default async function AdminVenuesPage() {
  await pageRole("admin");
  const venues = await summarizeVenues(await listVenues());
  return (
    <div className="flex flex-col gap-10">
      <PageHeader overline="Administration" title="Venues" lede="Journals and collections whose editors decide on the models submitted to them. Editors need the editor (or admin) role first." />
      <Section id="new-venue" title="New venue">
        <div className="rp-card p-5">
          <CreateVenueForm action={createVenueAction} />
        </div>
      </Section>
      <Section id="all-venues" title={`All venues (${venues.length})`}>
        {venues.length === 0 ? (
          <EmptyState title="There is no venue yet.">Create the first one above.</EmptyState>
        ) : (
          <ul className="flex flex-col gap-4">
            {venues.map((v) => (
              <li key={v.id} className="rp-card flex flex-col gap-4 p-5" data-testid={`venue-${v.slug}`}>
                <div className="flex flex-col gap-1">
                  <h3 className="text-lg font-semibold">{v.name}</h3>
                  <p className="font-mono text-2xs text-ink-faint">{v.slug}</p>
                  {v.description === "" ? null : <p className="mt-1 max-w-2xl text-sm text-ink-soft">{v.description}</p>}
                  <p className="mt-1 text-sm">
                    <span className="font-mono">{v.awaitingDecision}</span> awaiting a decision · <span className="font-mono">{v.models}</span> model{v.models === 1 ? "" : "s"} ·{" "}
                    <Link className="rp-link" href={`/workspace/venues/${v.slug}`}>
                      Open the queue
                    </Link>
                  </p>
                </div>
                <div className="flex flex-col gap-2">
                  <h4 className="text-sm font-semibold">Editors</h4>
                  {v.editors.length === 0 ? (
                    <p className="text-sm text-ink-soft">No editor yet: nobody can decide on submissions here.</p>
                  ) : (
                    <ul className="flex flex-col gap-1 text-sm">
                      {v.editors.map((e) => (
                        <li key={e.id} className="flex items-center gap-2">
                          <span>{e.name}</span>
                          <span className="text-xs text-ink-faint">{e.email}</span>
                          <RemoveEditorButton action={removeEditorAction.bind(null, v.slug, e.id)} name={e.name} />
                        </li>
                      ))}
                    </ul>
                  )}
                  <AssignEditorForm action={assignEditorAction.bind(null, v.slug)} venueName={v.name} />
                </div>
              </li>
            ))}
          </ul>
        )}
      </Section>
    </div>
  );
}
