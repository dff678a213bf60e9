import { describe, expect, it } from "vitest";
import type { Analysis } from "@/lib/engine/analysis";
import { Budget } from "@/lib/engine/budget";
import { decideClaim, DEFAULT_TOLERANCE, fmt, maxDistance, type ClaimContext } from "@/lib/engine/claims";
import type { Claim, CompiledGame } from "@/lib/engine/types";

const game: CompiledGame = { kind: "symmetric", n: 4, strategies: ["a", "b", "c", "d"], A: new Float64Array(16) };

/** A context whose enumeration reports one face it could not resolve (as for very large singular faces). */
function contextWithUndecidedFace(): ClaimContext {
  const analysis: Analysis = { game, enumerated: true, points: [], continua: [], undecided: [[0, 1, 2, 3]] };
  return {
    dynamics: { kind: "replicator" },
    budget: new Budget(),
    game: () => game,
    analysis: () => analysis,
    run: () => ({ times: [], states: [], queries: [] }),
    present: (_g, x) => Array.from(x),
  };
}

describe("claims on faces the enumeration could not resolve", () => {
  it("a count is inconclusive, naming the face", () => {
    const r = decideClaim({ id: "count", kind: "rest-point-count", count: 1 }, contextWithUndecidedFace());
    expect(r).toEqual({
      id: "count",
      kind: "rest-point-count",
      status: "inconclusive",
      message: "A face of the state space (spanned by a, b, c, d) has a singular system whose rest points the engine could not resolve, so the count is not decided.",
    });
  });

  it("a state that may lie on such a face is inconclusive", () => {
    const claim: Claim = { id: "p", kind: "nash-equilibrium", state: [0.25, 0.25, 0.25, 0.25] };
    const r = decideClaim(claim, contextWithUndecidedFace());
    expect(r.status).toBe("inconclusive");
    expect(r.message).toBe("No isolated rest point lies within 1e-6 of the state, but the game has a degenerate face the engine could not resolve (support a, b, c, d), which the state may lie on.");
  });

  it("a run that produced no states leaves final-state claims inconclusive", () => {
    const ctx = contextWithUndecidedFace();
    ctx.run = () => ({ times: [], states: [], queries: [] });
    const r = decideClaim({ id: "f", kind: "final-state", experiment: "e", state: [1, 0, 0, 0] }, ctx);
    expect(r).toMatchObject({ status: "inconclusive", message: "The run produced no states." });
  });
});

describe("claim helpers", () => {
  it("formats numbers with six significant digits, small and large ones exponential", () => {
    expect(fmt(0)).toBe("0");
    expect(fmt(1 / 3)).toBe("0.333333");
    expect(fmt(1e-4)).toBe("1e-4");
    expect(fmt(0.0005)).toBe("5e-4");
    expect(fmt(2500000)).toBe("2.5e+6");
  });

  it("measures max-norm distances and keeps the format's default tolerances", () => {
    expect(maxDistance([0.5, 0.5], [0.25, 0.75])).toBe(0.25);
    expect(DEFAULT_TOLERANCE).toEqual({
      "rest-point": 1e-6,
      "nash-equilibrium": 1e-6,
      ess: 1e-6,
      "rest-point-count": 0,
      "final-state": 1e-4,
      trajectory: 1e-4,
      "fixation-probability": 1e-6,
    });
  });
});
