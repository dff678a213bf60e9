import { describe, expect, it } from "vitest";
import type { GameSpec } from "@/lib/engine/types";
import { dynamicsView, formulaReading, formulaText, payoffTable, readableSpec } from "@/lib/spec-view";

// A contest over a resource of value V at cost C: the hawk-dove table (Maynard Smith 1982, from memory).
const hawkDove: { parameters: Record<string, number>; game: GameSpec } = {
  parameters: { V: 2, C: 4 },
  game: {
    kind: "symmetric",
    strategies: ["Hawk", "Dove"],
    payoffs: [
      ["(V - C) / 2", "V"],
      [0, "V / 2"],
    ],
  },
};

const bimatrix: GameSpec = {
  kind: "bimatrix",
  populations: [
    { name: "Buyers", strategies: ["Inspect", "Trust"] },
    { name: "Sellers", strategies: ["Honest", "Cheat", "Leave"] },
  ],
  payoffs: [
    [
      [1, 2, 3],
      [4, 5, 6],
    ],
    [
      [10, 40],
      [20, 50],
      [30, 60],
    ],
  ],
};

describe("payoffTable", () => {
  it("evaluates every expression at the spec's parameters and keeps what the author wrote", () => {
    const view = payoffTable(hawkDove);
    expect(view.kind).toBe("symmetric");
    expect(view.rows).toEqual(["Hawk", "Dove"]);
    expect(view.columns).toEqual(["Hawk", "Dove"]);
    expect(view.cells).toEqual([
      [[{ expression: "(V - C) / 2", value: -1 }], [{ expression: "V", value: 2 }]],
      [[{ expression: null, value: 0 }], [{ expression: "V / 2", value: 1 }]],
    ]);
    expect(view.parameters).toEqual([
      { name: "C", value: 4 },
      { name: "V", value: 2 },
    ]);
  });

  it("uses overrides on top of the spec's values", () => {
    const view = payoffTable(hawkDove, { C: 10 });
    expect(view.cells[0]?.[0]?.[0]?.value).toBe(-4);
    expect(view.parameters).toContainEqual({ name: "C", value: 10 });
  });

  it("pairs the two populations' payoffs per cell, reading the second matrix transposed", () => {
    const view = payoffTable({ game: bimatrix });
    expect(view.rowTitle).toBe("Buyers");
    expect(view.columnTitle).toBe("Sellers");
    expect(view.rows).toEqual(["Inspect", "Trust"]);
    expect(view.columns).toEqual(["Honest", "Cheat", "Leave"]);
    // Buyers' Trust against Sellers' Leave: P1[1][2] = 6 for the buyer, P2[2][1] = 60 for the seller.
    expect(view.cells[1]?.[2]?.map((c) => c.value)).toEqual([6, 60]);
    expect(view.cells[0]?.[1]?.map((c) => c.value)).toEqual([2, 20]);
    expect(view.reading).toContain("to Buyers (first) and to Sellers (second)");
  });

  it("keeps an entry it cannot evaluate, with the engine's message", () => {
    const view = payoffTable({
      parameters: { V: 0 },
      game: { kind: "symmetric", strategies: ["A", "B"], payoffs: [["1 / V", "W"], [1, 2]] },
    });
    expect(view.cells[0]?.[0]?.[0]).toEqual({
      expression: "1 / V",
      value: null,
      error: 'The payoff "1 / V" is infinite at the parameter values V = 0.',
    });
    expect(view.cells[0]?.[1]?.[0]?.error).toBe('The expression uses "W", which is not one of the spec\'s parameters (V).');
  });

  it("says so when a row is short", () => {
    const view = payoffTable({ game: { kind: "symmetric", strategies: ["A", "B"], payoffs: [[1], [1, 2]] } });
    expect(view.cells[0]?.[1]?.[0]).toEqual({ expression: null, value: null, error: "Missing payoff entry." });
  });
});

describe("dynamicsView", () => {
  const sym = hawkDove.game;

  it("defaults to the replicator dynamics, dx_i/dt = x_i (f_i − φ) (contract formula)", () => {
    const v = dynamicsView(undefined, sym);
    expect(v.name).toBe("Replicator dynamics");
    expect(v.equations.map(formulaText)).toEqual(["dx_i/dt = x_i (f_i − φ)", "φ = Σ_j x_j f_j"]);
    expect(v.constants).toEqual([]);
  });

  it("writes the replicator–mutator law with its mutation rate", () => {
    const v = dynamicsView({ kind: "replicator-mutator", mutationRate: 0.01 }, sym);
    expect(formulaText(v.equations[0] ?? [])).toBe("dx_i/dt = Σ_j x_j f_j q_ji − x_i φ");
    expect(formulaText(v.equations[2] ?? [])).toBe("q_ii = 1 − μ,  q_ji = μ / (n − 1) for j ≠ i");
    expect(v.constants).toEqual([{ name: "mutation rate", symbol: "μ", value: 0.01 }]);
  });

  it("writes the logit, Brown–von Neumann–Nash and Smith laws", () => {
    expect(formulaText(dynamicsView({ kind: "logit", noise: 0.5 }, sym).equations[0] ?? [])).toBe(
      "dx_i/dt = exp(f_i / η) / Σ_j exp(f_j / η) − x_i",
    );
    const bnn = dynamicsView({ kind: "brown-von-neumann-nash" }, sym);
    expect(bnn.equations.map(formulaText)).toEqual(["dx_i/dt = k_i − x_i Σ_j k_j", "k_i = max(f_i − φ, 0)", "φ = Σ_j x_j f_j"]);
    expect(formulaText(dynamicsView({ kind: "smith" }, sym).equations[0] ?? [])).toBe(
      "dx_i/dt = Σ_j x_j [f_i − f_j]_+ − x_i Σ_j [f_j − f_i]_+",
    );
  });

  it("names both populations for a two-population game", () => {
    const v = dynamicsView({ kind: "replicator" }, bimatrix);
    expect(formulaText(v.where[0] ?? [])).toBe(
      "x is the state of Buyers and y that of Sellers; f_i = (A y)_i is the payoff to strategy i of Buyers against y, and g_j = (B x)_j the payoff to strategy j of Sellers against x.",
    );
    // Population names are parts of their own, rendered exactly as written (never as glyphs).
    expect(v.where[0]?.filter((p) => "name" in p)).toEqual([{ name: "Buyers" }, { name: "Sellers" }, { name: "Buyers" }, { name: "Sellers" }]);
  });

  it("reads a formula aloud with our own symbols spelled out, in Latin-1 like the page", () => {
    const v = dynamicsView({ kind: "replicator-mutator", mutationRate: 0.01 }, sym);
    const readings = v.equations.map(formulaReading);
    expect(readings[0]).toBe("dx_i/dt = sum_j x_j f_j q_ji - x_i phi");
    expect(readings[2]).toBe("q_ii = 1 - mu,  q_ji = mu / (n - 1) for j not equal to i");
    for (const r of readings) expect(r).toMatch(/^[\u0000-\u00ff]*$/);
  });
});

describe("readableSpec", () => {
  it("reads a symmetric and a two-population spec", () => {
    expect(readableSpec(JSON.stringify(hawkDove))?.game.kind).toBe("symmetric");
    expect(readableSpec(JSON.stringify({ game: bimatrix }))?.game.kind).toBe("bimatrix");
  });
  it("returns null for text that is not JSON or a game it cannot draw", () => {
    expect(readableSpec("{ nope")).toBeNull();
    expect(readableSpec("[]")).toBeNull();
    expect(readableSpec(JSON.stringify({ game: { kind: "symmetric", strategies: ["A", 3], payoffs: [] } }))).toBeNull();
    expect(readableSpec(JSON.stringify({ game: { kind: "bimatrix", populations: [{ name: "P", strategies: [] }], payoffs: [[], []] } }))).toBeNull();
    expect(readableSpec(JSON.stringify({ game: { kind: "lottery" } }))).toBeNull();
  });
});
