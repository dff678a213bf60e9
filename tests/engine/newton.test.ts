import { describe, expect, it } from "vitest";
import { Budget, BudgetExceeded } from "@/lib/engine/budget";
import { vectorField } from "@/lib/engine/dynamics";
import { DUPLICATE_DISTANCE, findRestPoints, gridStarts, RestPointSearchError } from "@/lib/engine/newton";
import type { DynamicsSpec } from "@/lib/engine/types";
import { bimatrixGame, maxNormDistance, naiveSymmetric, symmetricGame } from "@/tests/support/ode-reference";

/** Sorts points lexicographically so that sets can be compared. */
function sorted(points: Float64Array[]): number[][] {
  return points.map((p) => Array.from(p)).sort((a, b) => {
    for (let i = 0; i < a.length; i++) {
      const d = (a[i] ?? 0) - (b[i] ?? 0);
      if (Math.abs(d) > 1e-9) return d;
    }
    return 0;
  });
}

function expectSameSet(found: Float64Array[], expected: number[][], tol = 1e-9): void {
  const got = sorted(found);
  const want = sorted(expected.map((p) => Float64Array.from(p)));
  expect(got).toHaveLength(want.length);
  got.forEach((p, i) => expect(maxNormDistance(p, want[i] ?? [])).toBeLessThan(tol));
}

const V = 2;
const C = 3;
const hawkDove = [
  [(V - C) / 2, V],
  [0, V / 2],
];

describe("findRestPoints: published rest points", () => {
  it("hawk-dove replicator: the two pure states and the mixed state with hawk share V/C (Maynard Smith 1982)", () => {
    const field = vectorField(symmetricGame(hawkDove), { kind: "replicator" });
    expectSameSet(findRestPoints(field, [2], [], new Budget()), [
      [1, 0],
      [0, 1],
      [V / C, 1 - V / C],
    ]);
  });

  it("BNN and Smith: rest points are exactly the Nash equilibria (Nash stationarity; Sandholm 2010, Population Games and Evolutionary Dynamics)", () => {
    // hawk-dove: the only Nash equilibrium is the mixed one
    for (const kind of ["brown-von-neumann-nash", "smith"] as const) {
      const field = vectorField(symmetricGame(hawkDove), { kind });
      expectSameSet(findRestPoints(field, [2], [], new Budget()), [[V / C, 1 - V / C]], 1e-8);
    }
    // a coordination game with payoffs 2 and 1: both pure states and the mixed state (1/3, 2/3)
    const coordination = symmetricGame([
      [2, 0],
      [0, 1],
    ]);
    for (const kind of ["brown-von-neumann-nash", "smith"] as const) {
      const field = vectorField(coordination, { kind });
      expectSameSet(
        findRestPoints(field, [2], [], new Budget()),
        [
          [1, 0],
          [0, 1],
          [1 / 3, 2 / 3],
        ],
        1e-8,
      );
    }
  });

  it("logit in a coordination game with small noise: three logit equilibria, each solving x = 1/(1 + e^{(1-2x)/eta}) (McKelvey and Palfrey 1995)", () => {
    const eta = 0.1;
    const field = vectorField(
      symmetricGame([
        [1, 0],
        [0, 1],
      ]),
      { kind: "logit", noise: eta },
    );
    const found = findRestPoints(field, [2], [], new Budget());
    expect(found).toHaveLength(3);
    for (const p of found) {
      const x = p[0] ?? NaN;
      expect(Math.abs(x - 1 / (1 + Math.exp((1 - 2 * x) / eta)))).toBeLessThan(1e-12);
    }
    expect(found.some((p) => Math.abs((p[0] ?? 0) - 0.5) < 1e-12)).toBe(true);
  });

  it("logit in rock-paper-scissors: the barycentre only", () => {
    const field = vectorField(
      symmetricGame([
        [0, -1, 2],
        [2, 0, -1],
        [-1, 2, 0],
      ]),
      { kind: "logit", noise: 0.4 },
    );
    expectSameSet(findRestPoints(field, [3], [], new Budget()), [[1 / 3, 1 / 3, 1 / 3]]);
  });

  it("replicator-mutator in a four-strategy game: every point found solves the written-out equation", () => {
    const rows = [
      [1, 0.2, -0.4, 0.9],
      [0.3, 0.8, 1.1, -0.2],
      [0.5, -0.6, 0.4, 1.2],
      [-0.1, 0.7, 0.3, 0.6],
    ];
    const dynamics: DynamicsSpec = { kind: "replicator-mutator", mutationRate: 0.02 };
    const found = findRestPoints(vectorField(symmetricGame(rows), dynamics), [4], [], new Budget());
    expect(found.length).toBeGreaterThan(0);
    for (const p of found) {
      const x = Array.from(p);
      expect(Math.abs(x.reduce((a, v) => a + v, 0) - 1)).toBeLessThan(1e-14);
      expect(x.every((v) => v >= 0)).toBe(true);
      expect(Math.max(...naiveSymmetric(rows, dynamics, x).map(Math.abs))).toBeLessThan(1e-11);
    }
  });

  it("matching pennies, two populations: the four corners and the centre (Hofbauer and Sigmund 1998, Evolutionary Games and Population Dynamics)", () => {
    const field = vectorField(
      bimatrixGame(
        [
          [1, -1],
          [-1, 1],
        ],
        [
          [-1, 1],
          [1, -1],
        ],
      ),
      { kind: "replicator" },
    );
    expectSameSet(findRestPoints(field, [2, 2], [], new Budget()), [
      [1, 0, 1, 0],
      [1, 0, 0, 1],
      [0, 1, 1, 0],
      [0, 1, 0, 1],
      [0.5, 0.5, 0.5, 0.5],
    ]);
  });

  it("zero-sum rock-paper-scissors: the centre is found although it is non-hyperbolic (Hofbauer and Sigmund 1998, Evolutionary Games and Population Dynamics)", () => {
    const field = vectorField(
      symmetricGame([
        [0, -1, 1],
        [1, 0, -1],
        [-1, 1, 0],
      ]),
      { kind: "replicator" },
    );
    const found = findRestPoints(field, [3], [Float64Array.from([0.3, 0.3, 0.4])], new Budget());
    expect(maxNormDistance(found[0] ?? [], [1 / 3, 1 / 3, 1 / 3])).toBeLessThan(1e-12);
    expect(found).toHaveLength(4); // the three vertices and the centre
  });
});

describe("findRestPoints: order, de-duplication, determinism", () => {
  const field = vectorField(symmetricGame(hawkDove), { kind: "replicator" });
  it("returns seeds' rest points first, in seed order, each only once", () => {
    const seeds = [Float64Array.from([0.6, 0.4]), Float64Array.from([0.99, 0.01]), Float64Array.from([0.7, 0.3])];
    const found = findRestPoints(field, [2], seeds, new Budget());
    expect(maxNormDistance(found[0] ?? [], [V / C, 1 - V / C])).toBeLessThan(1e-12);
    expect(found).toHaveLength(3);
    for (let i = 0; i < found.length; i++) {
      for (let j = i + 1; j < found.length; j++) {
        expect(maxNormDistance(found[i] ?? [], found[j] ?? [])).toBeGreaterThanOrEqual(DUPLICATE_DISTANCE);
      }
    }
  });
  it("polishes the seeds alone with maxStarts 0", () => {
    const found = findRestPoints(field, [2], [Float64Array.from([0.62, 0.38])], new Budget(), { maxStarts: 0 });
    expect(found).toHaveLength(1);
    expect(maxNormDistance(found[0] ?? [], [V / C, 1 - V / C])).toBeLessThan(1e-12);
  });
  it("gives identical results on repeated calls", () => {
    const a = findRestPoints(field, [2], [], new Budget()).map((p) => Array.from(p));
    const b = findRestPoints(field, [2], [], new Budget()).map((p) => Array.from(p));
    expect(a).toEqual(b);
  });
  it("returns a distinct point per start on a continuum of rest points (the caller decides what that means)", () => {
    const flat = vectorField(symmetricGame([[1, 1], [1, 1]]), { kind: "replicator" });
    expect(findRestPoints(flat, [2], [], new Budget()).length).toBeGreaterThan(2);
  });
});

describe("gridStarts", () => {
  it("is a deterministic list of points of the product of simplices, bounded in size", () => {
    for (const layout of [[2], [3], [5], [12], [24], [3, 3], [10, 10], [24, 24]]) {
      const starts = gridStarts(layout);
      expect(starts).toEqual(gridStarts(layout));
      expect(starts.length).toBeGreaterThan(1);
      expect(starts.length).toBeLessThanOrEqual(256);
      for (const s of starts) {
        let o = 0;
        for (const n of layout) {
          const block = Array.from(s.subarray(o, o + n));
          expect(Math.abs(block.reduce((a, v) => a + v, 0) - 1)).toBeLessThan(1e-12);
          expect(block.every((v) => v >= 0)).toBe(true);
          o += n;
        }
      }
    }
  });
  it("respects a small bound: 0 starts, or the barycentre alone", () => {
    expect(gridStarts([3], 0)).toEqual([]);
    expect(gridStarts([2, 3], 1).map((s) => Array.from(s))).toEqual([[1 / 2, 1 / 2, 1 / 3, 1 / 3, 1 / 3]]);
    expect(gridStarts([24], 30)).toHaveLength(30); // 24 vertices, the barycentre, 5 generated points
  });
  it("uses the lattice k/10 for two strategies, vertices included", () => {
    const starts = gridStarts([2]).map((s) => s[0] ?? NaN);
    expect(starts).toHaveLength(11);
    expect(starts[0]).toBe(1);
    expect(starts[10]).toBe(0);
    expect(starts[3]).toBeCloseTo(0.7, 15);
  });
});

describe("findRestPoints: refusals and the budget", () => {
  const field = vectorField(symmetricGame(hawkDove), { kind: "replicator" });
  it("refuses a layout or seeds that do not fit the field", () => {
    expect(() => findRestPoints(field, [3], [], new Budget())).toThrow(
      new RestPointSearchError("the block sizes [3] must be positive integers adding up to the dimension 2"),
    );
    expect(() => findRestPoints(field, [2], [Float64Array.from([1, 0, 0])], new Budget())).toThrow(
      "seed 0 has 3 components; the dynamics has 2",
    );
  });
  it("stops with BudgetExceeded when the wall clock runs out", () => {
    let clock = 0;
    const budget = new Budget({ wallClockMs: 3 }, () => (clock += 1));
    expect(() => findRestPoints(field, [2], [], budget)).toThrow(BudgetExceeded);
  });
});
