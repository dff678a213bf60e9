/**
 * All figures of a report: the phase portrait where the game has one (the simplex for three
 * strategies, the unit square for a 2x2 two-population game), then each run's time series.
 */

import type { ReactNode } from "react";
import type { ExperimentReport, RestPointReport } from "@/lib/engine/types";
import type { PlotGame } from "@/lib/plots/data";
import { SimplexPlot } from "./SimplexPlot";
import { TimeSeriesPlot } from "./TimeSeriesPlot";
import { UnitSquarePlot } from "./UnitSquarePlot";

export interface ExperimentFiguresProps {
  game: PlotGame;
  experiments: readonly ExperimentReport[];
  restPoints?: readonly RestPointReport[];
}

/** Which phase portrait a game gets, if any. */
export function phasePlotKind(game: PlotGame): "simplex" | "unit-square" | null {
  if (game.kind === "symmetric") return game.strategies.length === 3 ? "simplex" : null;
  const [a, b] = game.populations;
  return a.strategies.length === 2 && b.strategies.length === 2 ? "unit-square" : null;
}

export function ExperimentFigures({ game, experiments, restPoints = [] }: ExperimentFiguresProps): ReactNode {
  const kind = phasePlotKind(game);
  const drawable = experiments.filter((e) => e.states.length > 0 && e.times.length > 0);
  const empty = experiments.filter((e) => !(e.states.length > 0 && e.times.length > 0));
  if (experiments.length === 0 && restPoints.length === 0) {
    return <p className="text-sm">This model defines no runs, so there is nothing to plot.</p>;
  }
  return (
    <div className="min-w-0">
      {empty.length === 0 ? null : (
        <ul className="my-2 list-disc pl-5 text-sm" role="status">
          {empty.map((e) => (
            <li key={e.id}>
              Run “{e.id}” produced no samples
              {e.error === undefined ? "." : `: ${e.error}`}
            </li>
          ))}
        </ul>
      )}
      {kind === "simplex" && game.kind === "symmetric" ? (
        <SimplexPlot strategies={game.strategies} experiments={drawable} restPoints={restPoints} />
      ) : null}
      {kind === "unit-square" && game.kind === "bimatrix" ? (
        <UnitSquarePlot populations={game.populations} experiments={drawable} restPoints={restPoints} />
      ) : null}
      {drawable.map((e) => (
        <TimeSeriesPlot key={e.id} game={game} experiment={e} />
      ))}
    </div>
  );
}
