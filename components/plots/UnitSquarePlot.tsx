/**
 * Runs of a 2x2 two-population game in the unit square: population 1's share of its first
 * strategy across, population 2's share of its first strategy up; rest points by stability.
 */

import type { ReactNode } from "react";
import type { ExperimentReport, RestPointReport, State } from "@/lib/engine/types";
import { experimentRows, stateColumns, type PlotPopulation } from "@/lib/plots/data";
import { fileStem, formatShare, truncateLabel } from "@/lib/plots/format";
import { linearScale } from "@/lib/plots/scale";
import { PlotFigure } from "./PlotFigure";
import { drawPhase } from "./phase";
import { Axes } from "./svg-parts";

export interface UnitSquarePlotProps {
  /** Two populations with two strategies each. */
  populations: readonly [PlotPopulation, PlotPopulation];
  experiments: readonly ExperimentReport[];
  restPoints?: readonly RestPointReport[];
  /** Caption; defaults to "Runs in the unit square of <population 1> and <population 2>". */
  title?: string;
  /** Download file name stem; defaults to "unit-square". */
  fileName?: string;
}

export const UNIT_SQUARE_WIDTH = 560;
const SIDE = 440;
const LEFT = 80;
const TOP = 16;
const UNIT_SQUARE_HEIGHT = TOP + SIDE + 56;
const NAME_CHARS = 22;

/** (x_1, y_1) of a state [x, y] of two 2-share arrays, or null for any other shape. */
function firstShares(state: State): [number, number] | null {
  if (!Array.isArray(state) || state.length !== 2) return null;
  const [x, y] = state as unknown[];
  if (!Array.isArray(x) || !Array.isArray(y) || x.length !== 2 || y.length !== 2) return null;
  const a = x[0];
  const b = y[0];
  return typeof a === "number" && typeof b === "number" && Number.isFinite(a) && Number.isFinite(b) ? [a, b] : null;
}

export function UnitSquarePlot({ populations, experiments, restPoints = [], title, fileName }: UnitSquarePlotProps): ReactNode {
  const [p1, p2] = populations;
  const s1 = p1.strategies[0] ?? "";
  const s2 = p2.strategies[0] ?? "";
  const x = linearScale([0, 1], [LEFT, LEFT + SIDE]);
  const y = linearScale([0, 1], [TOP + SIDE, TOP]);
  const project = (state: State) => {
    const f = firstShares(state);
    return f === null ? null : ([x(f[0]), y(f[1])] as const);
  };
  const describe = (state: State): string => {
    const f = firstShares(state);
    return f === null
      ? "a state that is not two pairs of shares"
      : `${s1} ${formatShare(f[0], 3)} in ${p1.name}, ${s2} ${formatShare(f[1], 3)} in ${p2.name}`;
  };
  const drawing = drawPhase(experiments, restPoints, project, describe);
  const caption = title ?? `Runs in the unit square of ${p1.name} and ${p2.name}`;
  const summary =
    `Unit square with the share of ${s1} in ${p1.name} across and the share of ${s2} in ${p2.name} up, ` +
    `with ${experiments.length} ${experiments.length === 1 ? "run" : "runs"} drawn as paths from their start points` +
    (drawing.restPhrases.length > 0 ? `; ${drawing.restPhrases.join("; ")}.` : ".");
  const game = { kind: "bimatrix" as const, populations: [p1, p2] as [PlotPopulation, PlotPopulation] };
  return (
    <PlotFigure
      title={caption}
      summary={summary}
      width={UNIT_SQUARE_WIDTH}
      height={UNIT_SQUARE_HEIGHT}
      legend={drawing.legend}
      columns={stateColumns(game)}
      blocks={experiments.map((e) => ({ run: e.id, times: e.times, rows: experimentRows(game, e) }))}
      withRun={true}
      fileStem={fileStem(fileName ?? "unit-square")}
      notes={drawing.notes}
      maxWidth="max-w-xl"
    >
      <Axes
        x={x}
        y={y}
        xTickCount={5}
        yTickCount={5}
        xLabel={`Share of ${truncateLabel(s1, NAME_CHARS)} in ${truncateLabel(p1.name, NAME_CHARS)}`}
        yLabel={`Share of ${truncateLabel(s2, NAME_CHARS)} in ${truncateLabel(p2.name, NAME_CHARS)}`}
      />
      <rect x={LEFT} y={TOP} width={SIDE} height={SIDE} fill="none" stroke="currentColor" strokeOpacity={0.7} />
      {drawing.runs}
      {drawing.rest}
    </PlotFigure>
  );
}
