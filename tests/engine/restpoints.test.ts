import { describe, expect, it } from "vitest";
import { lusolve } from "mathjs";
import { vectorField } from "@/lib/engine/dynamics";
import { bimatrixRestPoints, restPointOnSupport, symmetricRestPoints } from "@/lib/engine/restpoints";
import { expectAllClose, seededRandom } from "../support/close";

const sorted = (points: { state: Float64Array }[]): number[][] =>
  points.map((p) => Array.from(p.state, (v) => Number(v.toFixed(12)))).sort((a, b) => {
    for (let i = 0; i < a.length; i++) if ((a[i] ?? 0) !== (b[i] ?? 0)) return (b[i] ?? 0) - (a[i] ?? 0);
    return 0;
  });

describe("symmetric support enumeration", () => {
  it("hawk-dove: the two pure states and the mixture at hawk share V/C (Maynard Smith 1982)", () => {
    const V = 2;
    const C = 5;
    const set = symmetricRestPoints(Float64Array.from([(V - C) / 2, V, 0, V / 2]), 2);
    expect(set.continua).toEqual([]);
    expect(sorted(set.points)).toEqual([
      [1, 0],
      [0.4, 0.6],
      [0, 1],
    ]);
  });

  it("rock-paper-scissors: three vertices and the barycentre, nothing on the edges", () => {
    const set = symmetricRestPoints(Float64Array.from([0, -1, 2, 2, 0, -1, -1, 2, 0]), 3);
    expect(set.points).toHaveLength(4);
    const interior = set.points.find((p) => p.support.length === 3);
    expectAllClose(interior?.state ?? [], [1 / 3, 1 / 3, 1 / 3], 1e-14, 1e-15);
  });

  it("reports a continuum when two strategies are identical, never a count", () => {
    // strategies 0 and 1 earn the same against everything: the whole edge between them is at rest
    const set = symmetricRestPoints(Float64Array.from([1, 1, 0, 1, 1, 0, 0, 0, 2]), 3);
    expect(set.continua).toContainEqual([0, 1]);
  });

  it("reports continua for the zero game, where every state is at rest", () => {
    const set = symmetricRestPoints(new Float64Array(9), 3);
    expect([...set.continua].sort((a, b) => a.length - b.length || String(a).localeCompare(String(b)))).toEqual([[0, 1], [0, 2], [1, 2], [0, 1, 2]]);
    expect(set.points).toHaveLength(3);
  });

  it("treats a singular but inconsistent face as empty", () => {
    // row 2 = row 1 + 1: strategy 2 always earns 1 more, so no rest point on the edge
    const set = symmetricRestPoints(Float64Array.from([0, 1, 1, 2]), 2);
    expect(set.continua).toEqual([]);
    expect(set.undecided).toEqual([]);
    expect(sorted(set.points)).toEqual([
      [1, 0],
      [0, 1],
    ]);
  });

  it("agrees with an independent solve by mathjs lusolve on every support of random games", () => {
    const rnd = seededRandom(5);
    for (let trial = 0; trial < 20; trial++) {
      const n = 3 + (trial % 4);
      const A = Float64Array.from({ length: n * n }, () => rnd());
      const ours = symmetricRestPoints(A, n);
      const ref: number[][] = [];
      for (let mask = 1; mask < 2 ** n; mask++) {
        const S = Array.from({ length: n }, (_, i) => i).filter((i) => (mask >> i) & 1);
        const s = S.length;
        const M = S.map((i) => [...S.map((j) => A[i * n + j] ?? 0), -1]);
        M.push([...S.map(() => 1), 0]);
        const b = [...S.map(() => 0), 1];
        const z = (lusolve(M, b) as number[][]).map((r) => r[0] ?? Number.NaN);
        if (z.slice(0, s).every((v) => v > 1e-12)) {
          const x = new Array<number>(n).fill(0);
          S.forEach((i, a) => {
            x[i] = z[a] ?? 0;
          });
          ref.push(x);
        }
      }
      expect(sorted(ours.points).length).toBe(ref.length);
      const refSorted = sorted(ref.map((x) => ({ state: Float64Array.from(x) })));
      sorted(ours.points).forEach((x, i) => expectAllClose(x, refSorted[i] ?? [], 1e-9, 1e-11));
    }
  });

  it("bordered factors and fresh pivoted solves agree on random games of 10 to 14 strategies", () => {
    // the enumeration extends LU factors without pivoting; compare with a plain pivoted solve
    // of every support (mathjs lusolve is too slow for 2^14 supports, so this uses our own).
    const rnd = seededRandom(23);
    for (const n of [10, 12, 14]) {
      const A = Float64Array.from({ length: n * n }, () => rnd());
      const ours = sorted(symmetricRestPoints(A, n).points);
      const ref: { state: Float64Array }[] = [];
      for (let mask = 1; mask < 2 ** n; mask++) {
        const S = Array.from({ length: n }, (_, i) => i).filter((i) => (mask >> i) & 1);
        const r = restPointOnSupport({ kind: "symmetric", n, A }, S);
        if (r.kind === "point") ref.push({ state: r.state });
      }
      expect(ours.length).toBe(ref.length);
      const rs = sorted(ref);
      ours.forEach((x, i) => expectAllClose(x, rs[i] ?? [], 1e-8, 1e-10));
    }
  });

  it("bordered factors and fresh solves agree on degenerate integer games (many ties and singular faces)", () => {
    const rnd = seededRandom(29);
    for (let trial = 0; trial < 30; trial++) {
      const n = 5 + (trial % 5);
      const A = Float64Array.from({ length: n * n }, () => Math.floor(rnd() * 3));
      const ours = symmetricRestPoints(A, n);
      const ref: { state: Float64Array }[] = [];
      const refContinua: string[] = [];
      for (let mask = 1; mask < 2 ** n; mask++) {
        const S = Array.from({ length: n }, (_, i) => i).filter((i) => (mask >> i) & 1);
        const r = restPointOnSupport({ kind: "symmetric", n, A }, S);
        if (r.kind === "point") ref.push({ state: r.state });
        else if (r.kind !== "none") refContinua.push(`${r.kind}:${S.join(",")}`);
      }
      const oursFaces = [...ours.continua.map((f) => `continuum:${f.join(",")}`), ...ours.undecided.map((f) => `undecided:${f.join(",")}`)];
      expect(oursFaces.sort(), `trial ${trial}`).toEqual(refContinua.sort());
      const a = sorted(ours.points);
      const b = sorted(ref);
      expect(a.length, `trial ${trial}`).toBe(b.length);
      a.forEach((x, i) => expectAllClose(x, b[i] ?? [], 1e-9, 1e-11));
    }
  });

  it("finds only true rest points: the replicator field vanishes at each", () => {
    const rnd = seededRandom(17);
    const n = 8;
    const A = Float64Array.from({ length: n * n }, () => rnd());
    const field = vectorField({ kind: "symmetric", n, strategies: [], A }, { kind: "replicator" });
    const out = new Float64Array(n);
    const set = symmetricRestPoints(A, n);
    expect(set.points.length).toBeGreaterThan(8);
    for (const p of set.points) {
      field.rhs(p.state, out);
      for (const v of out) expect(Math.abs(v)).toBeLessThan(1e-13);
      expect(Math.abs(p.state.reduce((s, v) => s + v, 0) - 1)).toBeLessThan(1e-13);
    }
  });

  it("refuses games beyond 20 strategies", () => {
    expect(() => symmetricRestPoints(new Float64Array(21 * 21), 21)).toThrow(/limited to 20 strategies/);
  });

  it("solves a single face exactly", () => {
    const r = restPointOnSupport({ kind: "symmetric", n: 3, A: Float64Array.from([0, -1, 2, 2, 0, -1, -1, 2, 0]) }, [0, 1, 2]);
    expect(r.kind).toBe("point");
    if (r.kind === "point") expectAllClose(r.state, [1 / 3, 1 / 3, 1 / 3], 1e-14, 1e-15);
    expect(restPointOnSupport({ kind: "symmetric", n: 2, A: new Float64Array(4) }, [0, 1]).kind).toBe("continuum");
  });
});

describe("two-population support enumeration", () => {
  it("an inspection game: four vertices and one interior point", () => {
    // buyers inspect/trust against sellers honest/cheat, in our own numbers; the interior point
    // makes each population indifferent: y_honest = 1/2 from A, x_inspect = 2/3 from B.
    const A = Float64Array.from([1, 0, 2, -1]); // buyers: inspect (1 vs honest, 0 vs cheat), trust (2, -1)
    const B = Float64Array.from([1, 1, 0, 3]); // sellers: honest (1 vs inspect, 1 vs trust), cheat (0, 3)
    const set = bimatrixRestPoints(A, B, 2, 2);
    expect(set.continua).toEqual([]);
    expect(set.points).toHaveLength(5);
    const interior = set.points.find((p) => p.support.length === 4);
    expectAllClose(interior?.state ?? [], [2 / 3, 1 / 3, 1 / 2, 1 / 2], 1e-14, 1e-15);
  });

  it("agrees with an independent solve by mathjs lusolve on random games (generic: equal support sizes only)", () => {
    const rnd = seededRandom(41);
    const subsets = (n: number): number[][] => Array.from({ length: 2 ** n - 1 }, (_, mask) => Array.from({ length: n }, (_, i) => i).filter((i) => ((mask + 1) >> i) & 1));
    const solve = (P: Float64Array, pCols: number, rowsIdx: number[], colsIdx: number[]): number[] | null => {
      const M = rowsIdx.map((i) => [...colsIdx.map((j) => P[i * pCols + j] ?? 0), -1]);
      M.push([...colsIdx.map(() => 1), 0]);
      const z = (lusolve(M, [...rowsIdx.map(() => 0), 1]) as number[][]).map((r) => r[0] ?? Number.NaN);
      return z.slice(0, colsIdx.length).every((v) => v > 1e-12) ? z.slice(0, colsIdx.length) : null;
    };
    for (let trial = 0; trial < 12; trial++) {
      const m = 2 + (trial % 3);
      const k = 2 + ((trial + 1) % 3);
      const A = Float64Array.from({ length: m * k }, () => rnd());
      const B = Float64Array.from({ length: k * m }, () => rnd());
      const ref: number[][] = [];
      for (const S1 of subsets(m)) {
        for (const S2 of subsets(k)) {
          if (S1.length !== S2.length) continue;
          const x = solve(B, m, S2, S1);
          const y = solve(A, k, S1, S2);
          if (x === null || y === null) continue;
          const state = new Array<number>(m + k).fill(0);
          S1.forEach((i, a) => {
            state[i] = x[a] ?? 0;
          });
          S2.forEach((j, a) => {
            state[m + j] = y[a] ?? 0;
          });
          ref.push(state);
        }
      }
      const ours = bimatrixRestPoints(A, B, m, k);
      expect(ours.continua).toEqual([]);
      const a = sorted(ours.points);
      const b = sorted(ref.map((x) => ({ state: Float64Array.from(x) })));
      expect(a.length).toBe(b.length);
      a.forEach((x, i) => expectAllClose(x, b[i] ?? [], 1e-9, 1e-11));
    }
  });

  it("reports a continuum when a population's payoffs do not depend on its own choice", () => {
    // population 2 is indifferent everywhere (B constant), population 1 strictly prefers strategy 0
    const set = bimatrixRestPoints(Float64Array.from([1, 1, 0, 0]), Float64Array.from([0, 0, 0, 0]), 2, 2);
    expect(set.continua).toContainEqual([0, 2, 3]);
  });

  it("refuses games beyond 20 strategies in all", () => {
    expect(() => bimatrixRestPoints(new Float64Array(121), new Float64Array(121), 11, 11)).toThrow(/limited to 20 strategies in all/);
  });
});
