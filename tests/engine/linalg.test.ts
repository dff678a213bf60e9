import { describe, expect, it } from "vitest";
import { eigs, lusolve } from "mathjs";
import { eigenvalues, eigenvaluesByMlMatrix, solveGeneral, solveInPlace, symmetricEigenvalues } from "@/lib/engine/linalg";
import { expectClose, seededRandom } from "../support/close";

function randomMatrix(n: number, rnd: () => number): Float64Array {
  return Float64Array.from({ length: n * n }, () => 2 * rnd() - 1);
}

function rows(M: Float64Array, n: number): number[][] {
  return Array.from({ length: n }, (_, i) => Array.from(M.subarray(i * n, i * n + n)));
}

/** mathjs eigs values as [re, im] pairs (it returns numbers for real and Complex for complex eigenvalues). */
function mathjsEigenvalues(M: Float64Array, n: number): [number, number][] {
  const values = eigs(rows(M, n)).values as unknown;
  const list = Array.isArray(values) ? values : (values as { toArray(): unknown[] }).toArray();
  return list.map((v) => (typeof v === "number" ? [v, 0] : [(v as { re: number }).re, (v as { im: number }).im]));
}

describe("solveInPlace (Gaussian elimination with partial pivoting)", () => {
  it("agrees with mathjs lusolve on random systems", () => {
    const rnd = seededRandom(7);
    for (let trial = 0; trial < 50; trial++) {
      const n = 2 + (trial % 9);
      const M = randomMatrix(n, rnd);
      const b = Float64Array.from({ length: n }, () => rnd());
      const ref = (lusolve(rows(M, n), Array.from(b)) as number[][]).map((r) => r[0] ?? Number.NaN);
      const x = b.slice();
      expect(solveInPlace(M.slice(), x, n, 1e-14)).toBe(true);
      ref.forEach((v, i) => expectClose(x[i] ?? Number.NaN, v, 1e-8, 1e-10, `trial ${trial} x[${i}]`));
    }
  });

  it("needs pivoting where the leading entry is zero", () => {
    const x = Float64Array.from([2, 3]);
    expect(solveInPlace(Float64Array.from([0, 1, 1, 0]), x, 2, 1e-14)).toBe(true);
    expect(Array.from(x)).toEqual([3, 2]);
  });

  it("reports a singular matrix", () => {
    expect(solveInPlace(Float64Array.from([1, 2, 2, 4]), Float64Array.from([1, 2]), 2, 1e-12)).toBe(false);
  });
});

describe("solveGeneral (rank-revealing)", () => {
  it("gives rank, a particular solution and the null space of a consistent singular system", () => {
    // x + y + z = 1 twice: rank 1, null space of dimension 2.
    const sol = solveGeneral(Float64Array.from([1, 1, 1, 1, 1, 1]), Float64Array.from([1, 1]), 2, 3, 1e-12);
    expect(sol.consistent).toBe(true);
    expect(sol.rank).toBe(1);
    expect(sol.nullSpace).toHaveLength(2);
    expect(Array.from(sol.particular)).toEqual([1, 0, 0]);
    for (const v of sol.nullSpace) expectClose((v[0] ?? 0) + (v[1] ?? 0) + (v[2] ?? 0), 0, 0, 1e-15);
  });

  it("detects an inconsistent system", () => {
    const sol = solveGeneral(Float64Array.from([1, 1, 1, 1]), Float64Array.from([0, 1]), 2, 2, 1e-12);
    expect(sol.consistent).toBe(false);
    expect(sol.rank).toBe(1);
  });

  it("solves a rectangular full-rank system exactly", () => {
    // 3 equations, 2 unknowns, consistent: x = 1, y = 2.
    const sol = solveGeneral(Float64Array.from([1, 0, 0, 1, 1, 1]), Float64Array.from([1, 2, 3]), 3, 2, 1e-12);
    expect(sol.consistent).toBe(true);
    expect(Array.from(sol.particular)).toEqual([1, 2]);
    expect(sol.nullSpace).toHaveLength(0);
  });
});

describe("eigenvalues: ml-matrix's decomposition against mathjs eigs (a second, independent package)", () => {
  it("agree on random matrices of sizes 2 to 12, complex pairs included", () => {
    // mathjs's eigs does not converge on about a quarter of random non-symmetric matrices
    // (it throws); those are skipped, and at least 200 comparisons must remain.
    const rnd = seededRandom(2026);
    let complexSeen = 0;
    let compared = 0;
    for (let trial = 0; trial < 300; trial++) {
      const n = 2 + (trial % 11);
      const M = randomMatrix(n, rnd);
      const ours = eigenvalues(M, n);
      let ref: [number, number][];
      try {
        ref = mathjsEigenvalues(M, n);
      } catch {
        continue;
      }
      compared++;
      expect(ours).toHaveLength(n);
      const used = new Set<number>();
      for (const [re, im] of ours) {
        if (im !== 0) complexSeen++;
        let best = -1;
        let bestD = Infinity;
        ref.forEach(([r2, i2], j) => {
          if (used.has(j)) return;
          const d = Math.hypot(re - r2, im - i2);
          if (d < bestD) {
            bestD = d;
            best = j;
          }
        });
        used.add(best);
        expect(bestD, `trial ${trial}`).toBeLessThan(1e-7);
      }
    }
    expect(compared).toBeGreaterThanOrEqual(200);
    expect(complexSeen).toBeGreaterThan(100);
  });

  it("symmetric eigenvalues agree with mathjs and come sorted ascending", () => {
    const rnd = seededRandom(11);
    for (let trial = 0; trial < 50; trial++) {
      const n = 2 + (trial % 7);
      const R = randomMatrix(n, rnd);
      const S = new Float64Array(n * n);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) S[i * n + j] = (R[i * n + j] ?? 0) + (R[j * n + i] ?? 0);
      const ours = symmetricEigenvalues(S, n);
      const ref = mathjsEigenvalues(S, n).map(([re]) => re).sort((a, b) => a - b);
      ours.forEach((v, i) => expectClose(v, ref[i] ?? Number.NaN, 1e-9, 1e-10));
      for (let i = 1; i < n; i++) expect(ours[i] ?? 0).toBeGreaterThanOrEqual(ours[i - 1] ?? 0);
    }
  });

  it("our Hessenberg-QR agrees with ml-matrix's decomposition on random and structured matrices up to 24 x 24", () => {
    const rnd = seededRandom(4);
    const cases: [Float64Array, number][] = [];
    for (let trial = 0; trial < 120; trial++) {
      const n = 2 + (trial % 23);
      cases.push([randomMatrix(n, rnd), n]);
    }
    const zero = new Float64Array(16);
    const identity = Float64Array.from({ length: 16 }, (_, i) => (i % 5 === 0 ? 1 : 0));
    const jordan = Float64Array.from([2, 1, 0, 0, 2, 1, 0, 0, 2]);
    const triangular = Float64Array.from([1, 5, 7, 0, -2, 3, 0, 0, 4]);
    const rotation = Float64Array.from([0, -1, 1, 0]);
    cases.push([zero, 4], [identity, 4], [jordan, 3], [triangular, 3], [rotation, 2]);
    for (const [M, n] of cases) {
      const ours = eigenvalues(M, n);
      const ref = eigenvaluesByMlMatrix(M, n);
      const used = new Set<number>();
      for (const [re, im] of ours) {
        let best = -1;
        let bestD = Infinity;
        ref.forEach(([r2, i2], j) => {
          if (used.has(j)) return;
          const d = Math.hypot(re - r2, im - i2);
          if (d < bestD) {
            bestD = d;
            best = j;
          }
        });
        used.add(best);
        // a Jordan block of size 3 turns rounding of 1e-16 into eigenvalue errors near 1e-5
        expect(bestD).toBeLessThan(M === jordan ? 1e-4 : 1e-8);
      }
    }
    expect(eigenvalues(rotation, 2)).toEqual([[0, 1], [0, -1]]);
  });

  it("handles 1 x 1 and empty matrices", () => {
    expect(eigenvalues(Float64Array.from([-2]), 1)).toEqual([[-2, 0]]);
    expect(eigenvalues(new Float64Array(0), 0)).toEqual([]);
    expect(symmetricEigenvalues(new Float64Array(0), 0)).toEqual([]);
  });
});
