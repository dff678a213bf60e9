"use client";
/**
 * The figures of the server's stored re-run, drawn in the browser from the version's report as
 * the report API answers it (compact JSON from an in-memory cache, with an ETag; the pretty-printed
 * report.json download is built afresh on each request and is several times slower to serve).
 * Keeping the samples out of the server-rendered page makes it several times lighter (every
 * sample would otherwise be sent twice: as HTML and as the page's React payload); the claims and
 * rest points stay server-rendered text.
 */
import { useEffect, useState } from "react";
import { ExperimentFigures, type PlotGame } from "@/components/plots";
import type { Report } from "@/lib/engine/types";

type State = { kind: "loading" } | { kind: "ready"; report: Report } | { kind: "failed"; message: string };

export function RegisteredFigures({ reportUrl, game }: { reportUrl: string; game: PlotGame }) {
  const [state, setState] = useState<State>({ kind: "loading" });
  useEffect(() => {
    const controller = new AbortController();
    fetch(reportUrl, { signal: controller.signal })
      .then(async (res) => {
        if (!res.ok) throw new Error(`status ${res.status}`);
        const answer = (await res.json()) as { report: Report | null };
        if (answer.report === null) throw new Error("no stored report");
        setState({ kind: "ready", report: answer.report });
      })
      .catch((e: unknown) => {
        if (controller.signal.aborted) return;
        setState({ kind: "failed", message: `The figures could not be loaded (${e instanceof Error ? e.message : "network error"}). Reload the page to try again.` });
      });
    return () => controller.abort();
  }, [reportUrl]);

  if (state.kind === "failed") return <p className="text-sm text-danger" role="alert">{state.message}</p>;
  if (state.kind === "loading") {
    return (
      <div className="flex min-h-48 flex-col gap-2" data-testid="figures-loading">
        <p className="text-sm text-ink-soft" role="status">
          Drawing the figures of the stored re-run...
        </p>
        <noscript>
          <p className="text-sm">The figures are drawn by JavaScript. Every run&apos;s data is in the CSV downloads of this page.</p>
        </noscript>
      </div>
    );
  }
  return (
    <div data-testid="registered-figures">
      <ExperimentFigures game={game} experiments={state.report.experiments} restPoints={state.report.restPoints ?? []} />
    </div>
  );
}
