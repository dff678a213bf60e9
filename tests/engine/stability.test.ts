import { describe, expect, it } from "vitest";
import { vectorField } from "@/lib/engine/dynamics";
import { bimatrixRestPoints } from "@/lib/engine/restpoints";
import { classify, classifyRestPoint, NONHYPERBOLIC_BAND, restrictedJacobian } from "@/lib/engine/stability";
import type { CompiledGame } from "@/lib/engine/types";
import { expectClose, seededRandom } from "../support/close";

function symmetric(rows: number[][]): CompiledGame {
  const n = rows.length;
  return { kind: "symmetric", n, strategies: rows.map((_, i) => `s${i}`), A: Float64Array.from(rows.flat()) };
}

function stabilityAt(game: CompiledGame, x: number[]) {
  const f = vectorField(game, { kind: "replicator" });
  const J = new Float64Array(f.dim * f.dim);
  f.jacobian(Float64Array.from(x), J);
  return classifyRestPoint(J, game.kind === "symmetric" ? [game.n] : [game.m, game.k]);
}

/** Generalized rock-paper-scissors: a win pays a, a loss costs b (rock beats scissors, loses to paper). */
function rps(a: number, b: number): CompiledGame {
  return symmetric([
    [0, -b, a],
    [a, 0, -b],
    [-b, a, 0],
  ]);
}

const third = [1 / 3, 1 / 3, 1 / 3];

describe("generalized rock-paper-scissors (Hofbauer & Sigmund 1998, sect. 7.7)", () => {
  // Restricted eigenvalues at the barycentre: (b - a)/6 +- i sqrt(3)(a + b)/6. Sign convention
  // checked here by hand: at x = (1/3,1/3,1/3) the restricted Jacobian is (1/3) P A on the
  // tangent space; A is circulant with first row (0, -b, a), whose eigenvalue on omega = e^{2 pi i/3}
  // is -b omega + a omega^2 = (b - a)/2 - i sqrt(3)(a + b)/2. So a > b (wins larger than losses) is stable.
  it.each([
    [2, 1],
    [3, 0.5],
    [1, 2],
    [0.5, 4],
  ])("a = %d, b = %d: eigenvalues and stability", (a, b) => {
    const st = stabilityAt(rps(a, b), third);
    expect(st.eigenvalues).toHaveLength(2);
    const [first, second] = st.eigenvalues;
    expectClose(first?.[0] ?? Number.NaN, (b - a) / 6, 1e-12, 1e-14);
    expectClose(second?.[0] ?? Number.NaN, (b - a) / 6, 1e-12, 1e-14);
    expectClose(first?.[1] ?? Number.NaN, (Math.sqrt(3) * (a + b)) / 6, 1e-12, 1e-14);
    expectClose(second?.[1] ?? Number.NaN, (-Math.sqrt(3) * (a + b)) / 6, 1e-12, 1e-14);
    expect(st.stability).toBe(a > b ? "asymptotically-stable" : "unstable");
  });

  it("zero-sum case a = b is a centre: non-hyperbolic", () => {
    const st = stabilityAt(rps(1, 1), third);
    expect(st.stability).toBe("non-hyperbolic");
    for (const [re] of st.eigenvalues) expect(Math.abs(re)).toBeLessThanOrEqual(NONHYPERBOLIC_BAND * st.scale);
  });
});

describe("hawk-dove interior rest point (Maynard Smith 1982)", () => {
  // Eigenvalue derived here: with x the hawk share, dx/dt = x(1-x)(f_H - f_D), where
  // f_H = x(V-C)/2 + (1-x)V and f_D = (1-x)V/2, so f_H - f_D = (V - C x)/2; at x* = V/C the
  // derivative is -x*(1-x*) C/2 = -V(C-V)/(2C).
  it.each([
    [2, 3],
    [1, 4],
    [3, 10],
  ])("V = %d, C = %d", (V, C) => {
    const game = symmetric([
      [(V - C) / 2, V],
      [0, V / 2],
    ]);
    const st = stabilityAt(game, [V / C, 1 - V / C]);
    expect(st.stability).toBe("asymptotically-stable");
    expectClose(st.eigenvalues[0]?.[0] ?? Number.NaN, (-V * (C - V)) / (2 * C), 1e-12, 1e-14);
  });
});

describe("a 3x3 game whose interior rest point is asymptotically stable but not an ESS (Zeeman 1980)", () => {
  // Matrix from memory (Zeeman 1980, also Hofbauer & Sigmund 1998): each row sums to 2, so the
  // barycentre is a rest point. Derived by hand in the basis e1 - e3, e2 - e3: the restricted
  // Jacobian is (1/9)[[17, 22], [-19, -23]], trace -2/3, determinant 1/3, so the eigenvalues are
  // -1/3 +- i sqrt(2)/3. (The ESS half of this example is in ess.test.ts.)
  it("has eigenvalues -1/3 +- i sqrt(2)/3", () => {
    const st = stabilityAt(
      symmetric([
        [0, 6, -4],
        [-3, 0, 5],
        [-1, 3, 0],
      ]),
      third,
    );
    expect(st.stability).toBe("asymptotically-stable");
    expectClose(st.eigenvalues[0]?.[0] ?? Number.NaN, -1 / 3, 1e-12, 1e-14);
    expectClose(st.eigenvalues[0]?.[1] ?? Number.NaN, Math.sqrt(2) / 3, 1e-12, 1e-14);
    expectClose(st.eigenvalues[1]?.[1] ?? Number.NaN, -Math.sqrt(2) / 3, 1e-12, 1e-14);
  });
});

describe("two populations: interior rest points are never asymptotically stable (Hofbauer & Sigmund 1998, sect. 10.4)", () => {
  it("holds on 300 random bimatrix games of sizes 2x2 to 4x4, and the restricted trace is 0", () => {
    const rnd = seededRandom(99);
    let interior = 0;
    for (let trial = 0; trial < 300; trial++) {
      const m = 2 + (trial % 3);
      const k = m;
      const A = Float64Array.from({ length: m * k }, () => rnd());
      const B = Float64Array.from({ length: k * m }, () => rnd());
      const game: CompiledGame = { kind: "bimatrix", m, k, populations: [{ name: "p", strategies: [] }, { name: "q", strategies: [] }], A, B };
      const set = bimatrixRestPoints(A, B, m, k);
      for (const p of set.points) {
        if (p.support.length !== m + k) continue;
        interior++;
        const st = stabilityAt(game, Array.from(p.state));
        expect(st.stability).not.toBe("asymptotically-stable");
        const trace = st.eigenvalues.reduce((s, [re]) => s + re, 0);
        expect(Math.abs(trace)).toBeLessThan(1e-9 * Math.max(1, st.scale));
      }
    }
    expect(interior).toBeGreaterThan(30);
  });
});

describe("classification band", () => {
  it("counts real parts within 1e-7 of the scale as zero", () => {
    expect(NONHYPERBOLIC_BAND).toBe(1e-7);
    expect(classify([[-0.5e-7, 1], [-0.5e-7, -1]], 1)).toBe("non-hyperbolic");
    expect(classify([[-2e-7, 1], [-2e-7, -1]], 1)).toBe("asymptotically-stable");
    expect(classify([[2e-7, 0], [-1, 0]], 1)).toBe("unstable");
    // the band scales with the matrix: 1e-5 is inside it when the entries are near 1000
    expect(classify([[-1e-5, 0]], 1000)).toBe("non-hyperbolic");
    // a zero eigenvalue with a positive one is reported non-hyperbolic, as the format asks
    expect(classify([[1, 0], [0, 0]], 1)).toBe("non-hyperbolic");
  });

  it("restricts a Jacobian to the tangent space of a product of simplices", () => {
    // A linear field that maps tangent vectors to tangent vectors: J = I - (1/n) 11^T per block
    // (on tangent vectors it is the identity, so every restricted eigenvalue is 1).
    const layout = [2, 3];
    const J = new Float64Array(25);
    let o = 0;
    for (const s of layout) {
      for (let i = 0; i < s; i++) for (let j = 0; j < s; j++) J[(o + i) * 5 + o + j] = (i === j ? 1 : 0) - 1 / s;
      o += s;
    }
    const { R, size } = restrictedJacobian(J, layout);
    expect(size).toBe(3);
    const st = classifyRestPoint(J, layout);
    expect(st.eigenvalues.map(([re, im]) => [Number(re.toFixed(12)), Math.abs(im)])).toEqual([
      [1, 0],
      [1, 0],
      [1, 0],
    ]);
    expect(R).toHaveLength(9);
    expect(st.stability).toBe("unstable");
  });
});
