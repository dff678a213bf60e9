import { describe, expect, it } from "vitest";
import { stateDistance, unclaimedFindings } from "@/components/editor/findings";
import { REPORT_FORMAT, SPEC_FORMAT, type ModelSpec, type Report, type RestPointReport } from "@/lib/engine/types";

// A fictional scenario of our own: hermit crabs that Keep or Swap shells.
const game = { kind: "symmetric" as const, strategies: ["Keep", "Swap"], payoffs: [[1, 3], [2, 1]] };
const rp = (state: number[], stability: RestPointReport["stability"], ess: boolean, support: string[]): RestPointReport => ({
  state,
  support,
  stability,
  eigenvalues: [[stability === "unstable" ? 1 : -1, 0]],
  nash: ess,
  ess,
});
const restPoints = [rp([1, 0], "unstable", false, ["Keep"]), rp([0, 1], "unstable", false, ["Swap"]), rp([2 / 3, 1 / 3], "asymptotically-stable", true, ["Keep", "Swap"])];
const report = (over: Partial<Report> = {}): Report => ({
  format: REPORT_FORMAT,
  specSha256: "0".repeat(64),
  engine: { version: "t" },
  verdict: "confirmed",
  errors: [],
  claims: [],
  restPoints,
  experiments: [],
  ...over,
});
const spec = (claims: ModelSpec["claims"], experiments: ModelSpec["experiments"] = []): ModelSpec => ({ format: SPEC_FORMAT, title: "Crabs", game, claims, experiments });

describe("stateDistance", () => {
  it("is the max-norm over both populations, and infinite across shapes", () => {
    expect(stateDistance([0.5, 0.5], [0.4, 0.6])).toBeCloseTo(0.1, 15);
    expect(stateDistance([[1, 0], [0.5, 0.5]], [[1, 0], [0.25, 0.75]])).toBe(0.25);
    expect(stateDistance([1, 0], [1, 0, 0])).toBe(Number.POSITIVE_INFINITY);
  });
});

describe("unclaimedFindings", () => {
  it("lists unclaimed rest points with the ESS first, and the missing count", () => {
    const f = unclaimedFindings(spec([{ id: "keep-pure", kind: "rest-point", state: [1, 0], stability: "unstable" }]), report());
    expect(f.map((x) => x.kind)).toEqual(["unclaimed-rest-point", "unclaimed-rest-point", "count-not-stated"]);
    expect(f[0]?.text).toBe("No claim mentions this rest point (asymptotically stable, a Nash equilibrium, an ESS on Keep, Swap).");
    expect(f[1]?.text).toBe("No claim mentions this rest point (unstable on Swap).");
    expect(f[2]?.text).toBe("The engine found 3 isolated rest points of the replicator dynamics; no claim says how many there are.");
  });

  it("matches a claim written in decimals within its tolerance, and flags a missing stability", () => {
    const f = unclaimedFindings(
      spec([
        { id: "mixed", kind: "rest-point", state: [0.6666667, 0.3333333], tolerance: 1e-6 },
        { id: "ends", kind: "rest-point-count", count: 3 },
        { id: "swap-nash", kind: "nash-equilibrium", state: [0, 1], holds: false },
        { id: "keep-ess", kind: "ess", state: [1, 0], holds: false },
      ]),
      report(),
    );
    expect(f).toEqual([
      {
        kind: "stability-not-stated",
        restPoint: restPoints[2],
        ref: "mixed",
        text: "Claim mixed places a rest point here without saying how stable it is; the engine finds it asymptotically stable.",
      },
    ]);
  });

  it("does not count a claim with its own parameters as speaking about the spec's rest points", () => {
    const f = unclaimedFindings(spec([{ id: "other", kind: "ess", state: [2 / 3, 1 / 3], parameters: { b: 2 } }, { id: "n", kind: "rest-point-count", count: 3 }]), report());
    expect(f.filter((x) => x.kind === "unclaimed-rest-point")).toHaveLength(3);
  });

  it("names experiments no claim refers to, and says nothing for an invalid spec", () => {
    const s = spec(
      [
        { id: "n", kind: "rest-point-count", count: 3 },
        { id: "end", kind: "final-state", experiment: "from-keep", state: [2 / 3, 1 / 3] },
      ],
      [
        { id: "from-keep", initial: [0.9, 0.1], duration: 10 },
        { id: "from-swap", initial: [0.1, 0.9], duration: 10 },
      ],
    );
    const f = unclaimedFindings(s, report({ restPoints: [] }));
    expect(f).toEqual([{ kind: "experiment-unused", ref: "from-swap", text: "Experiment from-swap is run, but no claim refers to it." }]);
    expect(unclaimedFindings(s, report({ verdict: "invalid" }))).toEqual([]);
  });
});
