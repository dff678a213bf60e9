import { describe, expect, it } from "vitest";
import { DynamicsParameterError, vectorField, type VectorField } from "@/lib/engine/dynamics";
import type { DynamicsSpec } from "@/lib/engine/types";
import {
  bimatrixGame,
  maxNormDistance,
  mulberry32,
  naiveBimatrix,
  naiveSymmetric,
  randomMatrix,
  randomSimplexPoint,
  symmetricGame,
} from "@/tests/support/ode-reference";

const KINDS: DynamicsSpec[] = [
  { kind: "replicator" },
  { kind: "replicator-mutator", mutationRate: 0.07 },
  { kind: "logit", noise: 0.3 },
  { kind: "brown-von-neumann-nash" },
  { kind: "smith" },
];

function evaluate(field: VectorField, x: number[]): number[] {
  const out = new Float64Array(field.dim);
  field.rhs(Float64Array.from(x), out);
  return Array.from(out);
}

function jacobianOf(field: VectorField, x: number[]): Float64Array {
  const out = new Float64Array(field.dim * field.dim);
  field.jacobian(Float64Array.from(x), out);
  return out;
}

/** Central differences, step h, in every coordinate direction of R^dim (common practice). */
function centralDifferences(field: VectorField, x: number[], h = 1e-6): Float64Array {
  const d = field.dim;
  const J = new Float64Array(d * d);
  const plus = new Float64Array(d);
  const minus = new Float64Array(d);
  for (let j = 0; j < d; j++) {
    const xp = Float64Array.from(x);
    const xm = Float64Array.from(x);
    xp[j] = (xp[j] ?? 0) + h;
    xm[j] = (xm[j] ?? 0) - h;
    field.rhs(xp, plus);
    field.rhs(xm, minus);
    for (let i = 0; i < d; i++) J[i * d + j] = ((plus[i] ?? 0) - (minus[i] ?? 0)) / (2 * h);
  }
  return J;
}

describe("vectorField right-hand sides match the contract's equations written out naively", () => {
  const rng = mulberry32(20261202);
  for (const dynamics of KINDS) {
    it(`${dynamics.kind}, symmetric n = 2, 3, 5`, () => {
      for (const n of [2, 3, 5]) {
        const rows = randomMatrix(rng, n, n, -2, 3);
        const field = vectorField(symmetricGame(rows), dynamics);
        expect(field.dim).toBe(n);
        for (let trial = 0; trial < 5; trial++) {
          const x = randomSimplexPoint(rng, n);
          expect(maxNormDistance(evaluate(field, x), naiveSymmetric(rows, dynamics, x))).toBeLessThan(1e-13);
        }
      }
    });
    it(`${dynamics.kind}, bimatrix 2 x 3 and 4 x 2`, () => {
      for (const [m, k] of [
        [2, 3],
        [4, 2],
      ] as const) {
        const P1 = randomMatrix(rng, m, k, -1, 2);
        const P2 = randomMatrix(rng, k, m, -1, 2);
        const field = vectorField(bimatrixGame(P1, P2), dynamics);
        expect(field.dim).toBe(m + k);
        for (let trial = 0; trial < 5; trial++) {
          const xy = [...randomSimplexPoint(rng, m), ...randomSimplexPoint(rng, k)];
          expect(maxNormDistance(evaluate(field, xy), naiveBimatrix(P1, P2, dynamics, xy))).toBeLessThan(1e-13);
        }
      }
    });
  }

  it("keeps the sum of each population's shares fixed off the simplex too (sum of components is 0)", () => {
    for (const dynamics of KINDS) {
      const P1 = randomMatrix(rng, 3, 2);
      const P2 = randomMatrix(rng, 2, 3);
      const field = vectorField(bimatrixGame(P1, P2), dynamics);
      const g = evaluate(field, [0.5, 0.3, 0.4, 0.2, 0.7]); // sums 1.2 and 0.9
      expect(Math.abs((g[0] ?? 0) + (g[1] ?? 0) + (g[2] ?? 0))).toBeLessThan(1e-15);
      expect(Math.abs((g[3] ?? 0) + (g[4] ?? 0))).toBeLessThan(1e-15);
    }
  });

  it("hawk-dove replicator: x' = x(1-x)(V/2 - Cx/2) for the hawk share x (Maynard Smith 1982, from memory)", () => {
    const V = 2;
    const C = 5;
    const field = vectorField(symmetricGame([[(V - C) / 2, V], [0, V / 2]]), { kind: "replicator" });
    for (const x of [0.1, 0.4, 0.9]) {
      const [dx] = evaluate(field, [x, 1 - x]);
      expect(dx).toBeCloseTo(x * (1 - x) * (V / 2 - (C * x) / 2), 14);
    }
  });
});

describe("vectorField Jacobians agree with central finite differences", () => {
  const rng = mulberry32(7);
  for (const dynamics of KINDS) {
    it(`${dynamics.kind}: symmetric and bimatrix, on and off the simplex`, () => {
      const cases: { field: VectorField; point: () => number[] }[] = [];
      for (const n of [2, 3, 4]) {
        const field = vectorField(symmetricGame(randomMatrix(rng, n, n, -2, 2)), dynamics);
        cases.push({ field, point: () => randomSimplexPoint(rng, n) });
      }
      const field = vectorField(bimatrixGame(randomMatrix(rng, 3, 2), randomMatrix(rng, 2, 3)), dynamics);
      cases.push({ field, point: () => [...randomSimplexPoint(rng, 3), ...randomSimplexPoint(rng, 2)] });
      for (const { field, point } of cases) {
        for (let trial = 0; trial < 4; trial++) {
          const base = point();
          // off the simplex as well: the Jacobian is the full dim x dim derivative
          const x = trial % 2 === 0 ? base : base.map((v, i) => v * (1 + 0.05 * ((i % 3) - 1)));
          const exact = jacobianOf(field, x);
          const numeric = centralDifferences(field, x);
          expect(maxNormDistance(exact, numeric)).toBeLessThan(1e-7);
        }
      }
    });
  }

  it("BNN and Smith at an interior Nash equilibrium (all payoffs equal, every kink active) use slope 1/2, the central-difference limit", () => {
    // generalized rock-paper-scissors with win 2, loss 1: payoffs equal at the barycentre
    const rps = symmetricGame([
      [0, -1, 2],
      [2, 0, -1],
      [-1, 2, 0],
    ]);
    const third = [1 / 3, 1 / 3, 1 / 3];
    for (const kind of ["brown-von-neumann-nash", "smith"] as const) {
      const field = vectorField(rps, { kind });
      const exact = jacobianOf(field, third);
      const numeric = centralDifferences(field, third, 1e-7);
      expect(maxNormDistance(exact, numeric)).toBeLessThan(1e-6);
      expect(exact.some((v) => Math.abs(v) > 0.05)).toBe(true);
    }
  });

  it("two-population replicator at an interior rest point: the own-population blocks of the Jacobian vanish, so the spectrum is symmetric about 0 and the point is never asymptotically stable (Hofbauer and Sigmund 1998, from memory)", () => {
    // Games built around a chosen interior equilibrium (x*, y*): A = R - (R y*) 1^T gives A y* = 0
    // (all of population 1's strategies earn the same), likewise B x* = 0.
    const m = 3;
    const k = 4;
    const xs = [0.2, 0.5, 0.3];
    const ys = [0.1, 0.4, 0.3, 0.2];
    const R = randomMatrix(rng, m, k);
    const Q = randomMatrix(rng, k, m);
    const P1 = R.map((row) => {
      const ry = row.reduce((s, v, j) => s + v * (ys[j] ?? 0), 0);
      return row.map((v) => v - ry);
    });
    const P2 = Q.map((row) => {
      const qx = row.reduce((s, v, i) => s + v * (xs[i] ?? 0), 0);
      return row.map((v) => v - qx);
    });
    const field = vectorField(bimatrixGame(P1, P2), { kind: "replicator" });
    const point = [...xs, ...ys];
    expect(Math.max(...evaluate(field, point).map(Math.abs))).toBeLessThan(1e-15);
    const J = jacobianOf(field, point);
    const d = m + k;
    let ownBlocks = 0;
    let coupling = 0;
    for (let i = 0; i < d; i++) {
      for (let j = 0; j < d; j++) {
        const v = Math.abs(J[i * d + j] ?? 0);
        if (i < m === j < m) ownBlocks = Math.max(ownBlocks, v);
        else coupling = Math.max(coupling, v);
      }
    }
    expect(ownBlocks).toBeLessThan(1e-15);
    expect(coupling).toBeGreaterThan(0.01);
  });

  it("replicator Jacobian maps into the tangent space: every column sums to 0", () => {
    const field = vectorField(symmetricGame(randomMatrix(rng, 4, 4)), { kind: "replicator" });
    const J = jacobianOf(field, randomSimplexPoint(rng, 4));
    for (let j = 0; j < 4; j++) {
      let s = 0;
      for (let i = 0; i < 4; i++) s += J[i * 4 + j] ?? 0;
      expect(Math.abs(s)).toBeLessThan(1e-14);
    }
  });
});

describe("vectorField parameter checks", () => {
  const game = symmetricGame([
    [1, 0],
    [0, 1],
  ]);
  it("refuses a mutation rate outside [0, 1]", () => {
    expect(() => vectorField(game, { kind: "replicator-mutator", mutationRate: 1.5 })).toThrow(
      "the mutation rate must lie in [0, 1]; got 1.5",
    );
    expect(() => vectorField(game, { kind: "replicator-mutator", mutationRate: -0.1 })).toThrow(DynamicsParameterError);
  });
  it("refuses a logit noise that is not positive and finite", () => {
    expect(() => vectorField(game, { kind: "logit", noise: 0 })).toThrow(
      "the logit noise must be a positive finite number; got 0",
    );
    try {
      vectorField(game, { kind: "logit", noise: Number.NaN });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(DynamicsParameterError);
      expect((e as DynamicsParameterError).parameter).toBe("noise");
    }
  });
  it("logit with a small noise stays finite (softmax shifted by its maximum)", () => {
    const field = vectorField(symmetricGame([[1000, 0], [0, 999]]), { kind: "logit", noise: 1e-3 });
    const g = evaluate(field, [0.5, 0.5]);
    expect(g.every(Number.isFinite)).toBe(true);
    expect(g[0]).toBeCloseTo(0.5, 12);
  });
});
