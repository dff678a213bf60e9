import { describe, expect, it } from "vitest";
import { Budget } from "@/lib/engine/budget";
import { vectorField, type VectorField } from "@/lib/engine/dynamics";
import { integrate, IntegrationInputError, type IntegrationOptions } from "@/lib/engine/integrate";
import type { DynamicsSpec } from "@/lib/engine/types";
import {
  bimatrixGame,
  cashKarpAt,
  maxNormDistance,
  naiveBimatrix,
  naiveSymmetric,
  symmetricGame,
} from "@/tests/support/ode-reference";

function options(over: Partial<IntegrationOptions> & { layout: number[] }): IntegrationOptions {
  return {
    duration: 10,
    samples: 11,
    relativeTolerance: 1e-10,
    absoluteTolerance: 1e-12,
    budget: new Budget(),
    ...over,
  };
}

/** A hand-made field on R^dim (not from a game), for the failure paths. */
function customField(dim: number, rhs: (x: Float64Array, out: Float64Array) => void): VectorField {
  return { dim, rhs, jacobian: (_x, out) => out.fill(0) };
}

describe("integrate: published closed forms and invariants", () => {
  it("donation game: the cooperators' share follows x(t) = x0 e^{-ct} / (1 - x0 + x0 e^{-ct}) at samples and at arbitrary query times", () => {
    // Donation game (benefit b, cost c): cooperation pays -c relative to defection against
    // anyone, so x' = -c x (1 - x), a logistic equation (Nowak 2006, Evolutionary Dynamics; Sigmund 2010, The Calculus of Selfishness; from memory).
    // The closed form is that of the logistic equation.
    const b = 3;
    const c = 0.8;
    const game = symmetricGame([
      [b - c, -c],
      [b, 0],
    ]);
    const x0 = 0.9;
    const exact = (t: number): number => (x0 * Math.exp(-c * t)) / (1 - x0 + x0 * Math.exp(-c * t));
    const queryTimes = Array.from({ length: 400 }, (_, i) => 0.0371 * i * i * 0.01 + 0.013 * i); // irregular, inside [0, 30]
    const T = 30;
    const result = integrate(vectorField(game, { kind: "replicator" }), Float64Array.from([x0, 1 - x0]), {
      ...options({ layout: [2] }),
      duration: T,
      samples: 61,
      queryTimes: queryTimes.filter((t) => t <= T),
    });
    expect(result.error).toBeUndefined();
    expect(result.times).toHaveLength(61);
    result.times.forEach((t, i) => expect(t).toBeCloseTo((T * i) / 60, 12));
    expect(result.times[60]).toBe(T);
    result.states.forEach((s, i) => {
      const t = result.times[i] ?? 0;
      expect(Math.abs((s[0] ?? 0) - exact(t))).toBeLessThan(1e-9);
      expect(Math.abs((s[0] ?? 0) + (s[1] ?? 0) - 1)).toBeLessThan(1e-13);
    });
    const asked = queryTimes.filter((t) => t <= T);
    expect(result.queries).toHaveLength(asked.length);
    let worst = 0;
    result.queries.forEach((s, i) => {
      worst = Math.max(worst, Math.abs((s[0] ?? 0) - exact(asked[i] ?? 0)));
    });
    expect(worst).toBeLessThan(1e-9);
  });

  it("queries come back in the order given, including t = 0 and t = T", () => {
    const c = 1;
    const game = symmetricGame([
      [2 - c, -c],
      [2, 0],
    ]);
    const exact = (t: number): number => (0.5 * Math.exp(-c * t)) / (0.5 + 0.5 * Math.exp(-c * t));
    const asked = [5, 0, 2.5, 5, 0.001, 4.999];
    const result = integrate(vectorField(game, { kind: "replicator" }), Float64Array.from([0.5, 0.5]), {
      ...options({ layout: [2] }),
      duration: 5,
      samples: 2,
      queryTimes: asked,
    });
    expect(result.error).toBeUndefined();
    asked.forEach((t, i) => expect(result.queries[i]?.[0] ?? NaN).toBeCloseTo(exact(t), 9));
  });

  it("zero-sum rock-paper-scissors: x1 x2 x3 is conserved along orbits over T = 1000 (Hofbauer and Sigmund 1998, Evolutionary Games and Population Dynamics)", () => {
    const rps = symmetricGame([
      [0, -1, 1],
      [1, 0, -1],
      [-1, 1, 0],
    ]);
    const x0 = [0.5, 0.3, 0.2];
    const product0 = 0.5 * 0.3 * 0.2;
    const result = integrate(vectorField(rps, { kind: "replicator" }), Float64Array.from(x0), {
      ...options({ layout: [3] }),
      duration: 1000,
      samples: 1001,
    });
    expect(result.error).toBeUndefined();
    let worst = 0;
    for (const s of result.states) {
      worst = Math.max(worst, Math.abs((s[0] ?? 0) * (s[1] ?? 0) * (s[2] ?? 0) - product0) / product0);
    }
    expect(worst).toBeLessThan(1e-7);
    // and the orbit really moves (a centre, not a rest point)
    expect(Math.max(...result.states.map((s) => maxNormDistance(s, x0)))).toBeGreaterThan(0.1);
  });

  it("generalized rock-paper-scissors with win 2 > loss 1: x1 x2 x3 increases towards 1/27 (Hofbauer and Sigmund 1998, Evolutionary Games and Population Dynamics)", () => {
    const rps = symmetricGame([
      [0, -1, 2],
      [2, 0, -1],
      [-1, 2, 0],
    ]);
    const result = integrate(vectorField(rps, { kind: "replicator" }), Float64Array.from([0.8, 0.15, 0.05]), {
      ...options({ layout: [3] }),
      duration: 200,
      samples: 201,
    });
    expect(result.error).toBeUndefined();
    const products = result.states.map((s) => (s[0] ?? 0) * (s[1] ?? 0) * (s[2] ?? 0));
    for (let i = 1; i < products.length; i++) expect(products[i] ?? 0).toBeGreaterThanOrEqual((products[i - 1] ?? 0) - 1e-15);
    expect(maxNormDistance(result.states[200] ?? [], [1 / 3, 1 / 3, 1 / 3])).toBeLessThan(1e-6);
  });

  it("hawk-dove to T = 1e6: ends at the hawk share V/C (Maynard Smith 1982) within the default step budget", () => {
    const V = 2;
    const C = 3;
    const game = symmetricGame([
      [(V - C) / 2, V],
      [0, V / 2],
    ]);
    const budget = new Budget();
    const result = integrate(vectorField(game, { kind: "replicator" }), Float64Array.from([0.01, 0.99]), {
      ...options({ layout: [2] }),
      budget,
      duration: 1e6,
      samples: 10001,
    });
    expect(result.error).toBeUndefined();
    expect(result.states[10000]?.[0] ?? NaN).toBeCloseTo(V / C, 9);
    expect(result.stats.steps).toBeGreaterThan(0);
    expect(budget.stepsUsed()).toBe(result.stats.steps);
    expect(result.stats.rhsEvaluations).toBeGreaterThan(result.stats.steps);
  });
});

describe("integrate agrees with a second, independent integrator (ode45-cash-karp, Cash-Karp 4(5))", () => {
  // The reference integrates the contract's equations as written out in tests/support (not the
  // engine's vector field), so both the right-hand side and the integrator are independent.
  type Naive = (x: number[]) => number[];
  const problems: { name: string; field: VectorField; naive: Naive; x0: number[]; layout: number[] }[] = [];
  const hawkDove = symmetricGame([
    [-0.5, 2],
    [0, 1],
  ]);
  const rps = symmetricGame([
    [0, -1, 1.5],
    [1.5, 0, -1],
    [-1, 1.5, 0],
  ]);
  const pennies = bimatrixGame(
    [
      [1, -1],
      [-1, 1],
    ],
    [
      [-1, 1],
      [1, -1],
    ],
  );
  const four = symmetricGame([
    [1, 0.2, -0.4, 0.9],
    [0.3, 0.8, 1.1, -0.2],
    [0.5, -0.6, 0.4, 1.2],
    [-0.1, 0.7, 0.3, 0.6],
  ]);
  const add = (name: string, game: typeof rps, dynamics: DynamicsSpec, x0: number[], layout: number[]): void => {
    const rows = (A: Float64Array, r: number, c: number): number[][] =>
      Array.from({ length: r }, (_, i) => Array.from(A.subarray(i * c, i * c + c)));
    const naive: Naive =
      game.kind === "symmetric"
        ? (x) => naiveSymmetric(rows(game.A, game.n, game.n), dynamics, x)
        : (x) => naiveBimatrix(rows(game.A, game.m, game.k), rows(game.B, game.k, game.m), dynamics, x);
    problems.push({ name: `${name}, ${dynamics.kind}`, field: vectorField(game, dynamics), naive, x0, layout });
  };
  add("hawk-dove", hawkDove, { kind: "replicator" }, [0.1, 0.9], [2]);
  add("rock-paper-scissors", rps, { kind: "replicator" }, [0.6, 0.3, 0.1], [3]);
  add("matching pennies (bimatrix)", pennies, { kind: "replicator" }, [0.7, 0.3, 0.4, 0.6], [2, 2]);
  add("rock-paper-scissors", rps, { kind: "logit", noise: 0.2 }, [0.6, 0.3, 0.1], [3]);
  add("four strategies", four, { kind: "replicator-mutator", mutationRate: 0.05 }, [0.1, 0.2, 0.3, 0.4], [4]);
  add("matching pennies (bimatrix)", pennies, { kind: "logit", noise: 0.5 }, [0.9, 0.1, 0.2, 0.8], [2, 2]);
  add("four strategies", four, { kind: "brown-von-neumann-nash" }, [0.4, 0.3, 0.2, 0.1], [4]);
  add("rock-paper-scissors", rps, { kind: "smith" }, [0.6, 0.3, 0.1], [3]);

  for (const p of problems) {
    it(`${p.name}: max-norm difference below 1e-8 at 41 times up to T = 40`, () => {
      const T = 40;
      const at = Array.from({ length: 41 }, (_, i) => i);
      const ours = integrate(p.field, Float64Array.from(p.x0), {
        ...options({ layout: p.layout }),
        duration: T,
        samples: 2,
        queryTimes: at,
      });
      expect(ours.error).toBeUndefined();
      const theirs = cashKarpAt((x, out) => out.set(p.naive(Array.from(x))), p.x0, at, 1e-13);
      let worst = 0;
      at.forEach((_, i) => {
        worst = Math.max(worst, maxNormDistance(ours.queries[i] ?? [], theirs[i] ?? []));
      });
      expect(worst).toBeLessThan(1e-8);
    });
  }
});

describe("integrate: failures and their messages", () => {
  it("a state that leaves the simplex (negative share) fails the run and keeps the samples before it", () => {
    const field = customField(2, (_x, out) => {
      out[0] = 1;
      out[1] = -1;
    });
    const result = integrate(field, Float64Array.from([0.5, 0.5]), {
      ...options({ layout: [2] }),
      duration: 2,
      samples: 21,
      labels: ["grazers", "browsers"],
    });
    expect(result.error?.kind).toBe("left-state-space");
    expect(result.error?.message).toMatch(
      /^the state left the simplex at t = [0-9.e-]+: the share of browsers is -[0-9.e+-]+, below 0 by more than 1e-9$/,
    );
    expect(result.times.length).toBeGreaterThan(0);
    expect(result.times.length).toBeLessThan(21);
    expect(result.times.every((t) => t <= 0.5)).toBe(true);
    expect(result.queries).toEqual([]);
  });

  it("shares that stop summing to 1 fail the run, naming the population in a bimatrix game", () => {
    const field = customField(4, (_x, out) => {
      out.fill(0);
      out[3] = 0.1;
    });
    const result = integrate(field, Float64Array.from([0.5, 0.5, 0.5, 0.5]), { ...options({ layout: [2, 2] }) });
    expect(result.error?.kind).toBe("left-state-space");
    expect(result.error?.message).toMatch(
      /^the state left the product of simplices at t = [0-9.e-]+: the shares of population 2 sum to 1\.[0-9]+, off 1 by more than 1e-9$/,
    );
    const single = integrate(customField(2, (_x, out) => out.fill(0.1)), Float64Array.from([0.5, 0.5]), {
      ...options({ layout: [2] }),
    });
    expect(single.error?.message).toMatch(/^the state left the simplex at t = [0-9.e-]+: the shares sum to /);
  });

  it("an initial state off the simplex fails at t = 0", () => {
    const field = vectorField(symmetricGame([[1, 0], [0, 1]]), { kind: "replicator" });
    const result = integrate(field, Float64Array.from([0.7, 0.5]), options({ layout: [2] }));
    expect(result.error?.kind).toBe("left-state-space");
    expect(result.error?.message).toMatch(/^the state left the simplex at t = 0: the shares sum to 1\.2/);
    expect(result.times).toEqual([]);
  });

  it("a non-finite state fails the run", () => {
    const field = vectorField(symmetricGame([[1, 0], [0, 1]]), { kind: "replicator" });
    const result = integrate(field, Float64Array.from([Number.NaN, 0.5]), options({ layout: [2] }));
    expect(result.error).toEqual({
      kind: "non-finite",
      message: "the state became non-finite at t = 0: component 0 is NaN",
    });
  });

  it("a right-hand side that becomes non-finite fails the run", () => {
    const field = customField(2, (x, out) => {
      const v = (x[0] ?? 0) > 0.7 ? Number.NaN : 0.1;
      out[0] = v;
      out[1] = -v;
    });
    const result = integrate(field, Float64Array.from([0.5, 0.5]), { ...options({ layout: [2] }), labels: ["ants", "bees"] });
    expect(result.error?.kind).toBe("non-finite");
    expect(result.error?.message).toMatch(/^the right-hand side became non-finite near t = [0-9.]+: its ants is NaN$/);
    expect(result.times[0]).toBe(0); // the sample at t = 0 came before the failure
  });

  it("stops with 'budget exceeded' when the step budget runs out", () => {
    const rps = symmetricGame([
      [0, -1, 1],
      [1, 0, -1],
      [-1, 1, 0],
    ]);
    const budget = new Budget({ maxSteps: 10 });
    const result = integrate(vectorField(rps, { kind: "replicator" }), Float64Array.from([0.5, 0.3, 0.2]), {
      ...options({ layout: [3] }),
      budget,
      duration: 1000,
    });
    expect(result.error?.kind).toBe("budget");
    expect(result.error?.message).toMatch(
      /^budget exceeded: more than 10 integrator steps \(the run had reached t = [0-9.e-]+ of 1000\)$/,
    );
  });

  it("stops with 'budget exceeded' when the wall clock runs out", () => {
    let clock = 0;
    const budget = new Budget({ wallClockMs: 5 }, () => (clock += 1));
    const rps = symmetricGame([
      [0, -1, 1],
      [1, 0, -1],
      [-1, 1, 0],
    ]);
    const result = integrate(vectorField(rps, { kind: "replicator" }), Float64Array.from([0.5, 0.3, 0.2]), {
      ...options({ layout: [3] }),
      budget,
      duration: 1000,
    });
    expect(result.error?.kind).toBe("budget");
    expect(result.error?.message).toMatch(/^budget exceeded: the run took longer than 0.005 s of computing time/);
  });

  it("reports an integrator that stops short and one that throws", () => {
    const field = vectorField(symmetricGame([[0, -1, 1], [1, 0, -1], [-1, 1, 0]]), { kind: "replicator" });
    const short = integrate(field, Float64Array.from([0.5, 0.3, 0.2]), {
      ...options({ layout: [3] }),
      duration: 100,
      solverStepLimit: 3,
    });
    expect(short.error?.kind).toBe("integrator");
    expect(short.error?.message).toMatch(/^the integrator stopped at t = [0-9.e-]+ of 100 without reaching the end$/);
    const throwing = customField(2, () => {
      throw new Error("payoff table unavailable");
    });
    const failed = integrate(throwing, Float64Array.from([0.5, 0.5]), options({ layout: [2] }));
    expect(failed.error).toEqual({ kind: "integrator", message: "the integrator failed: payoff table unavailable" });
  });

  it("refuses options that make no problem", () => {
    const field = vectorField(symmetricGame([[1, 0], [0, 1]]), { kind: "replicator" });
    const x = Float64Array.from([0.5, 0.5]);
    const cases: [Partial<IntegrationOptions>, Float64Array, string][] = [
      [{}, Float64Array.from([1, 0, 0]), "the initial state has 3 components; the dynamics has 2"],
      [{ layout: [1, 2] }, x, "the block sizes [1, 2] must be positive integers adding up to the dimension 2"],
      [{ duration: 0 }, x, "the duration must be a positive finite number; got 0"],
      [{ duration: Infinity }, x, "the duration must be a positive finite number; got Infinity"],
      [{ samples: 1 }, x, "the number of samples must be an integer of at least 2; got 1"],
      [{ samples: 2.5 }, x, "the number of samples must be an integer of at least 2; got 2.5"],
      [{ queryTimes: [1, 11] }, x, "the query time 11 lies outside [0, 10]"],
      [{ queryTimes: [-1] }, x, "the query time -1 lies outside [0, 10]"],
      [
        { relativeTolerance: 0, absoluteTolerance: 0 },
        x,
        "the tolerances must be non-negative finite numbers, not both 0; got relative 0, absolute 0",
      ],
    ];
    for (const [over, x0, message] of cases) {
      expect(() => integrate(field, x0, { ...options({ layout: [2] }), ...over })).toThrow(message);
    }
    expect(() => integrate(field, x, { ...options({ layout: [2] }), samples: 0 })).toThrow(IntegrationInputError);
  });
});
