/**
 * Runs of a 3-strategy symmetric game on the triangle of states (barycentric coordinates: each
 * corner is the state where everyone plays that strategy), with rest points by stability.
 */

import type { ReactNode } from "react";
import type { ExperimentReport, RestPointReport, State } from "@/lib/engine/types";
import { experimentRows } from "@/lib/plots/data";
import { fileStem, truncateLabel } from "@/lib/plots/format";
import { barycentricToPoint, fitTriangle, simplexGrid } from "@/lib/plots/simplex";
import { GRID_COLOR } from "@/lib/plots/style";
import { PlotFigure } from "./PlotFigure";
import { describeShares, drawPhase } from "./phase";
import { LABEL_FONT, LABEL_TEXT_CLASS } from "./svg-parts";

export interface SimplexPlotProps {
  /** Exactly three strategy names, in state order. */
  strategies: readonly string[];
  experiments: readonly ExperimentReport[];
  restPoints?: readonly RestPointReport[];
  /** Caption; defaults to "Runs on the simplex of <A>, <B> and <C>". */
  title?: string;
  /** Download file name stem; defaults to "simplex". */
  fileName?: string;
}

export const SIMPLEX_WIDTH = 560;
const SIMPLEX_HEIGHT = 500;
// Two bottom labels of this many characters fit side by side even at phone text size.
const VERTEX_LABEL_CHARS = 24;

function threeShares(state: State): number[] | null {
  return Array.isArray(state) && state.length === 3 && state.every((v) => typeof v === "number") ? (state as number[]) : null;
}

export function SimplexPlot({ strategies, experiments, restPoints = [], title, fileName }: SimplexPlotProps): ReactNode {
  const names: [string, string, string] = [strategies[0] ?? "", strategies[1] ?? "", strategies[2] ?? ""];
  const triangle = fitTriangle(40, 38, SIMPLEX_WIDTH - 80, SIMPLEX_HEIGHT - 38 - 44);
  const [v1, v2, v3] = triangle.vertices;
  const project = (state: State) => {
    const s = threeShares(state);
    return s === null ? null : barycentricToPoint(s, triangle);
  };
  const describe = (state: State): string => {
    const s = threeShares(state);
    return s === null ? "a state that is not three shares" : describeShares(names, s);
  };
  const drawing = drawPhase(experiments, restPoints, project, describe);
  const caption = title ?? `Runs on the simplex of ${names[0]}, ${names[1]} and ${names[2]}`;
  const summary =
    `Triangle of the states of ${names[0]}, ${names[1]} and ${names[2]}, each corner the state where all play that strategy, ` +
    `with ${experiments.length} ${experiments.length === 1 ? "run" : "runs"} drawn as paths from their start points` +
    (drawing.restPhrases.length > 0 ? `; ${drawing.restPhrases.join("; ")}.` : ".");
  const outline = `M${v1[0]} ${v1[1]}L${v2[0]} ${v2[1]}L${v3[0]} ${v3[1]}Z`;
  return (
    <PlotFigure
      title={caption}
      summary={summary}
      width={SIMPLEX_WIDTH}
      height={SIMPLEX_HEIGHT}
      legend={drawing.legend}
      columns={names}
      blocks={experiments.map((e) => ({ run: e.id, times: e.times, rows: experimentRows({ kind: "symmetric", strategies: names }, e) }))}
      withRun={true}
      fileStem={fileStem(fileName ?? "simplex")}
      notes={drawing.notes}
      maxWidth="max-w-xl"
    >
      <g stroke={GRID_COLOR} strokeOpacity={0.16} strokeWidth={1}>
        {simplexGrid(triangle).map(([a, b], i) => (
          <line key={i} x1={a[0]} y1={a[1]} x2={b[0]} y2={b[1]} />
        ))}
      </g>
      <path d={outline} fill="none" stroke="currentColor" strokeOpacity={0.7} strokeWidth={1.2} strokeLinejoin="round" />
      <g fill="currentColor" fontSize={LABEL_FONT} className={LABEL_TEXT_CLASS} fontWeight={600}>
        <text x={v1[0] - 6} y={v1[1] + 26} textAnchor="start">
          {truncateLabel(names[0], VERTEX_LABEL_CHARS)}
        </text>
        <text x={v2[0] + 6} y={v2[1] + 26} textAnchor="end">
          {truncateLabel(names[1], VERTEX_LABEL_CHARS)}
        </text>
        <text x={v3[0]} y={v3[1] - 14} textAnchor="middle">
          {truncateLabel(names[2], VERTEX_LABEL_CHARS)}
        </text>
      </g>
      {drawing.runs}
      {drawing.rest}
    </PlotFigure>
  );
}
