import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ModelForm } from "@/components/deposit/ModelForm";
import { formValuesOf } from "@/components/deposit/model-form";
import { SpecUpload } from "@/components/deposit/SpecUpload";
import { DecisionsForVersion } from "@/components/editor/DecisionsForVersion";
import { SubmitVersionButton } from "@/components/deposit/SubmitVersionButton";
import { modelKey } from "@/components/deposit/keys";
import { VersionList } from "@/components/deposit/VersionList";
import { Notice } from "@/components/ui/Notice";
import { PageHeader, Section } from "@/components/ui/PageHeader";
import { onPage, pageUser } from "@/lib/authz";
import { getModel } from "@/lib/models";
import { listSubmissionsForModel, listVenues } from "@/lib/venues";
import { submitVersionAction, updateModelAction } from "../actions";

interface Props {
  params: Promise<{ slug: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}

async function ownModel(slug: string) {
  const me = await pageUser();
  const model = await onPage(() => getModel(slug, { id: me.userId, role: me.role }));
  // The workspace page is the owner's desk; others who may read the model use its public or review page.
  if (!model.canEdit) notFound();
  return model;
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug } = await params;
  const model = await ownModel(slug);
  return { title: model.title };
}

export default async function ModelEntryPage({ params, searchParams }: Props) {
  const { slug } = await params;
  const created = (await searchParams).created === "1";
  const model = await ownModel(slug);
  const venues = await listVenues();
  const submissions = await listSubmissionsForModel(model.id);
  const latest = model.versions[0];
  const latestSubmitted = latest !== undefined && submissions.some((x) => x.versionId === latest.id);
  return (
    <div className="flex flex-col gap-10">
      <PageHeader
        overline={`Model ${model.slug}`}
        title={model.title}
        lede={
          <span>
            {model.visibility === "public" ? "Public: listed in the registry." : "Private: only you, administrators and the venue's editors see it."}{" "}
            {model.venue === null ? "Not submitted to a venue." : `Submitted to ${model.venue.name}.`}
          </span>
        }
        actions={
          model.visibility === "public" && latest !== undefined ? (
            <Link className="rp-link text-sm font-semibold" href={`/models/${model.slug}`}>
              Public page
            </Link>
          ) : undefined
        }
      />
      {created && latest === undefined && (
        <Notice tone="success" title="The model entry was created.">
          Upload its specification below to make v1; the re-run starts by itself.
        </Notice>
      )}

      <Section
        id="upload"
        title={latest === undefined ? "Upload the specification" : "Upload a new version"}
        description={
          <>
            A specification is a JSON file in the{" "}
            <a className="rp-link" href="/schemas/model-spec.v1.json">
              restpoint/model@1 format
            </a>
            . Each upload with new content becomes the next version; uploading the same content again makes none.
          </>
        }
      >
        <SpecUpload slug={model.slug} modelKey={modelKey(model.slug)} />
      </Section>

      <Section id="versions" title="Versions" description="Newest first. The verification state updates by itself while a re-run is queued or running.">
        <VersionList initial={model} />
      </Section>

      <Section
        id="submission"
        title="Submission"
        description={
          model.venue === null
            ? "Name a venue in the entry below to submit a version to its editors."
            : `The editors of ${model.venue.name} decide on the newest version you submit.`
        }
      >
        {submissions.length > 0 && (
          <ul className="flex flex-col gap-1 text-sm" data-testid="submissions">
            {submissions.map((x) => (
              <li key={x.id}>
                v{x.versionNumber} submitted to {x.venue.name} on{" "}
                {new Date(x.createdAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" })} UTC
              </li>
            ))}
          </ul>
        )}
        {model.venue !== null && latest !== undefined && !latestSubmitted && (
          <SubmitVersionButton
            label={`Submit v${latest.number} to ${model.venue.name}`}
            submit={submitVersionAction.bind(null, model.slug, latest.number)}
          />
        )}
        {model.venue !== null && latest === undefined && <p className="text-sm text-ink-soft">Upload a version first.</p>}
        {submissions.length > 0 && <DecisionsForVersion modelId={model.id} />}
      </Section>

      <Section id="entry" title="The entry" description="Title, manuscript, authors, venue and visibility. Versions are not changed by this form.">
        <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[10rem_1fr]" data-testid="entry-summary">
          <dt className="text-ink-faint">Authors</dt>
          <dd>
            {model.authors.length === 0
              ? "—"
              : model.authors.map((a, i) => (
                  <span key={i}>
                    {i > 0 && "; "}
                    {a.name}
                    {a.orcid !== null && (
                      <>
                        {" "}
                        <a className="rp-link font-mono text-xs" href={`https://orcid.org/${a.orcid}`}>
                          {a.orcid}
                        </a>
                      </>
                    )}
                  </span>
                ))}
          </dd>
          <dt className="text-ink-faint">Manuscript</dt>
          <dd>
            {[model.manuscriptTitle, model.year === null ? null : String(model.year)].filter((x) => x !== null).join(", ") || "—"}
            {model.doi !== null && (
              <>
                {" · "}
                <a className="rp-link" href={`https://doi.org/${model.doi}`}>
                  doi:{model.doi}
                </a>
              </>
            )}
          </dd>
        </dl>
        <details className="rp-card group p-0">
          <summary className="cursor-pointer list-none px-6 py-4 text-sm font-semibold text-tide">
            <span className="group-open:hidden">Edit the entry</span>
            <span className="hidden group-open:inline">Close the form</span>
          </summary>
          <div className="border-t border-line p-6">
            <ModelForm
              initial={formValuesOf(model)}
              venues={venues.map((v) => ({ id: v.id, name: v.name }))}
              action={updateModelAction.bind(null, model.slug)}
              submitLabel="Save the entry"
            />
          </div>
        </details>
      </Section>
    </div>
  );
}
