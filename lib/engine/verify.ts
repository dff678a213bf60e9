/**
 * The verification run: a model spec in, a `restpoint/report@1` out. Validates, evaluates
 * the payoffs, enumerates the replicator's rest points, runs the experiments and decides
 * every claim. The report depends on nothing but the spec (no clock, no randomness in the
 * output) and its numbers are rounded to 12 significant digits, so repeated runs give
 * byte-identical JSON.
 */
import { analyzeGame, layoutOf, type Analysis } from "./analysis";
import { Budget, BudgetExceeded, type BudgetLimits } from "./budget";
import { sha256Hex, specSha256 } from "./canonical";
import { MAX_DEPTH, jsonDepth } from "./json-depth";
import { decideClaim, flatten, type ClaimContext, type RunOutcome } from "./claims";
import { vectorField } from "./dynamics";
import { integrate } from "./integrate";
import { compileGame } from "./payoffs";
import { MAX_ENUMERATED_BIMATRIX, MAX_ENUMERATED_STRATEGIES } from "./restpoints";
import { NONHYPERBOLIC_BAND } from "./stability";
import { BEST_REPLY_TOLERANCE } from "./nash";
import { FORM_TOLERANCE } from "./ess";
import {
  REPORT_FORMAT,
  type ClaimResult,
  type CompiledGame,
  type DynamicsSpec,
  type ExperimentReport,
  type ModelSpec,
  type Parameters,
  type Report,
  type RestPointReport,
  type SpecError,
  type State,
  type Verdict,
} from "./types";
import { MAX_INPUT_BYTES, validateSpec } from "./validate";
import { ENGINE_VERSION } from "./version";
import { jsonErrorOffset, lineAndColumn } from "./json-position";
import { round12, roundEigenvalues } from "./rounding";

export { ENGINE_VERSION };

/** Options of a verification run. */
export interface VerifyOptions {
  budget?: BudgetLimits;
}

/** Integrator tolerances and sample count when the spec gives none (the format's defaults). */
export const DEFAULT_RELATIVE_TOLERANCE = 1e-10;
export const DEFAULT_ABSOLUTE_TOLERANCE = 1e-12;
export const DEFAULT_SAMPLES = 201;

function presentFlat(game: CompiledGame, x: ArrayLike<number>): State {
  const r = Array.from(x, (v) => round12(v));
  if (game.kind === "symmetric") return r;
  return [r.slice(0, game.m), r.slice(game.m, game.m + game.k)];
}

function key(params: Parameters | undefined): string {
  if (params === undefined) return "";
  return JSON.stringify(Object.keys(params).sort().map((k) => [k, params[k]]));
}

function invalidReport(sha: string, errors: SpecError[]): Report {
  return {
    format: REPORT_FORMAT,
    specSha256: sha,
    engine: { version: ENGINE_VERSION },
    verdict: "invalid",
    errors,
    claims: [],
    experiments: [],
    notes: ["The spec was not run because it is invalid; each error names the JSON pointer of the offending value."],
  };
}

/**
 * An invalid report for input that never became a JSON value (unreadable file, bytes that
 * are not UTF-8): specSha256 is the SHA-256 of the raw bytes as given.
 */
export function refusedInputReport(raw: string | Uint8Array, message: string): Report {
  return invalidReport(sha256Hex(raw), [{ path: "", message }]);
}

function verdictOf(claims: ClaimResult[]): Verdict {
  if (claims.some((c) => c.status === "contradicted")) return "contradicted";
  if (claims.some((c) => c.status === "inconclusive")) return "inconclusive";
  return "confirmed";
}

/**
 * Verifies a parsed spec (any JSON value) and returns the report. Never throws for bad
 * input: an invalid spec gives verdict "invalid" with errors.
 */
export function verifySpec(input: unknown, options: VerifyOptions = {}): Report {
  return verifyValue(input, undefined, options);
}

/**
 * Verifies a spec given as JSON text. Text over MAX_INPUT_BYTES is refused before parsing,
 * and text that is not JSON gives an invalid report; in both cases specSha256 is the
 * SHA-256 of the raw UTF-8 bytes, since there is no JSON value to canonicalise.
 */
export function verifySpecText(text: string, options: VerifyOptions = {}): Report {
  const bytes = utf8Length(text);
  if (bytes > MAX_INPUT_BYTES) {
    return invalidReport(sha256Hex(text), [
      { path: "", message: `The spec is ${bytes} bytes long; specs are limited to ${MAX_INPUT_BYTES} bytes (1 MB), so it was not read.` },
    ]);
  }
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  let value: unknown;
  try {
    value = JSON.parse(body);
  } catch {
    if (body.trim() === "") return invalidReport(sha256Hex(text), [{ path: "", message: "The file is empty; a spec is a JSON object." }]);
    const offset = jsonErrorOffset(body);
    const at = offset < 0 ? undefined : lineAndColumn(body, offset);
    const where = at === undefined ? "" : offset >= body.length ? " (the text ends too early)" : ` at line ${at.line}, column ${at.column}, near ${JSON.stringify(body.slice(offset, offset + 12))}`;
    const error: SpecError = { path: "", message: `The file is not valid JSON${where}.` };
    if (at !== undefined) error.line = at.line;
    return invalidReport(sha256Hex(text), [error]);
  }
  return verifyValue(value, text, options);
}

/** UTF-8 byte length without encoding the text. */
function utf8Length(text: string): number {
  let n = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) n += 1;
    else if (c < 0x800) n += 2;
    else if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length) {
      n += 4;
      i++;
    } else n += 3;
  }
  return n;
}

function hashOf(input: unknown, raw: string | undefined): string {
  if (jsonDepth(input, MAX_DEPTH) > MAX_DEPTH) return sha256Hex(raw ?? "");
  try {
    return specSha256(input);
  } catch {
    // undefined, functions or non-finite numbers (possible only from a caller passing objects, not JSON text)
    return sha256Hex(raw ?? "");
  }
}

function verifyValue(input: unknown, raw: string | undefined, options: VerifyOptions): Report {
  const sha = hashOf(input, raw);
  const errors = validateSpec(input);
  if (errors.length > 0) return invalidReport(sha, errors);
  const spec = input as ModelSpec;
  const budget = new Budget(options.budget ?? {});
  return run(spec, sha, budget);
}

function run(spec: ModelSpec, sha: string, budget: Budget): Report {
  const dynamics: DynamicsSpec = spec.dynamics ?? { kind: "replicator" };
  const rtol = spec.numerics?.relativeTolerance ?? DEFAULT_RELATIVE_TOLERANCE;
  const atol = spec.numerics?.absoluteTolerance ?? DEFAULT_ABSOLUTE_TOLERANCE;
  const games = new Map<string, CompiledGame>();
  const analyses = new Map<string, Analysis | BudgetExceeded>();
  const game = (params: Parameters | undefined): CompiledGame => {
    const k = key(params);
    let g = games.get(k);
    if (g === undefined) {
      g = compileGame(spec, params);
      games.set(k, g);
    }
    return g;
  };
  const analysis = (params: Parameters | undefined): Analysis => {
    const k = key(params);
    let a = analyses.get(k);
    if (a === undefined) {
      try {
        a = analyzeGame(game(params), budget);
      } catch (e) {
        if (!(e instanceof BudgetExceeded)) throw e;
        a = e;
      }
      analyses.set(k, a);
    }
    if (a instanceof BudgetExceeded) throw a;
    return a;
  };

  const base = game(undefined);
  const layout = layoutOf(base);
  const labels = base.kind === "symmetric" ? base.strategies : [...base.populations[0].strategies, ...base.populations[1].strategies];
  const experiments = spec.experiments ?? [];

  const integrateOnce = (id: string, params: Parameters | undefined, queryTimes: number[]): RunOutcome => {
    const ex = experiments.find((e) => e.id === id);
    if (ex === undefined) return { times: [], states: [], queries: [], error: `there is no experiment "${id}".` };
    const merged = ex.parameters === undefined && params === undefined ? undefined : { ...(ex.parameters ?? {}), ...(params ?? {}) };
    const g = game(merged);
    try {
      const res = integrate(vectorField(g, dynamics), flatten(ex.initial), {
        duration: ex.duration,
        samples: ex.samples ?? DEFAULT_SAMPLES,
        queryTimes,
        relativeTolerance: rtol,
        absoluteTolerance: atol,
        budget,
        layout,
        labels,
      });
      if (res.error !== undefined) {
        return { times: res.times, states: res.states, queries: res.queries, error: res.error.message, budgetExceeded: res.error.kind === "budget" };
      }
      return { times: res.times, states: res.states, queries: res.queries };
    } catch (e) {
      if (e instanceof BudgetExceeded) return { times: [], states: [], queries: [], error: e.message, budgetExceeded: true };
      throw e;
    }
  };

  // Each experiment runs once at its own parameters, with every claimed time of the claims that use them.
  const mainRuns = new Map<string, { outcome: RunOutcome; index: Map<number, number> }>();
  for (const ex of experiments) {
    const times: number[] = [];
    for (const c of spec.claims) {
      if (c.kind === "trajectory" && c.experiment === ex.id && c.parameters === undefined) for (const p of c.points) times.push(p.t);
    }
    const unique = [...new Set(times)].sort((a, b) => a - b);
    const outcome = integrateOnce(ex.id, undefined, unique);
    mainRuns.set(ex.id, { outcome, index: new Map(unique.map((t, i) => [t, i])) });
  }

  const ctx: ClaimContext = {
    dynamics,
    budget,
    game,
    analysis,
    present: presentFlat,
    run(experiment, params, queryTimes) {
      const main = mainRuns.get(experiment);
      if (params === undefined && main !== undefined) {
        const queries: Float64Array[] = [];
        for (const t of queryTimes) {
          const q = main.outcome.queries[main.index.get(t) ?? -1];
          if (q !== undefined) queries.push(q);
        }
        return { ...main.outcome, queries };
      }
      return integrateOnce(experiment, params, queryTimes);
    },
  };

  const claims = spec.claims.map((c) => roundClaim(decideClaim(c, ctx)));

  // The report's list of rest points: replicator dynamics at the spec's own parameters.
  let restPoints: RestPointReport[] | undefined;
  let restNote: string;
  const enumerable = base.kind === "symmetric" ? base.n <= MAX_ENUMERATED_STRATEGIES : base.m + base.k <= MAX_ENUMERATED_BIMATRIX;
  if (!enumerable) {
    restNote = `The game is too large for a complete enumeration of rest points (more than ${base.kind === "symmetric" ? MAX_ENUMERATED_STRATEGIES : MAX_ENUMERATED_BIMATRIX} strategies), so the report lists none; claims about single states were decided by solving the system of the state's own support.`;
  } else {
    try {
      const an = analysis(undefined);
      restPoints = an.points.map((p) => ({
        state: presentFlat(base, p.state),
        support: p.support.map((i) => labels[i] ?? String(i)),
        stability: p.stability,
        eigenvalues: roundEigenvalues(p.eigenvalues, p.scale),
        nash: p.nash,
        ess: p.ess === null ? null : p.ess.ess,
      }));
      const faces = base.kind === "symmetric" ? 2 ** base.n - 1 : (2 ** base.m - 1) * (2 ** base.k - 1);
      restNote = `Rest points of the replicator dynamics were found by enumerating all ${faces} supports and solving each face's linear system (Gaussian elimination with partial pivoting; pivots below 1e-12 of the payoff scale count as singular, and singular faces were solved for their full solution set).`;
      if (an.continua.length > 0) restNote += ` The game has a continuum of rest points on ${an.continua.length} face${an.continua.length === 1 ? "" : "s"}; the list holds only the rest points that are the unique solution of their face, and one lying on the boundary of such a face may still belong to the continuum.`;
      if (an.undecided.length > 0) restNote += ` ${an.undecided.length} singular face${an.undecided.length === 1 ? "" : "s"} could not be resolved.`;
    } catch (e) {
      if (!(e instanceof BudgetExceeded)) throw e;
      restNote = `The enumeration of rest points stopped: ${e.message}; the report lists none.`;
    }
  }

  const experimentReports: ExperimentReport[] = experiments.map((ex) => {
    const out = mainRuns.get(ex.id)?.outcome;
    const g = game(ex.parameters);
    const r: ExperimentReport = {
      id: ex.id,
      times: (out?.times ?? []).map(round12),
      states: (out?.states ?? []).map((s) => presentFlat(g, s)),
    };
    if (out?.error !== undefined) r.error = out.error;
    return r;
  });

  const notes = [restNote];
  notes.push(
    `Linear stability was read from the eigenvalues of the Jacobian restricted to the tangent space of the ${base.kind === "symmetric" ? "simplex" : "product of simplices"}; an eigenvalue whose real part lies within ${NONHYPERBOLIC_BAND} times the largest entry of that matrix counts as zero, and such a rest point is reported as non-hyperbolic.`,
  );
  notes.push(
    `A state is a Nash equilibrium when no pure strategy earns more than ${BEST_REPLY_TOLERANCE} times the payoff scale above its population's average; an ESS was decided by Haigh's criterion (negative payoff form on the cone of mutant directions, with a copositivity test when strategies outside the support are alternative best replies; form values within ${FORM_TOLERANCE} of the payoff scale count as zero). A claimed state is first matched to the exact rest point within the claim's tolerance, and that point is tested.`,
  );
  if (dynamics.kind !== "replicator") {
    notes.push(`Rest points of the ${dynamics.kind} dynamics were located by Newton's method on the state space, started from the claimed state, the replicator's rest points and a grid.`);
    if (dynamics.kind === "brown-von-neumann-nash" || dynamics.kind === "smith") {
      notes.push("This dynamics is not differentiable where payoffs tie (as at every mixed Nash equilibrium); stability claims at such rest points are left inconclusive.");
    }
  }
  if (experiments.length > 0) {
    notes.push(
      `Experiments were integrated with odex (Gragg-Bulirsch-Stoer extrapolation, Hairer, Norsett and Wanner) at relative tolerance ${rtol} and absolute tolerance ${atol}; states at claimed times come from the integrator's dense output, and a run fails if it leaves the state space by more than 1e-9.`,
    );
  }
  if (spec.claims.some((c) => c.kind === "fixation-probability")) {
    notes.push("Fixation probabilities were computed in closed form for the frequency-dependent Moran process (Nowak, Sasaki, Taylor and Fudenberg 2004), with the products kept as logarithms.");
  }
  if (claims.some((c) => c.message.includes("budget exceeded"))) {
    notes.push("The run's work budget was exhausted; the claims marked inconclusive for that reason were not decided.");
  }
  notes.push("Reported numbers are rounded to 12 significant digits. A confirmed claim means the engine reproduced it from the spec as written; it is not a peer review of the model or of the manuscript.");

  return {
    format: REPORT_FORMAT,
    specSha256: sha,
    engine: { version: ENGINE_VERSION },
    verdict: verdictOf(claims),
    errors: [],
    claims,
    ...(restPoints === undefined ? {} : { restPoints }),
    experiments: experimentReports,
    notes,
  };
}

function roundClaim(c: ClaimResult): ClaimResult {
  const out: ClaimResult = { id: c.id, kind: c.kind, status: c.status, message: c.message };
  if (c.deviation !== undefined) out.deviation = round12(c.deviation);
  if (c.tolerance !== undefined) out.tolerance = c.tolerance;
  if (c.computed !== undefined) out.computed = roundDeep(c.computed);
  return out;
}

function roundDeep(v: unknown): unknown {
  if (typeof v === "number") return round12(v);
  if (Array.isArray(v)) return v.map(roundDeep);
  if (v !== null && typeof v === "object") {
    const o: Record<string, unknown> = {};
    for (const [k, x] of Object.entries(v)) o[k] = roundDeep(x);
    return o;
  }
  return v;
}
