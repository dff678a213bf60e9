/**
 * Rest-point analysis of the replicator dynamics of a compiled game: every rest point by
 * support enumeration (where the game is small enough), each with its linear stability,
 * Nash property and (symmetric games) ESS property. Shared by the report's rest-point list
 * and by the claims.
 */
import type { Budget } from "./budget";
import { vectorField, type VectorField } from "./dynamics";
import { essSymmetric, type EssResult } from "./ess";
import { bimatrixNash, symmetricNash } from "./nash";
import {
  MAX_ENUMERATED_BIMATRIX,
  MAX_ENUMERATED_STRATEGIES,
  bimatrixRestPoints,
  symmetricRestPoints,
  type RestPointSet,
} from "./restpoints";
import { classifyRestPoint } from "./stability";
import { stateDimension, type CompiledGame, type DynamicsSpec, type Eigenvalue, type Stability } from "./types";

/** A rest point of the replicator dynamics with its stability, Nash and ESS properties. */
export interface AnalyzedPoint {
  state: Float64Array;
  support: number[];
  stability: Stability;
  eigenvalues: Eigenvalue[];
  /** Scale of the restricted Jacobian (for rounding eigenvalue noise). */
  scale: number;
  nash: boolean;
  ess: EssResult | null;
}

/** The replicator rest points of one compiled game (one parameter set). */
export interface Analysis {
  game: CompiledGame;
  /** false when the game is too large to enumerate. */
  enumerated: boolean;
  points: AnalyzedPoint[];
  continua: number[][];
  undecided: number[][];
}

/** Block sizes of the flat state: [n], or [m, k] for two populations. */
export function layoutOf(game: CompiledGame): number[] {
  return game.kind === "symmetric" ? [game.n] : [game.m, game.k];
}

/** Whether the game is small enough for support enumeration (restpoints.ts limits). */
export function canEnumerate(game: CompiledGame): boolean {
  return game.kind === "symmetric" ? game.n <= MAX_ENUMERATED_STRATEGIES : game.m + game.k <= MAX_ENUMERATED_BIMATRIX;
}

const REPLICATOR: DynamicsSpec = { kind: "replicator" };

/** Stability, Nash and ESS of one rest point of the replicator dynamics. */
export function analyzePoint(
  game: CompiledGame,
  state: Float64Array,
  support: number[],
  field: VectorField = vectorField(game, REPLICATOR),
  J: Float64Array = new Float64Array(stateDimension(game) ** 2),
): AnalyzedPoint {
  field.jacobian(state, J);
  const st = classifyRestPoint(J, layoutOf(game));
  const nash = game.kind === "symmetric" ? symmetricNash(game.A, game.n, state).nash : bimatrixNash(game.A, game.B, game.m, game.k, state).nash;
  const ess = game.kind === "symmetric" ? essSymmetric(game.A, game.n, state, game.strategies) : null;
  return { state, support, stability: st.stability, eigenvalues: st.eigenvalues, scale: st.scale, nash, ess };
}

/** Lexicographic order on states, largest first (so e_1 comes before e_2). */
export function compareStates(a: Float64Array, b: Float64Array): number {
  for (let i = 0; i < a.length; i++) {
    const d = (b[i] ?? 0) - (a[i] ?? 0);
    if (d !== 0) return d;
  }
  return 0;
}

/** Full analysis; throws BudgetExceeded when the wall clock runs out. */
export function analyzeGame(game: CompiledGame, budget?: Budget): Analysis {
  if (!canEnumerate(game)) return { game, enumerated: false, points: [], continua: [], undecided: [] };
  const set: RestPointSet = game.kind === "symmetric" ? symmetricRestPoints(game.A, game.n, budget) : bimatrixRestPoints(game.A, game.B, game.m, game.k, budget);
  const points: AnalyzedPoint[] = [];
  const sorted = [...set.points].sort((a, b) => compareStates(a.state, b.state));
  const field = vectorField(game, REPLICATOR);
  const J = new Float64Array(stateDimension(game) ** 2);
  for (const p of sorted) {
    budget?.checkTime();
    points.push(analyzePoint(game, p.state, p.support, field, J));
  }
  return { game, enumerated: true, points, continua: set.continua, undecided: set.undecided };
}
