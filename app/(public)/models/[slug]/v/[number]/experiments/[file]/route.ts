/**
 * One run of the server's re-run as CSV: a header row (time and one column per strategy, or
 * "population: strategy" for two populations), then every sample. The path segment is
 * "<run id>.csv".
 */
import { trajectoryCsv } from "@/lib/plots/csv";
import { experimentRows, stateColumns } from "@/lib/plots/data";
import { plotGameOf } from "@/components/public/plot-game";
import { downloadRoute, fileStem, NotFound } from "../../download";

export const dynamic = "force-dynamic";

export const GET = downloadRoute((p, _req, params) => {
  const file = params.file ?? "";
  const id = file.endsWith(".csv") ? file.slice(0, -4) : null;
  const run = id === null ? undefined : p.report?.experiments.find((e) => e.id === id);
  if (run === undefined || p.readable === null) throw new NotFound("run", "This version has no run by that name.");
  const game = plotGameOf(p.readable.game);
  const csv = trajectoryCsv(stateColumns(game), [{ run: run.id, times: run.times, rows: experimentRows(game, run) }], false);
  return {
    body: csv,
    mediaType: "text/csv; charset=utf-8; header=present",
    fileName: `${fileStem(p)}-${run.id.replace(/[^A-Za-z0-9._-]+/g, "-")}.csv`,
  };
});
