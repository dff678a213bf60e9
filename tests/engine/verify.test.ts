import { createHash } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { ENGINE_VERSION, verifySpec, verifySpecText } from "@/lib/engine/verify";
import type { ClaimResult, Report } from "@/lib/engine/types";
import { expectClose, seededRandom } from "../support/close";

type Json = Record<string, unknown>;
const exampleText = readFileSync("schemas/examples/fog-dune-beetles.json", "utf8");
const example = JSON.parse(exampleText) as Json;
const sha = (s: string): string => createHash("sha256").update(s).digest("hex");

function spec(game: Json, claims: Json[], extra: Json = {}): Json {
  return { format: "restpoint/model@1", title: "Test scenario", game, claims, ...extra };
}

const rps = (a: number, b: number): Json => ({
  kind: "symmetric",
  strategies: ["Rock", "Paper", "Scissors"],
  payoffs: [
    [0, -b, a],
    [a, 0, -b],
    [-b, a, 0],
  ],
});

const hawkDove: Json = { kind: "symmetric", strategies: ["Hawk", "Dove"], payoffs: [["(V - C) / 2", "V"], [0, "V / 2"]] };

function claim(report: Report, id: string): ClaimResult {
  const c = report.claims.find((x) => x.id === id);
  if (c === undefined) throw new Error(`no claim ${id}`);
  return c;
}

describe("verifySpec: the report follows the contract", () => {
  const report = verifySpecText(exampleText);

  it("confirms the example spec, with fields in the contract's order", () => {
    expect(Object.keys(report)).toEqual(["format", "specSha256", "engine", "verdict", "errors", "claims", "restPoints", "experiments", "notes"]);
    expect(report.format).toBe("restpoint/report@1");
    expect(report.engine).toEqual({ version: ENGINE_VERSION });
    expect(ENGINE_VERSION).toMatch(/^\d+\.\d+\.\d+$/);
    expect(report.verdict).toBe("confirmed");
    expect(report.errors).toEqual([]);
    expect(report.claims.map((c) => c.status)).toEqual(new Array(10).fill("confirmed"));
  });

  it("lists the replicator's rest points in lexicographic order with support names, stability, Nash and ESS", () => {
    // Solved by hand: on each face the shares where every site in the support pays the same,
    // e.g. inside Crest 3 - 4x1 - 2x3 = Lee 2 - 4x2 = Trough 3 - 4x3 gives (1/4, 1/4, 1/2).
    expect(report.restPoints?.map((p) => p.state)).toEqual([
      [1, 0, 0],
      [0.625, 0.375, 0],
      [0.333333333333, 0, 0.666666666667],
      [0.25, 0.25, 0.5],
      [0, 1, 0],
      [0, 0.375, 0.625],
      [0, 0, 1],
    ]);
    const mixed = report.restPoints?.[3];
    expect(mixed).toMatchObject({ support: ["Crest", "Lee", "Trough"], stability: "asymptotically-stable", nash: true, ess: true });
    expect(mixed?.eigenvalues).toHaveLength(2);
  });

  it("reports each experiment's samples from 0 to the duration inclusive", () => {
    expect(report.experiments.map((e) => e.id)).toEqual(["lee-crowded", "crest-crowded", "trough-crowded"]);
    for (const e of report.experiments) {
      expect(e.times).toHaveLength(201);
      expect(e.times[0]).toBe(0);
      expect(e.times[200]).toBe(40);
      expect(e.states).toHaveLength(201);
    }
  });

  it("says how it checked and that a confirmed claim is no peer review", () => {
    const notes = (report.notes ?? []).join(" ");
    expect(notes).toMatch(/enumerating all 7 supports/);
    expect(notes).toMatch(/Haigh's criterion/);
    expect(notes).toMatch(/odex .* relative tolerance 1e-10 and absolute tolerance 1e-12/);
    expect(notes).toMatch(/it is not a peer review/);
  });

  it("confirms every example spec under schemas/examples", () => {
    for (const name of readdirSync("schemas/examples")) {
      const r = verifySpecText(readFileSync(`schemas/examples/${name}`, "utf8"));
      expect(r.verdict, `${name}: ${JSON.stringify(r.errors)} ${r.claims.filter((c) => c.status !== "confirmed").map((c) => c.message).join(" ")}`).toBe("confirmed");
    }
  });

  it("is byte-identical on repeated runs and independent of formatting and key order", () => {
    const again = JSON.stringify(verifySpecText(exampleText));
    expect(again).toBe(JSON.stringify(report));
    const reordered = JSON.stringify(Object.fromEntries(Object.entries(example).reverse()), null, 7);
    expect(JSON.stringify(verifySpecText(reordered))).toBe(again);
    expect(JSON.stringify(verifySpec(example))).toBe(again);
  });

  it("hashes the RFC 8785 canonical form", () => {
    expect(verifySpec({ b: 1, a: 1e21 }).specSha256).toBe(sha('{"a":1e+21,"b":1}'));
  });
});

describe("verifySpecText: input that never becomes a spec", () => {
  it("refuses text that is not JSON, with the line and the hash of the raw bytes", () => {
    const text = '{\n  "format": "restpoint/model@1",\n  "title": oops\n}';
    const r = verifySpecText(text);
    expect(r.verdict).toBe("invalid");
    expect(r.specSha256).toBe(sha(text));
    expect(r.errors).toHaveLength(1);
    expect(r.errors[0]?.message).toBe('The file is not valid JSON at line 3, column 12, near "oops\\n}".');
    expect(r.errors[0]?.line).toBe(3);
    expect(r.claims).toEqual([]);
    expect(r.restPoints).toBeUndefined();
  });

  it("refuses an empty file", () => {
    expect(verifySpecText("  ").errors[0]?.message).toBe("The file is empty; a spec is a JSON object.");
  });

  it("refuses more than 1 MB before parsing", () => {
    const text = `{"title": "${"x".repeat(1_000_000)}"}`;
    const r = verifySpecText(text);
    expect(r.verdict).toBe("invalid");
    expect(r.errors).toEqual([{ path: "", message: "The spec is 1000013 bytes long; specs are limited to 1000000 bytes (1 MB), so it was not read." }]);
    expect(r.specSha256).toBe(sha(text));
  });

  it("counts bytes, not characters", () => {
    const r = verifySpecText(`"${"é".repeat(500_000)}"`);
    expect(r.errors[0]?.message).toMatch(/^The spec is 1000002 bytes long/);
  });

  it("refuses deeply nested JSON without overflowing the stack", () => {
    const text = "[".repeat(100_000) + "]".repeat(100_000);
    const r = verifySpecText(text);
    expect(r.verdict).toBe("invalid");
    expect(r.errors[0]?.message).toMatch(/nested more than 64 levels deep/);
    expect(r.specSha256).toBe(sha(text));
  });

  it("reports schema errors as invalid and runs nothing", () => {
    const r = verifySpec({ ...example, format: "restpoint/model@0" });
    expect(r.verdict).toBe("invalid");
    expect(r.errors).toEqual([{ path: "/format", message: 'The format must be "restpoint/model@1"; this file says "restpoint/model@0".' }]);
    expect(r.experiments).toEqual([]);
  });
});

describe("verifySpec never throws on damaged input", () => {
  it("answers 400 random mutations of the example spec with a report", () => {
    const rnd = seededRandom(77);
    const junk: unknown[] = [null, true, -1, 0, 1e308, -1e-308, "", "x", "V^999", [], {}, [[]], [0.5, 0.5], [[1, 0], [0, 1]], { kind: "symmetric" }, "a".repeat(600)];
    const paths = (v: unknown, prefix: (string | number)[] = [], out: (string | number)[][] = []): (string | number)[][] => {
      out.push(prefix);
      if (Array.isArray(v)) v.forEach((x, i) => paths(x, [...prefix, i], out));
      else if (v !== null && typeof v === "object") for (const [k, x] of Object.entries(v)) paths(x, [...prefix, k], out);
      return out;
    };
    const all = paths(example).filter((p) => p.length > 0);
    for (let trial = 0; trial < 400; trial++) {
      const copy = structuredClone(example) as Record<string, unknown>;
      for (let edits = 0; edits < 1 + Math.floor(rnd() * 3); edits++) {
        const p = all[Math.floor(rnd() * all.length)] ?? [];
        let parent: unknown = copy;
        for (const key of p.slice(0, -1)) parent = parent === null || typeof parent !== "object" ? undefined : (parent as Record<string | number, unknown>)[key];
        if (parent === null || typeof parent !== "object") continue;
        const last = p[p.length - 1] ?? "";
        if (rnd() < 0.2) delete (parent as Record<string | number, unknown>)[last];
        else (parent as Record<string | number, unknown>)[last] = junk[Math.floor(rnd() * junk.length)];
      }
      const report = verifySpec(copy, { budget: { wallClockMs: 2000 } });
      expect(["confirmed", "contradicted", "inconclusive", "invalid"]).toContain(report.verdict);
      if (report.verdict === "invalid") {
        expect(report.errors.length).toBeGreaterThan(0);
        for (const e of report.errors) {
          expect(e.path === "" || e.path.startsWith("/")).toBe(true);
          expect(e.message).toMatch(/^[A-Z"].*[.)]$/);
        }
      }
    }
  });
});

describe("claims: decisions and the verdict", () => {
  it("a state written in decimals means the exact rest point it approximates", () => {
    const r = verifySpec(spec(rps(2, 1), [
      { id: "ess-thirds", kind: "ess", state: [0.333333, 0.333333, 0.333334] },
      { id: "stable-thirds", kind: "rest-point", state: [0.333333, 0.333333, 0.333334], stability: "asymptotically-stable" },
      { id: "nash-thirds", kind: "nash-equilibrium", state: [0.333333, 0.333333, 0.333334] },
    ]));
    expect(r.verdict).toBe("confirmed");
    expect(claim(r, "ess-thirds").computed).toEqual({ state: [0.333333333333, 0.333333333333, 0.333333333333], ess: true });
    expectClose(claim(r, "ess-thirds").deviation ?? Number.NaN, 2 / 3 * 1e-6, 1e-6);
  });

  it("a tolerance of 0 asks for an exact match, which a vertex meets", () => {
    const r = verifySpec(spec(rps(2, 1), [
      { id: "vertex", kind: "rest-point", state: [1, 0, 0], tolerance: 0 },
      { id: "thirds", kind: "rest-point", state: [0.333333, 0.333333, 0.333334], tolerance: 0 },
    ]));
    expect(claim(r, "vertex")).toMatchObject({ status: "confirmed", deviation: 0, tolerance: 0 });
    expect(claim(r, "thirds").status).toBe("contradicted");
  });

  it("Zeeman's game (matrix from memory, Zeeman 1980): the barycentre is asymptotically stable and no ESS, in one report", () => {
    const r = verifySpec(spec({ kind: "symmetric", strategies: ["e1", "e2", "e3"], payoffs: [[0, 6, -4], [-3, 0, 5], [-1, 3, 0]] }, [
      { id: "stable", kind: "rest-point", state: [0.333333, 0.333333, 0.333334], stability: "asymptotically-stable" },
      { id: "not-ess", kind: "ess", state: [0.333333, 0.333333, 0.333334], holds: false },
      { id: "e1-ess", kind: "ess", state: [1, 0, 0] },
    ]));
    expect(r.verdict).toBe("confirmed");
    const centre = r.restPoints?.find((p) => p.support.length === 3);
    expect(centre).toMatchObject({ stability: "asymptotically-stable", nash: true, ess: false });
    // -1/3 +- i sqrt(2)/3, derived in stability.test.ts
    expect(centre?.eigenvalues).toEqual([[-0.333333333333, 0.471404520791], [-0.333333333333, -0.471404520791]]);
  });

  it("zero-sum rock-paper-scissors: a stability claim at the centre is inconclusive, not confirmed", () => {
    const r = verifySpec(spec(rps(1, 1), [
      { id: "centre-stable", kind: "rest-point", state: [1 / 3, 1 / 3, 1 / 3], stability: "asymptotically-stable" },
      { id: "centre-neutral", kind: "rest-point", state: [1 / 3, 1 / 3, 1 / 3], stability: "non-hyperbolic" },
    ]));
    expect(claim(r, "centre-stable").status).toBe("inconclusive");
    expect(claim(r, "centre-stable").message).toMatch(/but it is non-hyperbolic .*linearisation cannot show it asymptotically stable\./);
    expect(claim(r, "centre-neutral").status).toBe("confirmed");
    expect(r.verdict).toBe("inconclusive");
  });

  it("contradicts a wrong stability, a state that is no rest point and a wrong count", () => {
    const r = verifySpec(spec(rps(1, 2), [
      { id: "wrong-stability", kind: "rest-point", state: [1 / 3, 1 / 3, 1 / 3], stability: "asymptotically-stable" },
      { id: "no-rest-point", kind: "rest-point", state: [0.5, 0.5, 0] },
      { id: "count", kind: "rest-point-count", count: 7 },
      { id: "interior-count", kind: "rest-point-count", count: 1, region: "interior" },
    ]));
    expect(r.verdict).toBe("contradicted");
    expect(claim(r, "wrong-stability").message).toMatch(/but it is unstable, not asymptotically stable/);
    expect(claim(r, "no-rest-point")).toMatchObject({ status: "contradicted", deviation: 0.333333333333 });
    expect(claim(r, "no-rest-point").message).toBe("The replicator dynamics has no rest point within 1e-6 of the claimed state; the nearest lies 0.333333 away.");
    expect(claim(r, "count")).toMatchObject({ status: "contradicted", computed: { count: 4, region: "all" } });
    expect(claim(r, "count").message).toBe("Support enumeration finds 4 isolated rest points, not 7.");
    expect(claim(r, "interior-count")).toMatchObject({ status: "confirmed", computed: { count: 1, region: "interior" } });
  });

  it("a continuum of rest points makes a count inconclusive, with a message that says so", () => {
    const r = verifySpec(spec({ kind: "symmetric", strategies: ["a", "b", "c"], payoffs: [[1, 1, 0], [1, 1, 0], [0, 0, 2]] }, [
      { id: "count", kind: "rest-point-count", count: 4 },
      { id: "on-the-edge", kind: "nash-equilibrium", state: [0.3, 0.7, 0] },
    ]));
    expect(claim(r, "count").status).toBe("inconclusive");
    expect(claim(r, "count").message).toMatch(/has a continuum of rest points \(on the face spanned by a, b\), so the number of rest points is infinite/);
    expect(claim(r, "on-the-edge").status).toBe("inconclusive");
    expect(claim(r, "on-the-edge").message).toMatch(/but the game has a continuum of rest points \(support a, b\), which the state may lie on/);
    // far from every continuum: decided
    const far = verifySpec(spec({ kind: "symmetric", strategies: ["a", "b", "c"], payoffs: [[1, 1, 0], [1, 1, 0], [0, 0, 2]] }, [
      { id: "off", kind: "rest-point", state: [0.9, 0, 0.1] },
    ]));
    expect(claim(far, "off").status).toBe("contradicted");
    expect(r.notes?.[0]).toMatch(/continuum of rest points on 2 faces; the list holds only the rest points that are the unique solution of their face, and one lying on the boundary of such a face may still belong to the continuum\./);
  });

  it("a plane of interior rest points away from the barycentre is found by the linear program", () => {
    // Strategies a, b, c earn 0 against everything; d earns x_a - x_b - 0.8. Interior rest points
    // form the plane x_a - x_b = 0.8, which meets the open simplex (e.g. at (0.85, 0.05, 0.05, 0.05))
    // although the point of the plane nearest the barycentre lies outside it.
    const r = verifySpec(spec({ kind: "symmetric", strategies: ["a", "b", "c", "d"], payoffs: [[0, 0, 0, 0], [0, 0, 0, 0], [0, 0, 0, 0], [0.2, -1.8, -0.8, -0.8]] }, [
      { id: "interior", kind: "rest-point-count", count: 1, region: "interior" },
    ]));
    expect(claim(r, "interior").status).toBe("inconclusive");
    expect(claim(r, "interior").message).toMatch(/^The replicator dynamics has a continuum of rest points \(on the face spanned by a, b, c, d\)/);
    // with x_a - x_b = 1.2 the plane misses the simplex: no interior rest point at all
    const none = verifySpec(spec({ kind: "symmetric", strategies: ["a", "b", "c", "d"], payoffs: [[0, 0, 0, 0], [0, 0, 0, 0], [0, 0, 0, 0], [-0.2, -2.2, -1.2, -1.2]] }, [
      { id: "interior", kind: "rest-point-count", count: 0, region: "interior" },
    ]));
    expect(claim(none, "interior")).toMatchObject({ status: "confirmed", computed: { count: 0, region: "interior" } });
  });

  it("Nash and ESS claims with holds false, and states that are no rest point", () => {
    const r = verifySpec(spec(hawkDove, [
      { id: "dove-not-nash", kind: "nash-equilibrium", state: [0, 1], holds: false },
      { id: "dove-nash", kind: "nash-equilibrium", state: [0, 1] },
      { id: "half-not-ess", kind: "ess", state: [0.5, 0.5], holds: false },
      { id: "half-ess", kind: "ess", state: [0.5, 0.5] },
      { id: "half-not-nash", kind: "nash-equilibrium", state: [0.5, 0.5], holds: false },
    ], { parameters: { V: 2, C: 3 } }));
    expect(claim(r, "dove-not-nash").status).toBe("confirmed");
    expect(claim(r, "dove-nash").status).toBe("contradicted");
    expect(claim(r, "dove-nash").message).toBe("The claimed state is a rest point and is not a symmetric Nash equilibrium: Hawk earns 1 more than its population's average; the claim says it is.");
    expect(claim(r, "half-not-ess").status).toBe("confirmed");
    expect(claim(r, "half-ess").status).toBe("contradicted");
    expect(claim(r, "half-ess").message).toMatch(/an ESS is always a rest point, so this state is none\./);
    expect(claim(r, "half-not-nash").message).toMatch(/so it is not a Nash equilibrium, as claimed\./);
  });

  it("a claim's parameters override the spec's for that claim only", () => {
    const r = verifySpec(spec(hawkDove, [
      { id: "default", kind: "ess", state: [0.666667, 0.333333] },
      { id: "costlier", kind: "ess", state: [0.5, 0.5], parameters: { C: 4 } },
    ], { parameters: { V: 2, C: 3 } }));
    expect(r.verdict).toBe("confirmed");
    expect(r.restPoints?.map((p) => p.state)).toEqual([[1, 0], [0.666666666667, 0.333333333333], [0, 1]]);
  });

  it("final-state and trajectory claims, also under a claim's parameters", () => {
    // hawk-dove from x0 = 0.1 converges to V/C (Maynard Smith 1982)
    const r = verifySpec(spec(hawkDove, [
      { id: "final", kind: "final-state", experiment: "run", state: [0.666667, 0.333333] },
      { id: "final-costlier", kind: "final-state", experiment: "run", state: [0.5, 0.5], parameters: { C: 4 } },
      { id: "wrong-final", kind: "final-state", experiment: "run", state: [1, 0] },
      { id: "start", kind: "trajectory", experiment: "run", points: [{ t: 0, state: [0.1, 0.9] }, { t: 200, state: [0.666667, 0.333333] }] },
      { id: "wrong-path", kind: "trajectory", experiment: "run", points: [{ t: 0, state: [0.1, 0.9] }, { t: 1.5, state: [0.9, 0.1] }] },
    ], { parameters: { V: 2, C: 3 }, experiments: [{ id: "run", initial: [0.1, 0.9], duration: 200 }] }));
    expect(claim(r, "final").status).toBe("confirmed");
    expect(claim(r, "final-costlier").status).toBe("confirmed");
    expect(claim(r, "wrong-final")).toMatchObject({ status: "contradicted" });
    expect(claim(r, "wrong-final").message).toMatch(/^At t = 200 the run is 0.333333 from the claimed state \(max-norm; tolerance 1e-4\)\./);
    expect(claim(r, "start").status).toBe("confirmed");
    expect(claim(r, "wrong-path").status).toBe("contradicted");
    expect(claim(r, "wrong-path").message).toMatch(/; the largest deviation is at t = 1.5\./);
    expect(r.experiments).toHaveLength(1);
  });

  it("fixation probability: 1/N under neutral selection (Nowak 2006)", () => {
    const r = verifySpec(spec(hawkDove, [
      { id: "neutral", kind: "fixation-probability", populationSize: 40, selectionIntensity: 0, mutant: "Hawk", resident: "Dove", value: 0.025 },
      { id: "wrong", kind: "fixation-probability", populationSize: 40, selectionIntensity: 0, mutant: "Hawk", resident: "Dove", value: 0.03 },
    ], { parameters: { V: 2, C: 3 } }));
    expect(claim(r, "neutral")).toMatchObject({ status: "confirmed", computed: { value: 0.025 } });
    expect(claim(r, "wrong").status).toBe("contradicted");
    expect(claim(r, "wrong").message).toBe("A single Hawk among 39 residents playing Dove fixes with probability 0.025 (Moran process, selection intensity 0); the claim says 0.03, a difference of 0.005 (tolerance 1e-6).");
  });

  it("fixation probability that is undefined for the values given is inconclusive", () => {
    // fitness 1 - w + w * payoff turns negative with payoffs of -10 at w = 1
    const r = verifySpec(spec({ kind: "symmetric", strategies: ["a", "b"], payoffs: [[-10, -10], [-10, -10]] }, [
      { id: "neg", kind: "fixation-probability", populationSize: 10, selectionIntensity: 1, mutant: "a", resident: "b", value: 0.1 },
    ]));
    expect(claim(r, "neg").status).toBe("inconclusive");
    expect(claim(r, "neg").message).toMatch(/^The fixation probability is not defined for these values: /);
  });

  it("two populations: Nash claims, rest points with ess null", () => {
    const r = verifySpec(spec({
      kind: "bimatrix",
      populations: [{ name: "buyers", strategies: ["inspect", "trust"] }, { name: "sellers", strategies: ["honest", "cheat"] }],
      payoffs: [[[1, 0], [2, -1]], [[1, 1], [0, 3]]],
    }, [
      { id: "mixed", kind: "nash-equilibrium", state: [[0.666667, 0.333333], [0.5, 0.5]] },
      { id: "mixed-rest", kind: "rest-point", state: [[0.666667, 0.333333], [0.5, 0.5]], stability: "asymptotically-stable" },
      { id: "count", kind: "rest-point-count", count: 5 },
    ]));
    expect(claim(r, "mixed").status).toBe("confirmed");
    expect(claim(r, "mixed-rest").status).not.toBe("confirmed");
    expect(claim(r, "count").status).toBe("confirmed");
    expect(r.restPoints).toHaveLength(5);
    expect(r.restPoints?.every((p) => p.ess === null)).toBe(true);
    expect(r.restPoints?.find((p) => p.support.length === 4)?.state).toEqual([[0.666666666667, 0.333333333333], [0.5, 0.5]]);
  });

  it("games above 20 strategies: no rest-point list, counts inconclusive, single states still decided", () => {
    const n = 21;
    // a coordination game: the identity matrix, whose barycentre is a rest point
    const payoffs = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
    const r = verifySpec(spec({ kind: "symmetric", strategies: payoffs.map((_, i) => `s${i}`), payoffs }, [
      { id: "count", kind: "rest-point-count", count: 2 ** n - 1 },
      { id: "centre", kind: "rest-point", state: new Array(n).fill(1 / n), stability: "unstable" },
      { id: "vertex", kind: "ess", state: [1, ...new Array(n - 1).fill(0)] },
    ]));
    expect(r.restPoints).toBeUndefined();
    expect(claim(r, "count").status).toBe("inconclusive");
    expect(claim(r, "count").message).toMatch(/too large for a complete enumeration/);
    expect(claim(r, "centre").status).toBe("confirmed");
    expect(claim(r, "vertex").status).toBe("confirmed");
    expect(r.notes?.[0]).toMatch(/too large for a complete enumeration of rest points \(more than 20 strategies\)/);
  });

  it("games above 20 strategies: a state on a continuum is inconclusive", () => {
    const n = 21;
    // strategies s0 and s1 are identical, so the whole edge between them is at rest
    const group = (i: number): number => Math.max(0, i - 1);
    const payoffs = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (group(i) === group(j) ? 1 : 0)));
    const r = verifySpec(spec({ kind: "symmetric", strategies: payoffs.map((_, i) => `s${i}`), payoffs }, [
      { id: "edge", kind: "rest-point", state: [0.5, 0.5, ...new Array(n - 2).fill(0)] },
    ]));
    expect(claim(r, "edge").status).toBe("inconclusive");
    expect(claim(r, "edge").message).toBe("The state lies near a face (support s0, s1) whose rest points form a continuum or could not be resolved.");
  });

  it("other dynamics: rest points by Newton from the claimed state (logit dynamics of hawk-dove)", () => {
    const r = verifySpec(spec(hawkDove, [{ id: "logit-mixed", kind: "rest-point", state: [0.65, 0.35], tolerance: 0.05, stability: "asymptotically-stable" }], {
      parameters: { V: 2, C: 3 },
      dynamics: { kind: "logit", noise: 0.1 },
    }));
    const c = claim(r, "logit-mixed");
    expect(c.status).toBe("confirmed");
    // the logit rest point solves x = softmax(f(x)/eta): check that independently here
    const x = (c.computed as { state: number[] }).state;
    const [h = 0, d = 0] = x;
    const fH = -0.5 * h + 2 * d;
    const fD = 1 * d;
    const share = 1 / (1 + Math.exp((fD - fH) / 0.1));
    expectClose(h, share, 1e-9, 1e-11);
    expect(r.notes?.join(" ")).toMatch(/Rest points of the logit dynamics were located by Newton's method/);
    const count = verifySpec(spec(hawkDove, [{ id: "count", kind: "rest-point-count", count: 3 }], { parameters: { V: 2, C: 3 }, dynamics: { kind: "logit", noise: 0.1 } }));
    expect(claim(count, "count").message).toBe("Support enumeration finds 3 isolated rest points of the replicator dynamics (counts always refer to it), as claimed.");
  });

  it("BNN and Smith dynamics: stability at a kink is inconclusive, existence is still decided", () => {
    for (const kind of ["brown-von-neumann-nash", "smith"]) {
      const r = verifySpec(spec(rps(2, 1), [
        { id: "centre", kind: "rest-point", state: [1 / 3, 1 / 3, 1 / 3], stability: "asymptotically-stable" },
        { id: "centre-exists", kind: "rest-point", state: [1 / 3, 1 / 3, 1 / 3] },
      ], { dynamics: { kind } }));
      expect(claim(r, "centre").status).toBe("inconclusive");
      expect(claim(r, "centre").message).toMatch(new RegExp(`^The claimed state is a rest point, but the ${kind} dynamics is not differentiable there \\((Rock earns exactly the average payoff|Rock and Paper earn the same), where the switching rate has a kink\\), so linearisation decides nothing about its stability\\.$`));
      expect(claim(r, "centre-exists").status).toBe("confirmed");
      expect(r.notes?.join(" ")).toMatch(/stability claims at such rest points are left inconclusive/);
    }
    // At pure Hawk of a hawk-dove game with V > C Dove earns less: the field is smooth there, and
    // with x the hawk share it reads x' = (1-x)^2 (f_H - f_D) (derived here), so the eigenvalue is 0.
    const hd = verifySpec(spec(hawkDove, [{ id: "hawk", kind: "rest-point", state: [1, 0], stability: "non-hyperbolic" }], {
      parameters: { V: 3, C: 1 },
      dynamics: { kind: "brown-von-neumann-nash" },
    }));
    expect(claim(hd, "hawk").status).toBe("confirmed");
  });

  it("a run beyond its step budget leaves its claims inconclusive with budget exceeded", () => {
    const r = verifySpec(spec(hawkDove, [{ id: "final", kind: "final-state", experiment: "run", state: [0.666667, 0.333333] }], {
      parameters: { V: 2, C: 3 },
      experiments: [{ id: "run", initial: [0.1, 0.9], duration: 1000 }],
    }), { budget: { maxSteps: 5 } });
    expect(claim(r, "final").status).toBe("inconclusive");
    expect(claim(r, "final").message).toMatch(/^The run of experiment "run" did not finish: .*budget exceeded/);
    expect(r.experiments[0]?.error).toMatch(/budget exceeded/);
    expect(r.verdict).toBe("inconclusive");
  });

  it("a wall-clock budget already spent leaves enumeration claims inconclusive", () => {
    const r = verifySpec(spec(rps(2, 1), [{ id: "count", kind: "rest-point-count", count: 4 }]), { budget: { wallClockMs: -1 } });
    expect(claim(r, "count").status).toBe("inconclusive");
    expect(claim(r, "count").message).toMatch(/^Not decided: budget exceeded/);
    expect(r.notes?.join(" ")).toMatch(/The run's work budget was exhausted/);
    expect(r.notes?.[0]).toMatch(/The enumeration of rest points stopped: budget exceeded/);
  });
});
