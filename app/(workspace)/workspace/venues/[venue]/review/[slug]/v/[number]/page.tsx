import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { BadgeSnippets } from "@/components/badge/BadgeSnippets";
import { AuditTrail } from "@/components/editor/AuditTrail";
import { DecisionForm } from "@/components/editor/DecisionForm";
import { FindingsList } from "@/components/editor/FindingsList";
import { RefreshWhile } from "@/components/editor/RefreshWhile";
import { unclaimedFindings } from "@/components/editor/findings";
import { OUTCOME_WORDS, formatWhen } from "@/components/editor/labels";
import { StatusPill } from "@/components/editor/StatusPill";
import { ReportView } from "@/components/report";
import { buttonClass } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { PageHeader, Section } from "@/components/ui/PageHeader";
import { onPage, pageRole } from "@/lib/authz";
import { auditTrailForModel, listDecisionsForModel } from "@/lib/decisions";
import type { ModelSpec } from "@/lib/engine/types";
import type { QueueStatus } from "@/lib/queue";
import { readReport } from "@/lib/reports";
import { getVersion, listVersions } from "@/lib/versions";
import { isEditorOf, latestSubmittedVersion, listSubmissionsForModel, loadModelForReview, requireVenueAccess } from "@/lib/venues";
import { decideAction } from "./actions";

interface Props {
  params: Promise<{ venue: string; slug: string; number: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug, number } = await params;
  return { title: `Review ${slug} v${number}` };
}

function parseSpec(text: string): ModelSpec | null {
  try {
    return JSON.parse(text) as ModelSpec;
  } catch {
    return null;
  }
}

function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${(n / (1024 * 1024)).toFixed(1)} MB`;
  if (n >= 1024) return `${(n / 1024).toFixed(1)} kB`;
  return `${n} bytes`;
}

export default async function ReviewPage({ params, searchParams }: Props) {
  const me = await pageRole("editor", "admin");
  const { venue, slug, number } = await params;
  if (!/^[1-9]\d{0,8}$/.test(number)) notFound();
  const n = Number(number);
  const actor = { id: me.userId, role: me.role };
  const v = await onPage(() => requireVenueAccess(actor, venue));
  const m = await onPage(() => loadModelForReview(actor, slug));
  // The review lives under the venue the model is submitted to; any other venue's address is 404.
  if (m.venueId !== v.id) notFound();
  const viewer = { id: me.userId, role: me.role };
  const ver = await onPage(() => getVersion(m.id, n, viewer));
  const [reportView, versions, submissions, decisions, audit, latest, editsVenue] = await Promise.all([
    readReport(ver.id),
    listVersions(m.id, viewer),
    listSubmissionsForModel(m.id),
    listDecisionsForModel(m.id),
    auditTrailForModel(m.id),
    latestSubmittedVersion(v.id, m.id),
    isEditorOf(me.userId, v.id),
  ]);
  const spec = parseSpec(ver.specText);
  const report = reportView?.report ?? null;
  const decision = decisions.find((d) => d.versionNumber === n && d.venue.id === v.id) ?? null;
  const submitted = submissions.some((s) => s.versionNumber === n && s.venue.id === v.id);
  const isOwner = m.ownerId === me.userId;
  const isLatest = latest?.number === n;
  const status: QueueStatus | null = !submitted
    ? null
    : decision !== null
      ? decision.outcome
      : report !== null
        ? "awaiting-decision"
        : ver.job?.state === "failed"
          ? "check-failed"
          : "awaiting-check";
  const verifiedBlockedReason =
    report === null
      ? "Available once the engine has re-run this version's claims."
      : report.verdict === "contradicted" || report.verdict === "invalid"
        ? `Not available: the re-run verdict is ${report.verdict}.`
        : null;
  const previous = versions.find((x) => x.number < n);
  const justDecided = (await searchParams).decided === "1";
  const findings = report === null ? [] : unclaimedFindings(spec, report);
  const supplements = ver.files.filter((f) => f.purpose === "supplement");
  const specFile = ver.files.find((f) => f.purpose === "spec");

  return (
    <div className="flex flex-col gap-8">
      <RefreshWhile active={report === null && ver.job?.state !== "failed"} />
      <Link href={`/workspace/venues/${v.slug}`} className="rp-link -mb-4 self-start text-sm">
        ← Queue of {v.name}
      </Link>
      <PageHeader
        overline={`Review · ${m.slug} · version ${n}`}
        title={m.title}
        lede={
          <span>
            Version {n} of {versions.length}
            {submitted ? "" : " (not submitted to this venue)"} · uploaded {formatWhen(ver.createdAt)} ·{" "}
            <span className="font-mono text-xs">sha-256 {ver.specSha256.slice(0, 12)}…</span>
          </span>
        }
        actions={
          <div className="flex flex-wrap items-center gap-2">
            {status === null ? null : <StatusPill status={status} />}
            {previous === undefined ? null : (
              <Link className={buttonClass("secondary", "px-3 py-1.5")} href={`/workspace/models/${m.slug}/compare?from=${previous.number}&to=${n}`}>
                Compare v{previous.number} → v{n}
              </Link>
            )}
          </div>
        }
      />

      {justDecided && decision !== null ? (
        <Notice tone="success" title={`Recorded: ${OUTCOME_WORDS[decision.outcome]}.`}>
          The authors were sent the decision by mail. It is final and in the audit trail below.
        </Notice>
      ) : null}

      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="flex min-w-0 flex-col gap-8">
          <Section
            id="review-findings"
            title="What no claim mentions"
            description="The engine's own findings at the spec's parameters that none of the authors' claims speaks about."
          >
            {report === null ? <p className="text-sm text-ink-soft">Shown once the re-run has finished.</p> : <FindingsList findings={findings} game={spec?.game} />}
          </Section>
        </div>
        <div className="flex flex-col gap-6">
          <section aria-labelledby="decision-title" className="rp-card flex flex-col gap-3 p-5">
            <h2 id="decision-title" className="text-lg font-semibold">
              Decision
            </h2>
            {decision !== null ? (
              <div className="flex flex-col items-start gap-2 text-sm" data-testid="recorded-decision" data-outcome={decision.outcome}>
                <StatusPill status={decision.outcome} />
                <p className="whitespace-pre-wrap">{decision.comment}</p>
                <p className="text-xs text-ink-faint">
                  {decision.editor.name} · {formatWhen(decision.createdAt)}
                </p>
              </div>
            ) : !submitted ? (
              <p className="text-sm text-ink-soft">This version was not submitted to {v.name}; there is nothing to decide.</p>
            ) : !isLatest && latest !== null ? (
              <p className="text-sm text-ink-soft">
                A newer version is submitted. Decide on{" "}
                <Link className="rp-link" href={`/workspace/venues/${v.slug}/review/${m.slug}/v/${latest.number}`}>
                  version {latest.number}
                </Link>
                .
              </p>
            ) : isOwner ? (
              <p className="text-sm text-ink-soft">This is your own model: another editor of the venue has to decide on it.</p>
            ) : !editsVenue ? (
              <p className="text-sm text-ink-soft">
                Only the venue&apos;s editors decide. An administrator can assign editors under{" "}
                <Link className="rp-link" href="/admin/venues">
                  Administration → Venues
                </Link>
                .
              </p>
            ) : (
              <DecisionForm action={decideAction.bind(null, { venue: v.slug, slug: m.slug, number: n })} versionNumber={n} verifiedBlockedReason={verifiedBlockedReason} />
            )}
          </section>
        </div>
      </div>

      <Section id="review-report" title="Re-run report">
        {report === null ? (
          <Notice title={ver.job?.state === "failed" ? "The re-run failed." : "The re-run has not finished yet."}>
            {ver.job?.state === "failed" ? (ver.job.lastError ?? "The author sees the error and can upload a corrected version.") : "This page updates by itself when the report is in."}
          </Notice>
        ) : (
          <ReportView report={report} game={spec?.game} specClaims={spec?.claims} />
        )}
      </Section>

      <div className="grid items-start gap-6 md:grid-cols-2">
        <div className="flex flex-col gap-6">
        <section aria-labelledby="files-title" className="rp-card flex flex-col gap-3 p-5">
          <h2 id="files-title" className="text-lg font-semibold">
            The authors&apos; files
          </h2>
          <ul className="flex flex-col gap-2 text-sm">
            {specFile === undefined ? null : (
              <li>
                <a className="rp-link" href={`/api/v1/files/${specFile.id}`}>
                  {specFile.originalName}
                </a>{" "}
                <span className="text-xs text-ink-faint">spec · {formatBytes(specFile.size)}</span>
              </li>
            )}
            {supplements.map((f) => (
              <li key={f.id}>
                <a className="rp-link" href={`/api/v1/files/${f.id}`}>
                  {f.originalName}
                </a>{" "}
                <span className="text-xs text-ink-faint">
                  {f.mediaType} · {formatBytes(f.size)}
                </span>
              </li>
            ))}
            {specFile === undefined && supplements.length === 0 ? <li className="text-ink-soft">No files were uploaded with this version.</li> : null}
          </ul>
        </section>
        <section aria-labelledby="versions-title" className="rp-card flex flex-col gap-3 p-5">
          <h2 id="versions-title" className="text-lg font-semibold">
            Versions
          </h2>
          <ul className="flex flex-col gap-1.5 text-sm">
            {versions.map((x) => {
              const d = decisions.find((y) => y.versionNumber === x.number && y.venue.id === v.id);
              const sent = submissions.some((s) => s.versionNumber === x.number && s.venue.id === v.id);
              return (
                <li key={x.id} className="flex items-center justify-between gap-2">
                  {x.number === n ? (
                    <span className="font-semibold" aria-current="page">
                      v{x.number} (this one)
                    </span>
                  ) : (
                    <Link className="rp-link" href={`/workspace/venues/${v.slug}/review/${m.slug}/v/${x.number}`}>
                      v{x.number}
                    </Link>
                  )}
                  <span className="text-xs text-ink-soft">{d !== undefined ? OUTCOME_WORDS[d.outcome] : sent ? "submitted" : "not submitted"}</span>
                </li>
              );
            })}
          </ul>
        </section>
        </div>
        <BadgeSnippets slug={m.slug} number={n} isPublic={m.visibility === "public"} revision={decision?.id ?? report?.verdict ?? "pending"} />
      </div>

      <Section id="review-audit" title="Audit trail" description="Every step on this model, oldest first. Nobody can edit or delete these entries.">
        <AuditTrail events={audit} />
      </Section>
    </div>
  );
}
