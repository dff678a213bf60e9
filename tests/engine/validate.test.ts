import { describe, expect, it } from "vitest";
import { MAX_INPUT_BYTES, orcidChecksumValid, validateSpec } from "@/lib/engine/validate";
import type { SpecError } from "@/lib/engine/types";

type Json = Record<string, unknown>;

/** A small valid spec: a contest over a resource of value V at fight cost C. */
function base(): Json {
  return {
    format: "restpoint/model@1",
    title: "Contest over a resource",
    parameters: { V: 2, C: 3 },
    game: { kind: "symmetric", strategies: ["Hawk", "Dove"], payoffs: [["(V - C) / 2", "V"], [0, "V / 2"]] },
    experiments: [{ id: "run", initial: [0.1, 0.9], duration: 10 }],
    claims: [{ id: "mixed", kind: "rest-point", state: [0.666667, 0.333333] }],
  };
}

function bimatrix(): Json {
  return {
    format: "restpoint/model@1",
    title: "Buyers and sellers",
    game: {
      kind: "bimatrix",
      populations: [
        { name: "buyers", strategies: ["inspect", "trust"] },
        { name: "sellers", strategies: ["honest", "cheat"] },
      ],
      payoffs: [
        [[1, 0], [2, -1]],
        [[1, 0], [0, 2]],
      ],
    },
    experiments: [{ id: "run", initial: [[0.5, 0.5], [0.5, 0.5]], duration: 10 }],
    claims: [{ id: "mixed", kind: "nash-equilibrium", state: [[0.5, 0.5], [0.5, 0.5]] }],
  };
}

function edit(spec: Json, f: (s: Json) => void): Json {
  const copy = structuredClone(spec);
  f(copy);
  return copy;
}

/** Sets a value by JSON pointer (creating nothing): the test's own small helper. */
function set(spec: Json, pointer: string, value: unknown): Json {
  return edit(spec, (s) => {
    const parts = pointer.split("/").slice(1);
    let v: unknown = s;
    for (const p of parts.slice(0, -1)) v = (v as Record<string, unknown>)[p];
    const last = parts[parts.length - 1] ?? "";
    if (value === undefined) delete (v as Record<string, unknown>)[last];
    else (v as Record<string, unknown>)[last] = value;
  });
}

function only(errors: SpecError[]): SpecError {
  expect(errors, JSON.stringify(errors)).toHaveLength(1);
  const e = errors[0];
  if (e === undefined) throw new Error("no error");
  return e;
}

describe("validateSpec: valid specs", () => {
  it("accepts the small specs and the published example", async () => {
    expect(validateSpec(base())).toEqual([]);
    expect(validateSpec(bimatrix())).toEqual([]);
    const example = (await import("@/schemas/examples/fog-dune-beetles.json")).default;
    expect(validateSpec(example)).toEqual([]);
  });

  it("accepts shares that sum to 1 within 1e-9", () => {
    expect(validateSpec(set(base(), "/claims/0/state", [0.6666666666, 0.3333333333]))).toEqual([]);
  });
});

describe("validateSpec: schema errors, each with a pointer and a sentence", () => {
  it.each<[string, (s: Json) => Json, string, RegExp]>([
    ["wrong format", (s) => set(s, "/format", "restpoint/model@2"), "/format", /The format must be "restpoint\/model@1"; this file says "restpoint\/model@2"\./],
    ["missing title", (s) => set(s, "/title", undefined), "/title", /The field "title" is required here but missing\./],
    ["unknown field", (s) => set(s, "/colour", "red"), "/colour", /"colour" is not a field the format knows here/],
    ["empty title", (s) => set(s, "/title", ""), "/title", /"title" must not be empty\./],
    ["long title", (s) => set(s, "/title", "t".repeat(301)), "/title", /"title" is 301 characters long; at most 300 are allowed\./],
    ["unknown game kind", (s) => set(s, "/game/kind", "asymmetric"), "/game/kind", /Unknown game kind "asymmetric"; use one of symmetric, bimatrix\./],
    ["game kind not a string", (s) => set(s, "/game/kind", 3), "/game/kind", /The game kind must be a string: one of symmetric, bimatrix\./],
    ["unknown dynamics kind", (s) => set(s, "/dynamics", { kind: "best-reply" }), "/dynamics/kind", /Unknown dynamics kind "best-reply"; use one of replicator, replicator-mutator, logit, brown-von-neumann-nash, smith\./],
    ["dynamics without its parameter", (s) => set(s, "/dynamics", { kind: "logit" }), "/dynamics/noise", /The field "noise" is required here but missing\./],
    ["unknown claim kind", (s) => set(s, "/claims/0/kind", "cycle"), "/claims/0/kind", /Unknown claim kind "cycle"; use one of rest-point, nash-equilibrium, ess, rest-point-count, final-state, trajectory, fixation-probability\./],
    ["stability not in the list", (s) => set(s, "/claims/0/stability", "stable"), "/claims/0/stability", /"stability" must be one of "asymptotically-stable", "unstable", "non-hyperbolic"\./],
    ["no claims", (s) => set(s, "/claims", []), "/claims", /The spec must make at least one claim\./],
    ["claims not a list", (s) => set(s, "/claims", {}), "/claims", /"claims" must be a list\./],
    ["game not an object", (s) => set(s, "/game", 3), "/game", /"game" must be an object\./],
    ["parameter not a number", (s) => set(s, "/parameters/V", "2"), "/parameters/V", /"V" must be a number\./],
    ["samples not whole", (s) => set(s, "/experiments/0/samples", 2.5), "/experiments/0/samples", /"samples" must be a whole number\./],
    ["samples over 10001", (s) => set(s, "/experiments/0/samples", 10002), "/experiments/0/samples", /An experiment may ask for at most 10001 samples; this one asks for 10002\./],
    ["samples below 2", (s) => set(s, "/experiments/0/samples", 1), "/experiments/0/samples", /"samples" must be at least 2; it is 1\./],
    ["duration over 1e6", (s) => set(s, "/experiments/0/duration", 1e6 + 1), "/experiments/0/duration", /The duration 1000001 is too long: runs are limited to 1000000 time units\./],
    ["duration zero", (s) => set(s, "/experiments/0/duration", 0), "/experiments/0/duration", /"duration" must be greater than 0; it is 0\./],
    ["share above 1", (s) => set(s, "/claims/0/state", [1.5, 0]), "/claims/0/state/0", /A share must lie between 0 and 1; this one is 1.5\./],
    ["too many strategies", (s) => set(s, "/game/strategies", Array.from({ length: 25 }, (_, i) => `s${i}`)), "/game/strategies", /The game has 25 strategies; the engine handles at most 24\./],
    ["too few strategies", (s) => set(s, "/game/strategies", ["only"]), "/game/strategies", /A game needs at least 2 strategies; this one has 1\./],
    ["duplicate strategy", (s) => set(s, "/game/strategies", ["Hawk", "Hawk"]), "/game/strategies/1", /Strategy names must be unique; "Hawk" appears twice\./],
    ["long expression", (s) => set(s, "/game/payoffs/0/1", "V+".repeat(300) + "1"), "/game/payoffs/0/1", /The expression is 601 characters long; payoff expressions are limited to 500 characters\./],
    ["empty expression", (s) => set(s, "/game/payoffs/0/1", ""), "/game/payoffs/0/1", /A payoff expression must not be empty\./],
    ["payoff of the wrong type", (s) => set(s, "/game/payoffs/0/1", true), "/game/payoffs/0/1", /A payoff must be a number or an expression string over the parameters\./],
    ["state of the wrong form", (s) => set(s, "/claims/0/state", "half"), "/claims/0/state", /"state" must be a list\./],
    ["population list that is no list", (s) => set(s, "/claims/0/state", [[0.5, 0.5], 1]), "/claims/0/state/1", /Entry 2 of "state" must be a list\./],
    ["bad claim id", (s) => set(s, "/claims/0/id", "Mixed Point"), "/claims/0/id", /"Mixed Point" is not a valid identifier here: use lower-case letters, digits and single hyphens/],
    ["bad parameter name", (s) => set(s, "/parameters", { "1x": 2 }), "/parameters/1x", /"1x" is not a valid parameter name: it must start with a letter/],
    ["too many parameters", (s) => set(s, "/parameters", Object.fromEntries(Array.from({ length: 201 }, (_, i) => [`p${i}`, i]))), "/parameters", /"parameters" may have at most 200 entries\./],
    ["bad ORCID pattern", (s) => set(s, "/authors", [{ name: "A", orcid: "1234" }]), "/authors/0/orcid", /"1234" is not an ORCID iD; write it as four groups of four digits/],
    ["bad DOI", (s) => set(s, "/manuscript", { doi: "doi:10.1/x" }), "/manuscript/doi", /"doi:10.1\/x" is not a DOI; a DOI starts with 10\./],
    ["URL without http", (s) => set(s, "/manuscript", { url: "ftp://example.org/a" }), "/manuscript/url", /"ftp:\/\/example.org\/a" must be an http or https address\./],
    ["URL that is no URI", (s) => set(s, "/manuscript", { url: "https://exa mple.org" }), "/manuscript/url", /"https:\/\/exa mple.org" is not a valid web address\./],
    ["population size over 100000", (s) => set(s, "/claims/0", { id: "fix", kind: "fixation-probability", populationSize: 100001, selectionIntensity: 0.1, mutant: "Hawk", resident: "Dove", value: 0.1 }), "/claims/0/populationSize", /The population size must be from 2 to 100000; it is 100001\./],
    ["trajectory without points", (s) => set(s, "/claims/0", { id: "t", kind: "trajectory", experiment: "run", points: [] }), "/claims/0/points", /"points" must have at least 1 entries; it has 0\./],
  ])("%s", (_name, mutate, path, message) => {
    const e = only(validateSpec(mutate(base())));
    expect(e.path).toBe(path);
    expect(e.message).toMatch(message);
  });

  it("refuses input nested too deeply before applying the schema", () => {
    let deep: unknown = 1;
    for (let i = 0; i < 10_000; i++) deep = [deep];
    const e = only(validateSpec(set(base(), "/summary", deep)));
    expect(e).toEqual({ path: "", message: "The JSON is nested more than 64 levels deep; a model spec never needs that, so it is refused." });
  });

  it("reports the root of a non-object", () => {
    expect(only(validateSpec(42))).toEqual({ path: "", message: "The spec must be an object." });
  });
});

describe("validateSpec: semantic rules", () => {
  it.each<[string, () => Json, string, RegExp]>([
    ["ORCID check digit", () => set(base(), "/authors", [{ name: "A", orcid: "0000-0002-1825-0098" }]), "/authors/0/orcid", /The ORCID iD 0000-0002-1825-0098 has a wrong check digit \(ISO 7064 MOD 11-2\)/],
    ["missing row", () => set(base(), "/game/payoffs", [[1, 2]]), "/game/payoffs", /The payoff matrix must have 2 rows \(one per strategy\); it has 1\./],
    ["short row", () => set(base(), "/game/payoffs/1", [0]), "/game/payoffs/1", /Row 2 of the payoff matrix must have 2 entries \(one per strategy\); it has 1\./],
    ["bimatrix row of the wrong length", () => set(bimatrix(), "/game/payoffs/1/0", [1, 0, 3]), "/game/payoffs/1/0", /Row 1 of the payoff matrix of sellers must have 2 entries \(one per strategy of buyers\); it has 3\./],
    ["override of an undefined parameter", () => set(base(), "/claims/0/parameters", { W: 1 }), "/claims/0/parameters/W", /"W" overrides a parameter the spec does not define/],
    ["expression with an unknown parameter", () => set(base(), "/game/payoffs/1/0", "W"), "/game/payoffs/1/0", /uses "W", which is not one of the spec's parameters \(C, V\)/],
    ["hostile expression", () => set(base(), "/game/payoffs/1/0", 'import({})'), "/game/payoffs/1/0", /The function "import" is not allowed/],
    ["payoff infinite at the spec's parameters", () => set(base(), "/game/payoffs/1/0", "V / (C - 3)"), "/game/payoffs/1/0", /is infinite at the parameter values C = 3, V = 2\./],
    ["duplicate experiment id", () => edit(base(), (s) => (s.experiments as unknown[]).push({ id: "run", initial: [1, 0], duration: 1 })), "/experiments/1/id", /The experiment id "run" is used twice; ids must be unique\./],
    ["duplicate claim id", () => edit(base(), (s) => (s.claims as unknown[]).push({ id: "mixed", kind: "rest-point-count", count: 3 })), "/claims/1/id", /The claim id "mixed" is used twice; ids must be unique\./],
    ["state not summing to 1", () => set(base(), "/experiments/0/initial", [0.5, 0.4]), "/experiments/0/initial", /The shares of the state must sum to 1 \(within 1e-9\); they sum to 0.9\./],
    ["state with the wrong number of shares", () => set(base(), "/claims/0/state", [0.5, 0.25, 0.25]), "/claims/0/state", /The state must have 2 shares, one per strategy in order; it has 3\./],
    ["pair of lists in a symmetric game", () => set(base(), "/claims/0/state", [[0.5, 0.5], [0.5, 0.5]]), "/claims/0/state", /This is a symmetric game: a state is one list of shares, not a pair of lists\./],
    ["one list in a two-population game", () => set(bimatrix(), "/claims/0/state", [0.5, 0.5]), "/claims/0/state", /This is a two-population game: a state is a pair \[x, y\]/],
    ["population state not summing to 1", () => set(bimatrix(), "/claims/0/state/1", [0.5, 0.6]), "/claims/0/state/1", /The shares of the state of sellers must sum to 1 \(within 1e-9\); they sum to 1.1\./],
    ["population state too short", () => set(bimatrix(), "/claims/0/state/0", [1]), "/claims/0/state/0", /The state of buyers must have 2 shares/],
    ["ESS claim in a two-population game", () => set(bimatrix(), "/claims/0", { id: "e", kind: "ess", state: [0.5, 0.5] }), "/claims/0/kind", /ESS claims apply to symmetric games only/],
    ["missing experiment", () => set(base(), "/claims/0", { id: "f", kind: "final-state", experiment: "other", state: [1, 0] }), "/claims/0/experiment", /The claim refers to the experiment "other", which the spec does not define\./],
    ["trajectory time beyond the run", () => set(base(), "/claims/0", { id: "t", kind: "trajectory", experiment: "run", points: [{ t: 11, state: [1, 0] }] }), "/claims/0/points/0/t", /The time 11 lies beyond the end of the experiment "run" \(duration 10\)\./],
    ["fixation in a two-population game", () => set(bimatrix(), "/claims/0", { id: "f", kind: "fixation-probability", populationSize: 10, selectionIntensity: 0.1, mutant: "inspect", resident: "trust", value: 0.1 }), "/claims/0/kind", /Fixation-probability claims apply to symmetric games only/],
    ["unknown mutant", () => set(base(), "/claims/0", { id: "f", kind: "fixation-probability", populationSize: 10, selectionIntensity: 0.1, mutant: "Owl", resident: "Dove", value: 0.1 }), "/claims/0/mutant", /The mutant "Owl" is not one of the game's strategies \(Hawk, Dove\)\./],
    ["mutant equal to the resident", () => set(base(), "/claims/0", { id: "f", kind: "fixation-probability", populationSize: 10, selectionIntensity: 0.1, mutant: "Dove", resident: "Dove", value: 0.1 }), "/claims/0/resident", /The mutant and the resident must be different strategies\./],
  ])("%s", (_name, make, path, message) => {
    const e = only(validateSpec(make()));
    expect(e.path).toBe(path);
    expect(e.message).toMatch(message);
  });

  it("refuses payoffs that are NaN only under a claim's parameters, naming the claim", () => {
    // sqrt(C - 4) is finite at the spec's C = 5 and NaN at the claim's C = 3.
    const spec = set(set(set(base(), "/game/payoffs/1/0", "sqrt(C - 4)"), "/parameters/C", 5), "/claims/0/parameters", { C: 3 });
    const e = only(validateSpec(spec));
    expect(e.path).toBe("/game/payoffs/1/0");
    expect(e.message).toMatch(/is not a number \(NaN\) at the parameter values C = 3, V = 2 with the parameters of claim "mixed"\./);
  });

  it("refuses payoffs that are infinite only under an experiment's parameters, naming the experiment", () => {
    const spec = set(set(base(), "/game/payoffs/1/0", "1 / (C - 4)"), "/experiments/0/parameters", { C: 4 });
    const e = only(validateSpec(spec));
    expect(e.path).toBe("/game/payoffs/1/0");
    expect(e.message).toMatch(/is infinite at the parameter values C = 4, V = 2 with the parameters of experiment "run"\./);
  });

  it("checks ORCID check digits by ISO 7064 MOD 11-2", () => {
    // ORCID's own documented example iDs (orcid.org support pages): 0000-0002-1825-0097 and 0000-0001-5109-3700; X as check digit: 0000-0002-1694-233X
    expect(orcidChecksumValid("0000-0002-1825-0097")).toBe(true);
    expect(orcidChecksumValid("0000-0001-5109-3700")).toBe(true);
    expect(orcidChecksumValid("0000-0002-1694-233X")).toBe(true);
    expect(orcidChecksumValid("0000-0002-1694-2330")).toBe(false);
  });

  it("states the 1 MB input limit as a constant the text path uses", () => {
    expect(MAX_INPUT_BYTES).toBe(1_000_000);
  });
});

describe("validateSpec runs in the browser too", () => {
  it("imports nothing from Node, directly or through the engine modules it uses", async () => {
    const { readFileSync } = await import("node:fs");
    const seen = new Set<string>();
    const visit = (file: string): void => {
      if (seen.has(file)) return;
      seen.add(file);
      const text = readFileSync(file, "utf8");
      for (const m of text.matchAll(/^import[^"']*["']([^"']+)["']/gm)) {
        const spec = m[1] ?? "";
        expect(spec.startsWith("node:"), `${file} imports ${spec}`).toBe(false);
        if (spec.startsWith("./")) visit(`lib/engine/${spec.slice(2)}.ts`);
      }
    };
    visit("lib/engine/validate.ts");
    expect(seen.size).toBeGreaterThanOrEqual(4);
  });
});

describe("validateSpec: a spec that fails the schema still gets the safe semantic checks", () => {
  // An invented scenario: grazing herds choosing between an upland and a lowland pasture.
  function pasture(): Json {
    return {
      format: "restpoint/model@1",
      title: "Upland or lowland grazing",
      parameters: { g: 2, t: 1 },
      game: { kind: "symmetric", strategies: ["Upland", "Lowland"], payoffs: [["g - t", "g"], [1, "g / 2"]] },
      experiments: [{ id: "spring", initial: [0.3, 0.7], duration: 20 }],
      claims: [
        { id: "split", kind: "rest-point", state: [0.7, 0.5] },
        { id: "uplands", kind: "final-state", experiment: "spring", state: [1, 0] },
      ],
    };
  }

  it("lists the schema error and a state summing to 1.2 in one round, in the order of the file", () => {
    const spec = edit(pasture(), (s) => {
      (s.claims as Json[])[1] = { ...((s.claims as Json[])[1] as Json), colour: "green" };
    });
    const errors = validateSpec(spec);
    expect(errors).toEqual([
      { path: "/claims/0/state", message: "The shares of the state must sum to 1 (within 1e-9); they sum to 1.2." },
      { path: "/claims/1/colour", message: '"colour" is not a field the format knows here; check its spelling or remove it.' },
    ]);
  });

  it("checks only the parts that passed: nothing is said about a claim or a state that failed the schema", () => {
    const spec = edit(pasture(), (s) => {
      // A share above 1 fails the schema; the sum of that state is not judged again.
      ((s.claims as Json[])[0] as Json).state = [1.5, -0.3];
      (s.experiments as Json[])[0] = { id: "spring", initial: [0.5, 0.6], duration: 20 };
      s.title = 7;
    });
    const paths = validateSpec(spec).map((e) => e.path);
    // In the order of the file: title, then experiments, then claims.
    expect(paths).toEqual(["/title", "/experiments/0/initial", "/claims/0/state/0", "/claims/0/state/1"]);
    expect(validateSpec(spec).find((e) => e.path === "/experiments/0/initial")?.message).toBe(
      "The shares of the state must sum to 1 (within 1e-9); they sum to 1.1.",
    );
  });

  it("skips the checks that read a game that failed the schema, and still reports duplicate claim ids and ORCID check digits", () => {
    const spec = edit(pasture(), (s) => {
      (s.game as Json).strategies = ["Upland"]; // too few: the game fails the schema
      (s.claims as Json[])[1] = { id: "split", kind: "rest-point", state: [0.5, 0.5] };
      s.authors = [{ name: "R. Moorland", orcid: "0000-0002-1825-0098" }];
    });
    const errors = validateSpec(spec);
    // "authors" was added last, so it comes last.
    expect(errors.map((e) => e.path)).toEqual(["/game/strategies", "/claims/1/id", "/authors/0/orcid"]);
    expect(errors[2]?.message).toBe("The ORCID iD 0000-0002-1825-0098 has a wrong check digit (ISO 7064 MOD 11-2); it is probably mistyped.");
    expect(errors[1]?.message).toBe('The claim id "split" is used twice; ids must be unique.');
  });

  it("does not call an experiment missing when the one meant failed the schema", () => {
    const spec = edit(pasture(), (s) => {
      (s.experiments as Json[])[0] = { id: "spring", initial: [0.3, 0.7], duration: -1 };
    });
    const errors = validateSpec(spec);
    expect(errors.map((e) => e.path)).toEqual(["/experiments/0/duration", "/claims/0/state"]);
  });

  it("reports a missing game once, without checking states against it", () => {
    const spec = edit(pasture(), (s) => {
      delete s.game;
    });
    expect(validateSpec(spec)).toEqual([{ path: "/game", message: 'The field "game" is required here but missing.' }]);
  });

  it("orders pointers by array index, not as text, and keeps each problem once", () => {
    const spec = edit(pasture(), (s) => {
      const claims = s.claims as Json[];
      for (let i = 0; i < 10; i++) claims.push({ id: `c${i}`, kind: "rest-point", state: [0.5, 0.5] });
      (claims[11] as Json).state = [0.9, 0.9];
      (claims[2] as Json).typo = true;
    });
    const errors = validateSpec(spec);
    expect(errors.map((e) => e.path)).toEqual(["/claims/0/state", "/claims/2/typo", "/claims/11/state"]);
    expect(new Set(errors.map((e) => `${e.path} ${e.message}`)).size).toBe(errors.length);
  });
});
