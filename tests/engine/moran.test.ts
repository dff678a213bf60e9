import { describe, expect, it } from "vitest";
import {
  fixationProbability,
  logFixationProbability,
  MoranInputError,
  NonPositiveFitness,
} from "@/lib/engine/moran";

const matrix = (rows: number[][]): Float64Array => Float64Array.from(rows.flat());

/** |a - b| <= rel * |b| (relative-tolerance helper, common practice). */
function expectRelative(a: number, b: number, rel: number): void {
  expect(Math.abs(a - b)).toBeLessThanOrEqual(rel * Math.abs(b));
}

/**
 * Absorption probabilities of the same birth-death chain found a second way: solving the
 * linear system x_i = T+_i x_{i+1} + T-_i x_{i-1} + (1 - T+_i - T-_i) x_i, x_0 = 0, x_N = 1
 * by the tridiagonal (Thomas) algorithm (Karlin and Taylor 1975, A First Course in
 * Stochastic Processes; transition probabilities as in Nowak et al. 2004).
 */
function absorptionBySolve(a: number, b: number, c: number, d: number, N: number, w: number): number {
  const lower: number[] = [];
  const diag: number[] = [];
  const upper: number[] = [];
  const rhs: number[] = [];
  for (let i = 1; i < N; i++) {
    const f = 1 - w + (w * (a * (i - 1) + b * (N - i))) / (N - 1);
    const g = 1 - w + (w * (c * i + d * (N - i - 1))) / (N - 1);
    const total = i * f + (N - i) * g;
    const up = ((i * f) / total) * ((N - i) / N);
    const down = (((N - i) * g) / total) * (i / N);
    lower.push(-down);
    diag.push(up + down);
    upper.push(-up);
    rhs.push(i === N - 1 ? up : 0);
  }
  const m = N - 1;
  for (let i = 1; i < m; i++) {
    const factor = (lower[i] ?? 0) / (diag[i - 1] ?? 1);
    diag[i] = (diag[i] ?? 0) - factor * (upper[i - 1] ?? 0);
    rhs[i] = (rhs[i] ?? 0) - factor * (rhs[i - 1] ?? 0);
  }
  const x = new Array<number>(m).fill(0);
  x[m - 1] = (rhs[m - 1] ?? 0) / (diag[m - 1] ?? 1);
  for (let i = m - 2; i >= 0; i--) x[i] = ((rhs[i] ?? 0) - (upper[i] ?? 0) * (x[i + 1] ?? 0)) / (diag[i] ?? 1);
  return x[0] ?? NaN;
}

describe("fixationProbability: published closed forms", () => {
  it("is 1/N under neutrality, w = 0 (Nowak 2006, Evolutionary Dynamics)", () => {
    const A = matrix([
      [3, 0],
      [5, 1],
    ]);
    for (const N of [2, 3, 10, 1000, 100000]) {
      expectRelative(fixationProbability(A, 2, 0, 1, N, 0), 1 / N, 1e-12);
    }
  });

  it("is (1 - 1/r) / (1 - 1/r^N) under constant fitness r (Nowak 2006, Evolutionary Dynamics)", () => {
    // mutant earns r and resident 1 against everyone: fitness r and 1 at w = 1,
    // and 1 + w (r - 1) against 1 at intensity w
    for (const r of [0.9, 1.05, 2]) {
      const A = matrix([
        [r, r],
        [1, 1],
      ]);
      for (const N of [2, 10, 100]) {
        expectRelative(fixationProbability(A, 2, 0, 1, N, 1), (1 - 1 / r) / (1 - 1 / r ** N), 1e-12);
        const re = 1 + 0.5 * (r - 1);
        expectRelative(fixationProbability(A, 2, 0, 1, N, 0.5), (1 - 1 / re) / (1 - 1 / re ** N), 1e-12);
      }
    }
  });

  it("matches the chain's absorption probabilities solved as a linear system", () => {
    const games = [
      [3, 0, 5, 1],
      [1, 4, 2, 0.5],
      [2, -1, 0.5, 1.5],
    ];
    for (const [a = 0, b = 0, c = 0, d = 0] of games) {
      for (const [N, w] of [
        [5, 0.3],
        [40, 0.1],
        [200, 0.02],
      ] as const) {
        const rho = fixationProbability(matrix([[a, b], [c, d]]), 2, 0, 1, N, w);
        expectRelative(rho, absorptionBySolve(a, b, c, d, N, w), 1e-9);
      }
    }
  });

  it("picks the mutant and resident rows and columns out of a larger game", () => {
    const A = matrix([
      [9, 9, 9],
      [9, 3, 0],
      [9, 5, 1],
    ]);
    const small = matrix([
      [3, 0],
      [5, 1],
    ]);
    expect(fixationProbability(A, 3, 1, 2, 30, 0.2)).toBe(fixationProbability(small, 2, 0, 1, 30, 0.2));
    expect(fixationProbability(A, 3, 2, 1, 30, 0.2)).toBe(fixationProbability(small, 2, 1, 0, 30, 0.2));
  });
});

describe("the one-third law under weak selection (Nowak, Sasaki, Taylor and Fudenberg 2004)", () => {
  // Coordination game a > c, d > b with b = 1, c = 2, d = 3: the interior rest point is
  // x* = (d - b) / (a - b - c + d) = 2 / a. Under weak selection (N w << 1) and large N,
  // rho_A > 1/N exactly when x* < 1/3.
  const N = 1000;
  const w = 1e-6;
  it("x* = 0.303 < 1/3: the mutant fixes more often than a neutral one", () => {
    const a = 6.6;
    const rho = fixationProbability(matrix([[a, 1], [2, 3]]), 2, 0, 1, N, w);
    expect(N * rho - 1).toBeGreaterThan(0);
    // the finite-N form of the condition from the same paper: (N-2)a + (2N-1)b > (N+1)c + (2N-4)d
    expect((N - 2) * a + (2 * N - 1) * 1 - (N + 1) * 2 - (2 * N - 4) * 3).toBeGreaterThan(0);
  });
  it("x* = 0.357 > 1/3: the mutant fixes less often than a neutral one", () => {
    const a = 5.6;
    const rho = fixationProbability(matrix([[a, 1], [2, 3]]), 2, 0, 1, N, w);
    expect(N * rho - 1).toBeLessThan(0);
    expect((N - 2) * a + (2 * N - 1) * 1 - (N + 1) * 2 - (2 * N - 4) * 3).toBeLessThan(0);
  });
});

describe("fixationProbability in large populations (log space)", () => {
  it("N = 100000 gives a finite value in (0, 1) under weak and under moderate selection", () => {
    const A = matrix([
      [3, 0],
      [5, 1],
    ]);
    for (const w of [1e-7, 1e-5]) {
      const rho = fixationProbability(A, 2, 0, 1, 100000, w);
      expect(Number.isFinite(rho)).toBe(true);
      expect(rho).toBeGreaterThan(0);
      expect(rho).toBeLessThan(1);
    }
    const favoured = fixationProbability(A, 2, 1, 0, 100000, 0.01);
    expect(favoured).toBeGreaterThan(0);
    expect(favoured).toBeLessThan(1);
    // the constant-fitness closed form at N = 100000 (Nowak 2006)
    const r = 1.001;
    const constant = matrix([
      [r, r],
      [1, 1],
    ]);
    expectRelative(fixationProbability(constant, 2, 0, 1, 100000, 1), (1 - 1 / r) / (1 - r ** -100000), 1e-9);
  });

  it("keeps log(rho) finite where rho underflows: log((1/r - 1) r^N / (1 - r^N)) for r = 0.9, N = 100000", () => {
    const r = 0.9;
    const N = 100000;
    const A = matrix([
      [r, r],
      [1, 1],
    ]);
    const log = logFixationProbability(A, 2, 0, 1, N, 1);
    const expected = Math.log(1 / r - 1) + N * Math.log(r) - Math.log1p(-(r ** N));
    expectRelative(log, expected, 1e-9);
    expect(fixationProbability(A, 2, 0, 1, N, 1)).toBe(0);
  });
});

describe("fixationProbability: refusals and their messages", () => {
  it("throws NonPositiveFitness, with its fields, when strong selection makes a fitness non-positive", () => {
    const A = matrix([
      [-2, -2],
      [1, 1],
    ]);
    try {
      fixationProbability(A, 2, 0, 1, 10, 0.9);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(NonPositiveFitness);
      const err = e as NonPositiveFitness;
      expect(err.type).toBe("mutant");
      expect(err.mutants).toBe(1);
      expect(err.fitness).toBeCloseTo(-1.7, 12);
      expect(err.selectionIntensity).toBe(0.9);
      expect(err.message).toMatch(
        /^the mutants' fitness is -1\.7\d* \(not positive\) with 1 mutant at selection intensity 0\.9; the Moran process needs positive fitness, so choose a weaker selection intensity or shift the payoffs$/,
      );
    }
    // the residents' fitness, reached only once mutants are common
    const B = matrix([
      [1, 1],
      [-3, 2],
    ]);
    expect(() => fixationProbability(B, 2, 0, 1, 4, 1)).toThrow(
      /^the residents' fitness is -[0-9.]+ \(not positive\) with \d mutants at selection intensity 1;/,
    );
    // zero fitness is refused too (w = 1, payoff 0)
    expect(() => fixationProbability(matrix([[0, 0], [1, 1]]), 2, 0, 1, 5, 1)).toThrow(NonPositiveFitness);
  });

  it("refuses arguments outside the process's domain", () => {
    const A = matrix([
      [1, 2],
      [3, 4],
    ]);
    const cases: [() => number, string][] = [
      [() => fixationProbability(A, 3, 0, 1, 10, 0.1), "the payoff matrix has 4 entries, not 3 x 3"],
      [() => fixationProbability(A, 2, 0, 1, 1, 0.1), "the population size must be an integer of at least 2; got 1"],
      [() => fixationProbability(A, 2, 0, 1, 10.5, 0.1), "the population size must be an integer of at least 2; got 10.5"],
      [() => fixationProbability(A, 2, 0, 1, 10, 1.5), "the selection intensity must lie in [0, 1]; got 1.5"],
      [() => fixationProbability(A, 2, 0, 1, 10, Number.NaN), "the selection intensity must lie in [0, 1]; got NaN"],
      [() => fixationProbability(A, 2, 2, 1, 10, 0.1), "the mutant strategy index 2 is not one of 0..1"],
      [() => fixationProbability(A, 2, 0, -1, 10, 0.1), "the resident strategy index -1 is not one of 0..1"],
    ];
    for (const [run, message] of cases) {
      expect(run).toThrow(MoranInputError);
      expect(run).toThrow(message);
    }
  });
});
