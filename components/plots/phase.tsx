/**
 * What the simplex and the unit square share: runs drawn as thinned paths in state space with a
 * start marker and a direction arrow, rest points drawn by stability, legend entries and notes.
 */

import type { ReactNode } from "react";
import type { ExperimentReport, RestPointReport, Stability, State } from "@/lib/engine/types";
import { pointsAttribute, simplifyPath, type Point } from "@/lib/plots/downsample";
import type { LegendEntry } from "@/lib/plots/export-svg";
import { formatShare } from "@/lib/plots/format";
import { seriesStyle } from "@/lib/plots/style";
import { SYMBOL_LABELS } from "@/lib/plots/symbols";
import { PointMark } from "./svg-parts";

/** Below a third of a drawing unit a dropped point changes nothing visible. */
const PATH_TOLERANCE = 0.3;

export type Projection = (state: State) => Point | null;

const STABILITY_ORDER: readonly Stability[] = ["asymptotically-stable", "unstable", "non-hyperbolic"];

/** Point at half the length of a path and the direction of travel there, for a direction arrow. */
function midArrow(points: readonly Point[]): { at: Point; angle: number } | null {
  let total = 0;
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    if (a !== undefined && b !== undefined) total += Math.hypot(b[0] - a[0], b[1] - a[1]);
  }
  if (!(total > 24)) return null;
  let walked = 0;
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    if (a === undefined || b === undefined) continue;
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
    if (walked + len >= total / 2 && len > 0) {
      const t = (total / 2 - walked) / len;
      return { at: [a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])], angle: Math.atan2(b[1] - a[1], b[0] - a[0]) };
    }
    walked += len;
  }
  return null;
}

function arrowPath(at: Point, angle: number, size = 9): string {
  const tip: Point = [at[0] + Math.cos(angle) * size * 0.6, at[1] + Math.sin(angle) * size * 0.6];
  const back = (side: number): Point => [
    at[0] - Math.cos(angle) * size * 0.5 + Math.cos(angle + side * Math.PI / 2) * size * 0.45,
    at[1] - Math.sin(angle) * size * 0.5 + Math.sin(angle + side * Math.PI / 2) * size * 0.45,
  ];
  const [l, r] = [back(1), back(-1)];
  const f = (v: number): string => String(Math.round(v * 100) / 100);
  return `M${f(tip[0])} ${f(tip[1])}L${f(l[0])} ${f(l[1])}L${f(r[0])} ${f(r[1])}Z`;
}

export interface PhaseDrawing {
  runs: ReactNode;
  rest: ReactNode;
  legend: LegendEntry[];
  notes: string[];
  /** Phrases for the accessible summary, one per rest point. */
  restPhrases: string[];
}

/**
 * Draws every run through `project` and every rest point through `projectRest`, and says in
 * `notes` what could not be drawn. `describe` words a state for summaries.
 */
export function drawPhase(
  experiments: readonly ExperimentReport[],
  restPoints: readonly RestPointReport[],
  project: Projection,
  describe: (state: State) => string,
): PhaseDrawing {
  const legend: LegendEntry[] = [];
  const notes: string[] = [];
  const runs = experiments.map((experiment, index) => {
    const raw: Point[] = [];
    let skipped = 0;
    for (const state of experiment.states) {
      const p = project(state);
      if (p === null) skipped++;
      else raw.push(p);
    }
    if (skipped > 0) notes.push(`Run “${experiment.id}”: ${skipped} ${skipped === 1 ? "state" : "states"} could not be placed in the plot.`);
    if (experiment.error !== undefined) notes.push(`Run “${experiment.id}” stopped early: ${experiment.error}`);
    legend.push({ kind: "series", index, label: `Run “${experiment.id}”` });
    const points = simplifyPath(raw, PATH_TOLERANCE);
    const s = seriesStyle(index);
    const start = points[0];
    const arrow = midArrow(points);
    return (
      <g key={index} data-run={experiment.id}>
        <polyline
          points={pointsAttribute(points)}
          fill="none"
          style={{ stroke: s.color }}
          strokeWidth={1.8}
          strokeDasharray={s.dash === "" ? undefined : s.dash}
          strokeLinejoin="round"
          strokeLinecap="round"
        />
        {arrow === null ? null : <path d={arrowPath(arrow.at, arrow.angle)} style={{ fill: s.color }} />}
        {start === undefined ? null : (
          <PointMark kind="start" at={start} size={11} index={index} label={`Start of run “${experiment.id}”`} />
        )}
      </g>
    );
  });
  if (experiments.length > 0) legend.push({ kind: "symbol", symbol: "start", label: SYMBOL_LABELS.start });

  const restPhrases: string[] = [];
  const present = new Set<Stability>();
  const rest: ReactNode[] = [];
  restPoints.forEach((r, i) => {
    const p = project(r.state);
    const words = `${SYMBOL_LABELS[r.stability]} at ${describe(r.state)}`;
    restPhrases.push(words);
    if (p === null) {
      notes.push(`A ${words} could not be placed in the plot.`);
      return;
    }
    present.add(r.stability);
    rest.push(<PointMark key={i} kind={r.stability} at={p} size={11} label={words} />);
  });
  for (const s of STABILITY_ORDER) if (present.has(s)) legend.push({ kind: "symbol", symbol: s, label: SYMBOL_LABELS[s] });
  return { runs, rest: <g data-rest-points="">{rest}</g>, legend, notes, restPhrases };
}

/** "A 0.333, B 0.667" */
export function describeShares(names: readonly string[], shares: readonly number[]): string {
  return names.map((n, i) => `${n} ${formatShare(shares[i] ?? NaN, 3)}`).join(", ");
}
