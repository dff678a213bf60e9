import type { Metadata } from "next";
import Link from "next/link";
import { SpecDiffView } from "@/components/editor/SpecDiffView";
import { VerdictDiffView } from "@/components/editor/VerdictDiffView";
import { buttonClass } from "@/components/ui/Button";
import { EmptyState } from "@/components/ui/EmptyState";
import { Notice } from "@/components/ui/Notice";
import { PageHeader, Section } from "@/components/ui/PageHeader";
import { onPage, pageUser } from "@/lib/authz";
import { compareVersions } from "@/lib/decisions";
import { getVenueById, isEditorOf, latestSubmittedVersion, loadModelForReview } from "@/lib/venues";
import { listVersions } from "@/lib/versions";

interface Props {
  params: Promise<{ slug: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug } = await params;
  return { title: `Compare versions · ${slug}` };
}

function numberParam(v: string | string[] | undefined): number | null {
  return typeof v === "string" && /^[1-9]\d{0,8}$/.test(v) ? Number(v) : null;
}

export default async function ComparePage({ params, searchParams }: Props) {
  const me = await pageUser();
  const { slug } = await params;
  const sp = await searchParams;
  const actor = { id: me.userId, role: me.role };
  const m = await onPage(() => loadModelForReview(actor, slug));
  const versions = await listVersions(m.id, actor); // newest first
  const newest = versions[0]?.number ?? 1;
  const to = numberParam(sp.to) ?? newest;
  const from = numberParam(sp.from) ?? Math.max(1, to - 1);
  const venue = m.venueId === null ? null : await getVenueById(m.venueId);
  const editsVenue = venue !== null && (await isEditorOf(me.userId, venue.id));
  // A reviewer goes back to the review of the newest submitted version (the only one a review
  // page exists for); with nothing submitted yet, to the model entry.
  const submitted = venue !== null && m.ownerId !== me.userId && (editsVenue || me.role === "admin") ? await latestSubmittedVersion(venue.id, m.id) : null;
  const back =
    venue !== null && submitted !== null
      ? { href: `/workspace/venues/${venue.slug}/review/${m.slug}/v/${submitted.number}`, label: `← Review of version ${submitted.number}` }
      : { href: `/workspace/models/${m.slug}`, label: "← Model entry" };
  const known = new Set(versions.map((v) => v.number));
  const problem =
    versions.length < 2
      ? null
      : from === to
        ? "Choose two different versions to compare."
        : !known.has(from) || !known.has(to)
          ? `This model has versions 1 to ${newest}.`
          : null;
  const cmp = versions.length >= 2 && problem === null ? await compareVersions(m.id, from, to) : null;

  return (
    <div className="flex flex-col gap-8">
      <Link href={back.href} className="rp-link -mb-4 self-start text-sm">
        {back.label}
      </Link>
      <PageHeader overline={`Compare · ${m.slug}`} title={m.title} lede="The specification as canonical JSON (keys sorted, the same layout for every upload), line by line, and what the re-runs found for each claim." />

      {versions.length < 2 ? (
        <EmptyState title="This model has one version so far.">A comparison needs two versions; it appears once the authors upload another.</EmptyState>
      ) : (
        <form method="get" className="flex flex-wrap items-end gap-3" aria-label="Versions to compare">
          <div className="flex flex-col gap-1">
            <label htmlFor="cmp-from" className="text-sm font-semibold">From</label>
            <select id="cmp-from" name="from" defaultValue={String(from)} className="rp-input w-auto">
              {versions.map((v) => (
                <option key={v.id} value={v.number}>
                  version {v.number}
                </option>
              ))}
            </select>
          </div>
          <div className="flex flex-col gap-1">
            <label htmlFor="cmp-to" className="text-sm font-semibold">To</label>
            <select id="cmp-to" name="to" defaultValue={String(to)} className="rp-input w-auto">
              {versions.map((v) => (
                <option key={v.id} value={v.number}>
                  version {v.number}
                </option>
              ))}
            </select>
          </div>
          <button type="submit" className={buttonClass("secondary")}>
            Compare
          </button>
        </form>
      )}

      {problem === null ? null : <Notice tone="error" title={problem} />}

      {cmp === null ? null : (
        <>
          <Section id="cmp-verdicts" title={`Claims: version ${cmp.from.number} → version ${cmp.to.number}`}>
            <VerdictDiffView diff={cmp.verdicts} fromLabel={`v${cmp.from.number}`} toLabel={`v${cmp.to.number}`} />
          </Section>
          <Section
            id="cmp-spec"
            title="Specification"
            description={
              cmp.spec.identical
                ? "The two specifications are the same once canonicalised."
                : `${cmp.spec.removed} line${cmp.spec.removed === 1 ? "" : "s"} removed, ${cmp.spec.added} added. Unchanged stretches are folded.`
            }
          >
            <SpecDiffView rows={cmp.spec.rows} fromLabel={`v${cmp.from.number}`} toLabel={`v${cmp.to.number}`} />
          </Section>
        </>
      )}
    </div>
  );
}
