/** The parts of a spec's game the figures need (components/plots), shared by server and client views. */
import type { PlotGame } from "@/lib/plots/data";
import type { GameSpec, ModelSpec } from "@/lib/engine/types";

export function plotGameOf(game: GameSpec): PlotGame {
  return game.kind === "symmetric"
    ? { kind: "symmetric", strategies: game.strategies }
    : { kind: "bimatrix", populations: [game.populations[0], game.populations[1]] };
}

export function plotGameOfSpec(spec: ModelSpec): PlotGame | null {
  const g: unknown = spec.game;
  if (typeof g !== "object" || g === null) return null;
  return plotGameOf(spec.game);
}
