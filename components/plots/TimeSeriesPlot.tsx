/**
 * Shares over time for every strategy of one run: one panel for a symmetric game, one panel per
 * population for a two-population game.
 */

import type { ReactNode } from "react";
import type { ExperimentReport } from "@/lib/engine/types";
import { experimentRows, panelShares, stateColumns, statePanels, type PlotGame } from "@/lib/plots/data";
import { minMaxIndices, pointsAttribute, simplifyPath, type Point } from "@/lib/plots/downsample";
import type { LegendEntry } from "@/lib/plots/export-svg";
import { fileStem, formatShare, formatTime } from "@/lib/plots/format";
import { linearScale } from "@/lib/plots/scale";
import { PlotFigure } from "./PlotFigure";
import { Axes, LABEL_FONT, LABEL_TEXT_CLASS, SeriesLine } from "./svg-parts";

export interface TimeSeriesPlotProps {
  game: PlotGame;
  experiment: ExperimentReport;
  /** Caption; defaults to `Run "<id>": shares over time`. */
  title?: string;
}

export const TIME_SERIES_WIDTH = 560;
const PANEL_HEIGHT = 260;
const MARGIN = { left: 62, right: 18, top: 28, bottom: 50 };
const MARKERS_PER_SERIES = 4;
/** Drawing units a thinned line may deviate from the full one (a unit is at most 1.4 screen pixels). */
const LINE_TOLERANCE = 0.25;

/** Strategies named in a summary sentence per panel; the rest are counted. */
const SUMMARY_NAMES = 6;

function finalSummary(names: readonly string[], shares: readonly number[]): string {
  const order = names.map((_, i) => i).sort((a, b) => (shares[b] ?? 0) - (shares[a] ?? 0));
  const shown = order.slice(0, SUMMARY_NAMES).map((i) => `${names[i] ?? ""} ${formatShare(shares[i] ?? NaN, 3)}`);
  const rest = names.length - shown.length;
  return rest > 0 ? `${shown.join(", ")} and ${rest} more` : shown.join(", ");
}

export function TimeSeriesPlot({ game, experiment, title }: TimeSeriesPlotProps): ReactNode {
  const panels = statePanels(game);
  const times = experiment.times;
  const n = Math.min(times.length, experiment.states.length);
  const finiteTimes = times.slice(0, n).filter(Number.isFinite);
  const t0 = finiteTimes.length > 0 ? Math.min(...finiteTimes) : 0;
  const t1 = finiteTimes.length > 0 ? Math.max(...finiteTimes) : 1;
  const width = TIME_SERIES_WIDTH;
  const height = PANEL_HEIGHT * panels.length;
  const caption = title ?? `Run “${experiment.id}”: shares over time`;

  const legend: LegendEntry[] = [];
  const summaries: string[] = [];
  let styleBase = 0;
  const drawn = panels.map((panel, p) => {
    const top = p * PANEL_HEIGHT;
    const x = linearScale([t0, t1], [MARGIN.left, width - MARGIN.right]);
    const y = linearScale([0, 1], [top + PANEL_HEIGHT - MARGIN.bottom, top + MARGIN.top]);
    const columns = Math.round(width - MARGIN.left - MARGIN.right);
    if (game.kind === "bimatrix") legend.push({ kind: "heading", label: panel.name });
    const lines = panel.strategies.map((name, s) => {
      const index = styleBase + s;
      legend.push({ kind: "series", index, label: name });
      const ys = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        const state = experiment.states[i];
        ys[i] = state === undefined ? NaN : (panelShares(game, state, p)[s] ?? NaN);
      }
      const kept = minMaxIndices(times.slice(0, n), ys, columns);
      // Per-column extremes first (bounded work), then drop what lies within a fraction of a unit.
      const points = simplifyPath(
        kept.map((i): Point => [x(times[i] ?? NaN), y(ys[i] ?? NaN)]),
        LINE_TOLERANCE,
      );
      // Markers at staggered positions so those of different series do not sit on top of each other.
      const markers: Point[] = [];
      if (n > 0) {
        const phase = 0.15 + 0.7 * ((index * 0.618034) % 1);
        for (let k = 0; k < MARKERS_PER_SERIES; k++) {
          const i = Math.round(((k + phase) / MARKERS_PER_SERIES) * (n - 1));
          const v = ys[i] ?? NaN;
          const t = times[i] ?? NaN;
          if (Number.isFinite(v) && Number.isFinite(t)) markers.push([x(t), y(v)]);
        }
      }
      return <SeriesLine key={s} index={index} points={pointsAttribute(points)} markers={markers} />;
    });
    const last = n > 0 ? experiment.states[n - 1] : undefined;
    const finalShares = last === undefined ? [] : panelShares(game, last, p);
    const prefix = game.kind === "bimatrix" ? ` in ${panel.name}: ` : ": ";
    if (n > 0) summaries.push(`${prefix}${finalSummary(panel.strategies, finalShares)}`);
    styleBase += panel.strategies.length;
    return (
      <g key={p}>
        {game.kind === "bimatrix" ? (
          <text x={MARGIN.left} y={top + 18} fill="currentColor" fontSize={LABEL_FONT} className={LABEL_TEXT_CLASS} fontWeight={600}>
            {panel.name}
          </text>
        ) : null}
        <Axes x={x} y={y} xLabel="Time" yLabel="Share" />
        {lines}
      </g>
    );
  });

  const strategyCount = panels.reduce((k, p) => k + p.strategies.length, 0);
  const span = n > 0 ? `from t = ${formatTime(t0)} to t = ${formatTime(t1)} (${n} samples)` : "with no samples";
  const summary =
    `Line chart of the shares of ${strategyCount} strategies over time in run “${experiment.id}”, ${span}.` +
    (summaries.length > 0 ? ` Final shares${summaries.join(";")}.` : "");

  const notes = experiment.error === undefined ? [] : [`This run stopped early: ${experiment.error}`];
  return (
    <PlotFigure
      title={caption}
      summary={summary}
      width={width}
      height={height}
      legend={legend}
      columns={stateColumns(game)}
      blocks={[{ run: experiment.id, times: times.slice(0, n), rows: experimentRows(game, experiment).slice(0, n) }]}
      withRun={false}
      fileStem={fileStem(`${experiment.id}-time-series`)}
      notes={notes}
    >
      {drawn}
    </PlotFigure>
  );
}
