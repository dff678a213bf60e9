/**
 * Reshaping report data for the plots: the game as the plots need it, column names, and states
 * flattened into table rows.
 */

import type { ExperimentReport, State } from "@/lib/engine/types";

export interface PlotPopulation {
  name: string;
  strategies: string[];
}

/** The parts of a game the figures need. */
export type PlotGame =
  | { kind: "symmetric"; strategies: string[] }
  | { kind: "bimatrix"; populations: [PlotPopulation, PlotPopulation] };

/** Column names for tables and CSV: strategy names, or "population: strategy" for two populations. */
export function stateColumns(game: PlotGame): string[] {
  if (game.kind === "symmetric") return game.strategies.slice();
  return game.populations.flatMap((p) => p.strategies.map((s) => `${p.name}: ${s}`));
}

/** Groups of strategies drawn as one panel each: one for a symmetric game, one per population. */
export function statePanels(game: PlotGame): PlotPopulation[] {
  return game.kind === "symmetric" ? [{ name: "", strategies: game.strategies }] : game.populations.slice();
}

/**
 * The shares of panel `panel` in a state: the state itself for a symmetric game, the population's
 * array for a bimatrix state. Returns [] for a state of the wrong shape.
 */
export function panelShares(game: PlotGame, state: State, panel: number): readonly number[] {
  if (game.kind === "symmetric") return isNumberArray(state) ? state : [];
  const part = (state as unknown[])[panel];
  return isNumberArray(part) ? part : [];
}

/** A state as one table row (population 1's shares first). */
export function flattenState(game: PlotGame, state: State): number[] {
  if (game.kind === "symmetric") return isNumberArray(state) ? state.slice() : [];
  return [...panelShares(game, state, 0), ...panelShares(game, state, 1)];
}

export function experimentRows(game: PlotGame, experiment: ExperimentReport): number[][] {
  return experiment.states.map((s) => flattenState(game, s));
}

function isNumberArray(value: unknown): value is number[] {
  return Array.isArray(value) && value.every((v) => typeof v === "number");
}
