import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { FileList } from "@/components/deposit/FileList";
import { SupplementUpload } from "@/components/deposit/SupplementUpload";
import { VersionStatus } from "@/components/deposit/VersionStatus";
import { BadgeSnippets } from "@/components/badge/BadgeSnippets";
import { DecisionsForVersion } from "@/components/editor/DecisionsForVersion";
import { ReportView } from "@/components/report";
import { PageHeader, Section } from "@/components/ui/PageHeader";
import type { ModelSpec } from "@/lib/engine/types";
import { NotFound } from "@/lib/errors";
import { onPage, pageUser } from "@/lib/authz";
import { getModel } from "@/lib/models";
import { getReportForVersion } from "@/lib/reports";
import { getVersion } from "@/lib/versions";

interface Props {
  params: Promise<{ slug: string; number: string }>;
}

async function load(slug: string, numberText: string) {
  const me = await pageUser();
  const viewer = { id: me.userId, role: me.role };
  if (!/^[1-9]\d{0,8}$/.test(numberText)) notFound();
  return onPage(async () => {
    const model = await getModel(slug, viewer);
    // The owner's desk only; editors read versions on their review page, readers on the public one.
    if (!model.canEdit) throw new NotFound("model");
    const version = await getVersion(model.id, Number(numberText), viewer);
    const report = await getReportForVersion(version.id, viewer);
    return { model, version, report };
  });
}

/** The stored spec text was validated at upload; parse it for strategy names and claim notes. */
function specOf(text: string): ModelSpec | null {
  try {
    return JSON.parse(text) as ModelSpec;
  } catch {
    return null;
  }
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug, number } = await params;
  const { model } = await load(slug, number);
  return { title: `${model.title}, v${number}` };
}

export default async function VersionPage({ params }: Props) {
  const { slug, number } = await params;
  const { model, version, report } = await load(slug, number);
  const spec = specOf(version.specText);
  const uploaded = new Date(version.createdAt).toLocaleString("en-GB", { dateStyle: "long", timeStyle: "short", timeZone: "UTC" });
  const apiBase = `/api/v1/models/${model.slug}/versions/${version.number}`;
  return (
    <div className="flex flex-col gap-10">
      <PageHeader
        overline={`${model.title} · v${version.number}`}
        title={version.title}
        lede={<span>Uploaded {uploaded} UTC.</span>}
        actions={
          <div className="flex flex-wrap items-center gap-4 text-sm">
            <Link className="rp-link font-semibold" href={`/workspace/models/${model.slug}`}>
              All versions
            </Link>
            <a className="rp-link" href="#files">
              Files ({version.files.length})
            </a>
            {report !== null && (
              <a className="rp-link" href={`${apiBase}/report`}>
                Report as JSON
              </a>
            )}
          </div>
        }
      />

      <Section id="report" title="Verification report">
        {report === null ? (
          <VersionStatus slug={model.slug} number={version.number} initialJob={version.job} />
        ) : (
          <ReportView report={report.report} game={spec?.game} specClaims={spec?.claims} />
        )}
      </Section>

      <Section id="decisions" title="Editors' decisions" description={model.venue === null ? "The model names no venue, so no editor decides on it." : `Decisions of the editors of ${model.venue.name} on this version.`}>
        {model.venue !== null && <DecisionsForVersion modelId={model.id} versionNumber={version.number} />}
      </Section>

      <Section id="badge" title="Badge" description="An image that states what the re-run of this version found (and any decision), to put beside the paper or in a repository.">
        <BadgeSnippets slug={model.slug} number={version.number} isPublic={model.visibility === "public"} revision={report?.verdict ?? version.job?.state ?? "pending"} />
      </Section>

      <Section id="files" title="Files" description="The specification as uploaded, and supplementary files attached to this version.">
        <FileList slug={model.slug} number={version.number} initial={version.files} />
        <SupplementUpload slug={model.slug} number={version.number} />
      </Section>
    </div>
  );
}
