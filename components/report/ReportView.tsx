/**
 * The whole verification report of one version, server-renderable: verdict, problems in the
 * spec, per-claim results, rest points, experiment figures and the engine's notes.
 */
import type { ReactNode } from "react";
import { ExperimentFigures } from "@/components/plots";
import type { Claim, GameSpec, Report } from "@/lib/engine/types";
import { ClaimsTable } from "./ClaimsTable";
import { ReportNotes } from "./ReportNotes";
import { RestPointsTable } from "./RestPointsTable";
import { SpecErrors } from "./SpecErrors";
import { VerdictBanner } from "./VerdictBanner";

export interface ReportViewProps {
  report: Report;
  /** The spec's game, for strategy names; without it coordinates are numbered. */
  game?: GameSpec;
  /** The spec's claims, for the author's notes beside each result. */
  specClaims?: readonly Claim[];
  /** Replaces the default figures (ExperimentFigures of the game, its runs and rest points). */
  figures?: ReactNode;
}

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="space-y-3">
      <h2 id={id} className="text-lg font-semibold tracking-tight">
        {title}
      </h2>
      {children}
    </section>
  );
}

export function ReportView({ report, game, specClaims, figures }: ReportViewProps) {
  // Runs with no samples at all are reported by the figures themselves; these stopped part-way.
  const failedRuns = report.experiments.filter((e) => e.error !== undefined && e.states.length > 0);
  const shownFigures =
    figures ??
    (game === undefined ? null : (
      <ExperimentFigures game={game} experiments={report.experiments} restPoints={report.restPoints ?? []} />
    ));
  return (
    <article className="space-y-8" data-testid="report-view" data-verdict={report.verdict}>
      <VerdictBanner verdict={report.verdict} claims={report.claims} />

      {report.errors.length > 0 && <SpecErrors errors={report.errors} />}

      {report.verdict !== "invalid" && (
        <Section id="report-claims" title="Claims">
          <ClaimsTable claims={report.claims} specClaims={specClaims} />
        </Section>
      )}

      {report.restPoints !== undefined && (
        <Section id="report-rest-points" title="Rest points of the replicator dynamics">
          <RestPointsTable restPoints={report.restPoints} game={game} />
        </Section>
      )}

      {report.experiments.length > 0 && (
        <Section id="report-experiments" title="Experiments">
          {failedRuns.length > 0 && (
            <ul className="space-y-1 text-sm text-inconclusive">
              {failedRuns.map((e) => (
                <li key={e.id}>
                  <code className="font-mono text-xs">{e.id}</code> stopped early: {e.error}
                </li>
              ))}
            </ul>
          )}
          {shownFigures}
        </Section>
      )}

      <ReportNotes notes={report.notes} />

      <footer className="border-t border-line pt-3 text-xs text-ink-faint">
        Engine {report.engine.version} · specification SHA-256{" "}
        <code className="font-mono break-all" data-testid="spec-sha">{report.specSha256}</code>
      </footer>
    </article>
  );
}
