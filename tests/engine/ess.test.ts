import { describe, expect, it } from "vitest";
import { essSymmetric } from "@/lib/engine/ess";
import { symmetricNash } from "@/lib/engine/nash";
import { symmetricRestPoints } from "@/lib/engine/restpoints";
import { seededRandom } from "../support/close";

const A = (rows: number[][]): Float64Array => Float64Array.from(rows.flat());

/**
 * Brute-force reference from the definition (Maynard Smith 1982; Hofbauer & Sigmund 1998,
 * thm 6.4.1, from memory): x is an ESS iff x.Az > z.Az for all z != x near x. Samples z on
 * small spheres around x within the simplex; returns false as soon as one z does as well.
 */
function essBySampling(M: Float64Array, n: number, x: Float64Array, rnd: () => number, eps = 1e-3, samples = 20000): boolean {
  const z = new Float64Array(n);
  const Az = new Float64Array(n);
  for (let s = 0; s < samples; s++) {
    // a random point u of the simplex, concentrated on a random small face to reach boundary directions
    let sum = 0;
    for (let i = 0; i < n; i++) {
      const u = rnd() < 0.5 ? 0 : -Math.log(1 - rnd());
      z[i] = u;
      sum += u;
    }
    if (sum === 0) continue;
    let moved = 0;
    for (let i = 0; i < n; i++) {
      z[i] = (1 - eps) * (x[i] ?? 0) + (eps * (z[i] ?? 0)) / sum;
      moved = Math.max(moved, Math.abs((z[i] ?? 0) - (x[i] ?? 0)));
    }
    if (moved < eps * 1e-6) continue; // z = x is no mutant
    for (let i = 0; i < n; i++) {
      let t = 0;
      for (let j = 0; j < n; j++) t += (M[i * n + j] ?? 0) * (z[j] ?? 0);
      Az[i] = t;
    }
    let xAz = 0;
    let zAz = 0;
    for (let i = 0; i < n; i++) {
      xAz += (x[i] ?? 0) * (Az[i] ?? 0);
      zAz += (z[i] ?? 0) * (Az[i] ?? 0);
    }
    if (!(xAz - zAz > 1e-15)) return false;
  }
  return true;
}

describe("ESS: published closed forms", () => {
  it.each([
    [2, 3],
    [1, 4],
    [3, 5],
  ])("hawk-dove V = %d, C = %d: the mixture at hawk share V/C is an ESS and neither pure state is (Maynard Smith 1982)", (V, C) => {
    const M = A([
      [(V - C) / 2, V],
      [0, V / 2],
    ]);
    const x = Float64Array.from([V / C, 1 - V / C]);
    expect(essSymmetric(M, 2, x).ess).toBe(true);
    expect(essSymmetric(M, 2, Float64Array.from([1, 0])).ess).toBe(false);
    expect(essSymmetric(M, 2, Float64Array.from([0, 1])).ess).toBe(false);
  });

  it("hawk-dove with V > C: pure Hawk is a strict Nash equilibrium, hence an ESS", () => {
    const r = essSymmetric(A([[0.5, 3], [0, 1.5]]), 2, Float64Array.from([1, 0]), ["Hawk", "Dove"]);
    expect(r.ess).toBe(true);
    expect(r.reason).toBe("It is a strict Nash equilibrium: every other strategy earns less against Hawk.");
  });

  it.each([
    [2, 1, true],
    [1, 2, false],
    [1, 1, false],
  ])("rock-paper-scissors, win %d loss %d: the barycentre is an ESS iff a > b", (a, b, expected) => {
    // symmetric part of A has off-diagonal (a-b)/2, so y.Ay = -(a-b)/2 |y|^2 on the tangent space
    // (derived here; Hofbauer & Sigmund 1998 give the ESS condition a > b). Zero-sum: a neutral form, no ESS.
    const M = A([
      [0, -b, a],
      [a, 0, -b],
      [-b, a, 0],
    ]);
    const r = essSymmetric(M, 3, Float64Array.from([1 / 3, 1 / 3, 1 / 3]));
    expect(r.ess).toBe(expected);
    if (a === b) expect(r.reason).toMatch(/does exactly as well as the resident \(the payoff form has a zero direction on the support\)/);
    if (a < b) expect(r.reason).toMatch(/does better against itself than the resident does against it \(the payoff form is not negative on the support\)/);
    if (a > b) expect(r.reason).toMatch(/It is a regular ESS/);
  });

  it("Zeeman's game (from memory, Zeeman 1980): the asymptotically stable barycentre is no ESS, pure e1 is", () => {
    const M = A([
      [0, 6, -4],
      [-3, 0, 5],
      [-1, 3, 0],
    ]);
    // y = e1 - e3 gives y.Ay = 0 + 4 + 1 + 0 = 5 > 0 (derived here): the form is not negative.
    expect(essSymmetric(M, 3, Float64Array.from([1 / 3, 1 / 3, 1 / 3])).ess).toBe(false);
    expect(essSymmetric(M, 3, Float64Array.from([1, 0, 0])).ess).toBe(true);
  });

  it("a state that is not Nash is no ESS, naming the invader", () => {
    const r = essSymmetric(A([[0, 0], [1, 1]]), 2, Float64Array.from([1, 0]), ["Lurker", "Forager"]);
    expect(r.ess).toBe(false);
    expect(r.reason).toBe("It is not a Nash equilibrium: Forager earns 1 more than the population average, so it can invade.");
  });
});

describe("ESS: non-regular cases (an alternative best reply outside the support)", () => {
  it("pure e1 with a tying strategy that does worse against itself is an ESS", () => {
    // E(e1,e2) = 0 = E(e1,e1), and E(e1,e2) = 0 > E(e2,e2) = -1: Maynard Smith's second condition holds
    const r = essSymmetric(A([[0, 0], [0, -1]]), 2, Float64Array.from([1, 0]), ["a", "b"]);
    expect(r.ess).toBe(true);
    expect(r.alternativeBestReplies).toEqual([1]);
    expect(r.reason).toMatch(/non-regular case: b is an alternative best reply/);
  });

  it("pure e1 with a tying strategy that does better against itself is not", () => {
    const r = essSymmetric(A([[0, 0], [0, 1]]), 2, Float64Array.from([1, 0]), ["a", "b"]);
    expect(r.ess).toBe(false);
    expect(r.reason).toBe("A mutant using b (an alternative best reply outside the support) does better against itself than the resident does against it, so it is not evolutionarily stable.");
  });

  it("pure e1 with a tying strategy that does exactly as well against itself is not", () => {
    const r = essSymmetric(A([[0, 0], [0, 0]]), 2, Float64Array.from([1, 0]), ["a", "b"]);
    expect(r.ess).toBe(false);
    expect(r.reason).toMatch(/does exactly as well against itself/);
  });

  it("the cone, not the subspace: a form indefinite on the span but negative on the cone is an ESS", () => {
    // On the directions w2 (e2 - e1) + w3 (e3 - e1) the form is -w2^2 - 4 w2 w3 - w3^2: indefinite
    // (eigenvalues 1 and -3), yet negative for w >= 0, w != 0. A subspace test would say "no ESS".
    const M = A([
      [0, 0, 0],
      [0, -1, -2],
      [0, -2, -1],
    ]);
    const x = Float64Array.from([1, 0, 0]);
    const r = essSymmetric(M, 3, x);
    expect(r.ess).toBe(true);
    expect(r.alternativeBestReplies).toEqual([1, 2]);
    expect(essBySampling(M, 3, x, seededRandom(1))).toBe(true);
  });

  it("and its counterpart positive somewhere on the cone is not", () => {
    const M = A([
      [0, 0, 0],
      [0, -1, 2],
      [0, 2, -1],
    ]);
    const x = Float64Array.from([1, 0, 0]);
    expect(essSymmetric(M, 3, x).ess).toBe(false);
    expect(essBySampling(M, 3, x, seededRandom(2))).toBe(false);
  });

  it("a mixed ESS with an alternative best reply: decided through the Schur complement", () => {
    // Hawk-dove (V = 2, C = 3) at x = (2/3, 1/3) plus a third tactic that earns the same 1/3 there
    // ((2/3)(1/2) + (1/3)(0) = 1/3); whether it can invade depends on how it fares against itself.
    const x = Float64Array.from([2 / 3, 1 / 3, 0]);
    for (const [a33, expected] of [
      [-1, true],
      [2, false],
    ] as const) {
      const M = A([
        [-0.5, 2, 0],
        [0, 1, 0.5],
        [0.5, 0, a33],
      ]);
      expect(symmetricNash(M, 3, x).nash).toBe(true);
      const r = essSymmetric(M, 3, x);
      expect(r.alternativeBestReplies).toEqual([2]);
      expect(r.ess).toBe(expected);
      expect(essBySampling(M, 3, x, seededRandom(3))).toBe(expected);
    }
  });

  it("several identical alternative best replies: a singular face of the copositivity test is still decided", () => {
    const M = A([
      [0, 0, 0, 0],
      [0, -1, -1, -1],
      [0, -1, -1, -1],
      [0, -1, -1, -1],
    ]);
    expect(essSymmetric(M, 4, Float64Array.from([1, 0, 0, 0])).ess).toBe(true);
  });
});

describe("ESS: limits", () => {
  it("more than 16 alternative best replies leave the test undecided, saying why", () => {
    const n = 18;
    const r = essSymmetric(new Float64Array(n * n), n, Float64Array.from({ length: n }, (_, i) => (i === 0 ? 1 : 0)));
    expect(r.ess).toBeNull();
    expect(r.reason).toBe("17 strategies outside the support are alternative best replies; the engine decides at most 16.");
  });
});

describe("ESS: random games against the definition", () => {
  it("agrees with sampling at every Nash rest point of 60 random games", () => {
    const rnd = seededRandom(31);
    let essCount = 0;
    let nonEss = 0;
    for (let trial = 0; trial < 60; trial++) {
      const n = 3 + (trial % 3);
      const M = Float64Array.from({ length: n * n }, () => rnd());
      for (const p of symmetricRestPoints(M, n).points) {
        if (!symmetricNash(M, n, p.state).nash) continue;
        const ours = essSymmetric(M, n, p.state).ess;
        expect(ours).toBe(essBySampling(M, n, p.state, seededRandom(trial), 1e-3, 4000));
        if (ours) essCount++;
        else nonEss++;
      }
    }
    expect(essCount).toBeGreaterThan(20);
    expect(nonEss).toBeGreaterThan(3);
  });
});
