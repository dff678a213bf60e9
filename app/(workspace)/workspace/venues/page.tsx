import type { Metadata } from "next";
import Link from "next/link";
import { EmptyState } from "@/components/ui/EmptyState";
import { PageHeader } from "@/components/ui/PageHeader";
import { pageRole } from "@/lib/authz";
import { listVenues, listVenuesForEditor, summarizeVenues } from "@/lib/venues";

export const metadata: Metadata = { title: "Venues" };

export default async function VenuesPage() {
  const me = await pageRole("editor", "admin");
  // Admins oversee every venue; editors see the ones they are assigned to.
  const venues = await summarizeVenues(me.role === "admin" ? await listVenues() : await listVenuesForEditor(me.userId));
  return (
    <div className="flex flex-col gap-8">
      <PageHeader
        overline="Editorial work"
        title="Venues"
        lede={me.role === "admin" ? "Every venue on this server, with its queue. Assign editors under Administration → Venues." : "The venues you decide submissions for."}
      />
      {venues.length === 0 ? (
        <EmptyState title={me.role === "admin" ? "There is no venue yet." : "You are not an editor of any venue yet."}>
          {me.role === "admin" ? (
            <Link className="rp-link" href="/admin/venues">
              Create a venue
            </Link>
          ) : (
            "An administrator assigns editors to venues. Once you are assigned, the venue and its queue appear here."
          )}
        </EmptyState>
      ) : (
        <ul className="grid gap-4 md:grid-cols-2">
          {venues.map((v) => (
            <li key={v.id} className="rp-card flex flex-col gap-3 p-5">
              <div className="flex flex-col gap-1">
                <h2 className="text-lg font-semibold">{v.name}</h2>
                <p className="font-mono text-2xs text-ink-faint">{v.slug}</p>
                {v.description === "" ? null : <p className="text-sm text-ink-soft">{v.description}</p>}
              </div>
              <dl className="flex gap-6 text-sm">
                <div>
                  <dt className="text-2xs font-semibold uppercase tracking-[0.1em] text-ink-faint">Awaiting decision</dt>
                  <dd className="font-mono text-2xl" data-testid={`awaiting-${v.slug}`}>{v.awaitingDecision}</dd>
                </div>
                <div>
                  <dt className="text-2xs font-semibold uppercase tracking-[0.1em] text-ink-faint">Models</dt>
                  <dd className="font-mono text-2xl">{v.models}</dd>
                </div>
              </dl>
              <p className="text-xs text-ink-soft">Editors: {v.editors.length === 0 ? "none yet" : v.editors.map((e) => e.name).join(", ")}</p>
              <Link href={`/workspace/venues/${v.slug}`} className="rp-link self-start text-sm font-semibold">
                Open the queue
              </Link>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
