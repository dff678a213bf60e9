// Shared helpers for the dynamics, integration and rest-point tests: small game builders, a
// seeded generator, the contract's equations written out naively, and a second, independent
// ODE integrator (ode45-cash-karp, scijs) to compare odex's trajectories against.
import ode45 from "ode45-cash-karp";
import type { CompiledGame, DynamicsSpec } from "@/lib/engine/types";

export function symmetricGame(rows: number[][]): CompiledGame {
  const n = rows.length;
  return {
    kind: "symmetric",
    n,
    strategies: rows.map((_, i) => `s${i}`),
    A: Float64Array.from(rows.flat()),
  };
}

/** P1 is m x k (population 1 against 2), P2 is k x m (population 2 against 1). */
export function bimatrixGame(P1: number[][], P2: number[][]): CompiledGame {
  const m = P1.length;
  const k = P2.length;
  return {
    kind: "bimatrix",
    m,
    k,
    populations: [
      { name: "first", strategies: P1.map((_, i) => `a${i}`) },
      { name: "second", strategies: P2.map((_, j) => `b${j}`) },
    ],
    A: Float64Array.from(P1.flat()),
    B: Float64Array.from(P2.flat()),
  };
}

/** Mulberry32: a small deterministic generator of uniforms in [0, 1) (common practice). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function randomMatrix(rng: () => number, rows: number, cols: number, lo = -1, hi = 1): number[][] {
  return Array.from({ length: rows }, () => Array.from({ length: cols }, () => lo + (hi - lo) * rng()));
}

/** A point of the open simplex, uniform-ish (normalised exponentials). */
export function randomSimplexPoint(rng: () => number, n: number): number[] {
  const e = Array.from({ length: n }, () => -Math.log(1 - rng()) + 1e-3);
  const s = e.reduce((a, b) => a + b, 0);
  return e.map((v) => v / s);
}

const pos = (u: number): number => Math.max(u, 0);

/** One population's right-hand side, the contract's equation written out term by term. */
function naivePopulation(dynamics: DynamicsSpec, x: number[], f: number[]): number[] {
  const n = x.length;
  const phi = x.reduce((s, xi, i) => s + xi * (f[i] ?? 0), 0);
  const at = (v: number[], i: number): number => v[i] ?? 0;
  switch (dynamics.kind) {
    case "replicator":
      return x.map((xi, i) => xi * (at(f, i) - phi));
    case "replicator-mutator": {
      const mu = dynamics.mutationRate;
      const q = (j: number, i: number): number => (i === j ? 1 - mu : mu / (n - 1));
      return x.map((xi, i) => {
        let s = 0;
        for (let j = 0; j < n; j++) s += at(x, j) * at(f, j) * q(j, i);
        return s - xi * phi;
      });
    }
    case "logit": {
      const w = f.map((fi) => Math.exp(fi / dynamics.noise));
      const z = w.reduce((a, b) => a + b, 0);
      return x.map((xi, i) => at(w, i) / z - xi);
    }
    case "brown-von-neumann-nash": {
      const k = f.map((fi) => pos(fi - phi));
      const K = k.reduce((a, b) => a + b, 0);
      return x.map((xi, i) => at(k, i) - xi * K);
    }
    case "smith":
      return x.map((xi, i) => {
        let inflow = 0;
        let outflow = 0;
        for (let j = 0; j < n; j++) {
          inflow += at(x, j) * pos(at(f, i) - at(f, j));
          outflow += pos(at(f, j) - at(f, i));
        }
        return inflow - xi * outflow;
      });
  }
}

function times(M: number[][], z: number[]): number[] {
  return M.map((row) => row.reduce((s, a, l) => s + a * (z[l] ?? 0), 0));
}

/** The contract's equations for a symmetric game (rows = payoff matrix) at x. */
export function naiveSymmetric(rows: number[][], dynamics: DynamicsSpec, x: number[]): number[] {
  return naivePopulation(dynamics, x, times(rows, x));
}

/** The contract's equations for a bimatrix game at the flat state [x, y]. */
export function naiveBimatrix(P1: number[][], P2: number[][], dynamics: DynamicsSpec, xy: number[]): number[] {
  const x = xy.slice(0, P1.length);
  const y = xy.slice(P1.length);
  return [...naivePopulation(dynamics, x, times(P1, y)), ...naivePopulation(dynamics, y, times(P2, x))];
}

/**
 * Integrates x' = rhs(x) from x0 with the Cash-Karp 4(5) Runge-Kutta pair of ode45-cash-karp,
 * landing exactly on each requested time (ascending), and returns the states there.
 */
export function cashKarpAt(
  rhs: (x: Float64Array, out: Float64Array) => void,
  x0: ArrayLike<number>,
  at: number[],
  tol = 1e-12,
): Float64Array[] {
  const y = Float64Array.from(x0);
  const integrator = ode45(
    y,
    (dydt, state) => {
      rhs(state instanceof Float64Array ? state : Float64Array.from(state), dydt as Float64Array);
    },
    0,
    1e-3,
    { tol, verbose: false },
  );
  const out: Float64Array[] = [];
  for (const t of at) {
    if (t > integrator.t) integrator.steps(Infinity, t);
    out.push(Float64Array.from(integrator.y));
  }
  return out;
}

export function maxNormDistance(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let d = 0;
  for (let i = 0; i < a.length; i++) d = Math.max(d, Math.abs((a[i] ?? 0) - (b[i] ?? 0)));
  return d;
}
