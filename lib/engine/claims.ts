/**
 * Decision of each claim kind. Every decision names what was computed, the deviation from
 * what was claimed and the tolerance used; anything the engine cannot decide soundly (a
 * continuum of rest points, a non-hyperbolic point, a run beyond its budget) is
 * `inconclusive` with a sentence that says why, never guessed.
 */
import { analyzePoint, type AnalyzedPoint, type Analysis } from "./analysis";
import { BudgetExceeded } from "./budget";
import type { Budget } from "./budget";
import { KINK_BAND, vectorField } from "./dynamics";
import { fixationProbability } from "./moran";
import { findRestPoints } from "./newton";
import { bimatrixNash, symmetricNash } from "./nash";
import { restPointOnSupport } from "./restpoints";
import { roundEigenvalues } from "./rounding";
import { classifyRestPoint } from "./stability";
import {
  stateDimension,
  type Claim,
  type ClaimResult,
  type CompiledGame,
  type DynamicsSpec,
  type Parameters,
  type State,
} from "./types";

/** Default max-norm tolerance of each claim kind (the format's defaults; counts are exact). */
export const DEFAULT_TOLERANCE: Record<Claim["kind"], number> = {
  "rest-point": 1e-6,
  "nash-equilibrium": 1e-6,
  ess: 1e-6,
  "rest-point-count": 0,
  "final-state": 1e-4,
  trajectory: 1e-4,
  "fixation-probability": 1e-6,
};

/** A run of one experiment as the claims see it. */
export interface RunOutcome {
  times: number[];
  states: Float64Array[];
  /** One per requested query time. */
  queries: Float64Array[];
  error?: string;
  budgetExceeded?: boolean;
}

/** What a claim decision may ask of the run (implemented by verify.ts, with caches). */
export interface ClaimContext {
  dynamics: DynamicsSpec;
  budget: Budget;
  game(params: Parameters | undefined): CompiledGame;
  analysis(params: Parameters | undefined): Analysis;
  run(experiment: string, params: Parameters | undefined, queryTimes: number[]): RunOutcome;
  /** Formats a flat state for the report (rounded, [x, y] for two populations). */
  present(game: CompiledGame, x: Float64Array): State;
}

/** Flat Float64Array of a spec state. */
export function flatten(state: State): Float64Array {
  const parts: number[] = [];
  for (const v of state as (number | number[])[]) {
    if (Array.isArray(v)) parts.push(...v);
    else parts.push(v);
  }
  return Float64Array.from(parts);
}

/** Max-norm distance between two flat states. */
export function maxDistance(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let d = 0;
  for (let i = 0; i < a.length; i++) d = Math.max(d, Math.abs((a[i] ?? 0) - (b[i] ?? 0)));
  return d;
}

/** Six significant digits for messages (the report's numbers carry twelve). */
export function fmt(v: number): string {
  if (v === 0) return "0";
  const s = Number(v.toPrecision(6));
  return Math.abs(s) < 1e-3 || Math.abs(s) >= 1e6 ? s.toExponential() : String(s);
}

function supportNames(game: CompiledGame, support: number[]): string {
  const names = game.kind === "symmetric" ? game.strategies : [...game.populations[0].strategies, ...game.populations[1].strategies];
  return support.map((i) => names[i] ?? `#${i + 1}`).join(", ");
}

interface Located {
  point?: AnalyzedPoint;
  deviation?: number;
  /** Set when the answer cannot be given (continuum nearby, degenerate face...). */
  inconclusive?: string;
}

/**
 * The rest point of the replicator dynamics nearest to `x` within `tol`: from the full
 * enumeration when there is one, otherwise by solving the face system of the state's own
 * support exactly (after a Newton search when the claimed support is off).
 */
function locateReplicator(ctx: ClaimContext, params: Parameters | undefined, x: Float64Array, tol: number): Located {
  const an = ctx.analysis(params);
  const game = an.game;
  if (an.enumerated) {
    let best: AnalyzedPoint | undefined;
    let bestD = Infinity;
    for (const p of an.points) {
      const d = maxDistance(p.state, x);
      if (d < bestD) {
        bestD = d;
        best = p;
      }
    }
    if (best !== undefined && bestD <= tol) return { point: best, deviation: bestD };
    const face = [...an.continua, ...an.undecided].find((f) => mayLieOn(game, x, tol, f));
    if (face !== undefined) {
      return {
        inconclusive: `No isolated rest point lies within ${fmt(tol)} of the state, but the game has ${an.continua.includes(face) ? "a continuum of rest points" : "a degenerate face the engine could not resolve"} (support ${supportNames(game, face)}), which the state may lie on.`,
      };
    }
    return { deviation: Number.isFinite(bestD) ? bestD : undefined };
  }
  // Too large to enumerate: solve the face of the claimed support, then of Newton's answer.
  const candidates: number[][] = [];
  const supp = (v: Float64Array, cut: number): number[] => {
    const s: number[] = [];
    v.forEach((xi, i) => {
      if (xi > cut) s.push(i);
    });
    return s;
  };
  candidates.push(supp(x, tol));
  const field = vectorField(game, { kind: "replicator" });
  const found = findRestPoints(field, game.kind === "symmetric" ? [game.n] : [game.m, game.k], [x], ctx.budget, { maxStarts: 1 });
  const first = found[0];
  if (first !== undefined && maxDistance(first, x) <= tol) candidates.push(supp(first, 1e-9));
  for (const s of candidates) {
    const r = restPointOnSupport(game, s);
    if (r.kind === "point") {
      const d = maxDistance(r.state, x);
      if (d <= tol) return { point: analyzePoint(game, r.state, s), deviation: d };
    } else if (r.kind !== "none") {
      return { inconclusive: `The state lies near a face (support ${supportNames(game, s)}) whose rest points form a continuum or could not be resolved.` };
    }
  }
  return {};
}

/**
 * Whether a rest point on the face `support` could lie within `tol` of x: every share
 * outside the face must be at most tol, and the replicator field at x must be small. The
 * field's Lipschitz constant in the max-norm on the state space is at most (2 + 3 dim) M
 * (M the largest |payoff|; from the Jacobian's row sums, derived here), so a field larger
 * than that times tol rules every rest point within tol out.
 */
function mayLieOn(game: CompiledGame, x: Float64Array, tol: number, support: number[]): boolean {
  const inFace = new Set(support);
  for (let i = 0; i < x.length; i++) if (!inFace.has(i) && (x[i] ?? 0) > tol) return false;
  const field = vectorField(game, { kind: "replicator" });
  const out = new Float64Array(field.dim);
  field.rhs(x, out);
  let M = 0;
  for (const P of game.kind === "symmetric" ? [game.A] : [game.A, game.B]) for (const v of P) M = Math.max(M, Math.abs(v));
  let size = 0;
  for (const v of out) size = Math.max(size, Math.abs(v));
  return size <= (2 + 3 * field.dim) * M * tol * (1 + 1e-9) + 1e-15;
}

function words(s: string): string {
  return s === "asymptotically-stable" ? "asymptotically stable" : s;
}

/** Subject of a sentence about the located rest point. */
function restPointAt(deviation: number | undefined): string {
  return (deviation ?? 0) === 0 ? "The claimed state is a rest point and" : `The rest point ${fmt(deviation ?? 0)} from the claimed state`;
}

/**
 * Where BNN and Smith dynamics are not differentiable: a pure strategy whose payoff ties
 * with the mean (BNN's [f_i - phi]+) or with another strategy's payoff in use (Smith's
 * [f_i - f_j]+), within the kink band of dynamics.ts. Linear stability decides nothing
 * there. Returns a phrase naming the tie, or null.
 */
function kinkAt(game: CompiledGame, dynamics: DynamicsSpec, x: Float64Array): string | null {
  if (dynamics.kind !== "brown-von-neumann-nash" && dynamics.kind !== "smith") return null;
  const r = game.kind === "symmetric" ? symmetricNash(game.A, game.n, x) : bimatrixNash(game.A, game.B, game.m, game.k, x);
  let scale = 0;
  for (const M of game.kind === "symmetric" ? [game.A] : [game.A, game.B]) for (const v of M) scale = Math.max(scale, Math.abs(v));
  const band = KINK_BAND * (1 + scale);
  const names = game.kind === "symmetric" ? game.strategies : [...game.populations[0].strategies, ...game.populations[1].strategies];
  const blocks = game.kind === "symmetric" ? [[0, game.n]] : [[0, game.m], [game.m, game.k]];
  for (const [b, [o = 0, size = 0]] of blocks.entries()) {
    for (let i = o; i < o + size; i++) {
      const fi = r.payoffs[i] ?? 0;
      if (dynamics.kind === "brown-von-neumann-nash") {
        if (Math.abs(fi - (r.mean[b] ?? 0)) > band) continue;
        // At a pure state of its population, f_i - phi = sum_j x_j (f_i - f_j) keeps one sign
        // nearby unless some strategy earns more and another less: then no kink is crossed.
        if ((x[i] ?? 0) === 1) {
          let above = false;
          let below = false;
          for (let j = o; j < o + size; j++) {
            if (j === i) continue;
            const d = (r.payoffs[j] ?? 0) - fi;
            if (d > band) above = true;
            if (d < -band) below = true;
          }
          if (!(above && below)) continue;
        }
        return `${names[i] ?? "a strategy"} earns exactly the average payoff`;
      }
      for (let j = i + 1; j < o + size; j++) {
        if (Math.abs(fi - (r.payoffs[j] ?? 0)) <= band && Math.max(x[i] ?? 0, x[j] ?? 0) > 0) return `${names[i] ?? "a strategy"} and ${names[j] ?? "another"} earn the same`;
      }
    }
  }
  return null;
}

function presentEigenvalues(p: { eigenvalues: [number, number][] }): string {
  return p.eigenvalues.map(([re, im]) => (im === 0 ? fmt(re) : `${fmt(re)} ${im < 0 ? "-" : "+"} ${fmt(Math.abs(im))}i`)).join(", ");
}

function budgetResult(claim: Claim, e: BudgetExceeded, tolerance?: number): ClaimResult {
  return { id: claim.id, kind: claim.kind, status: "inconclusive", message: `Not decided: ${e.message}.`, ...(tolerance === undefined ? {} : { tolerance }) };
}

/** Decides one claim. */
export function decideClaim(claim: Claim, ctx: ClaimContext): ClaimResult {
  const tolerance = claim.tolerance ?? DEFAULT_TOLERANCE[claim.kind];
  try {
    switch (claim.kind) {
      case "rest-point":
        return restPointClaim(claim, ctx, tolerance);
      case "nash-equilibrium":
        return nashClaim(claim, ctx, tolerance);
      case "ess":
        return essClaim(claim, ctx, tolerance);
      case "rest-point-count":
        return countClaim(claim, ctx);
      case "final-state":
      case "trajectory":
        return runClaim(claim, ctx, tolerance);
      case "fixation-probability":
        return fixationClaim(claim, ctx, tolerance);
    }
  } catch (e) {
    if (e instanceof BudgetExceeded) return budgetResult(claim, e, claim.kind === "rest-point-count" ? undefined : tolerance);
    throw e;
  }
}

function restPointClaim(claim: Extract<Claim, { kind: "rest-point" }>, ctx: ClaimContext, tolerance: number): ClaimResult {
  const base = { id: claim.id, kind: claim.kind, tolerance } as const;
  const x = flatten(claim.state);
  let point: AnalyzedPoint | undefined;
  let deviation: number | undefined;
  const game = ctx.game(claim.parameters);
  if (ctx.dynamics.kind === "replicator") {
    const loc = locateReplicator(ctx, claim.parameters, x, tolerance);
    if (loc.inconclusive !== undefined) return { ...base, status: "inconclusive", message: loc.inconclusive };
    point = loc.point;
    deviation = loc.deviation;
  } else {
    // Other dynamics: Newton from the claimed state, the replicator's rest points and a grid.
    const an = ctx.analysis(claim.parameters);
    const field = vectorField(game, ctx.dynamics);
    const layout = game.kind === "symmetric" ? [game.n] : [game.m, game.k];
    const found = findRestPoints(field, layout, [x, ...an.points.map((p) => p.state)], ctx.budget);
    let best: Float64Array | undefined;
    let bestD = Infinity;
    for (const f of found) {
      const d = maxDistance(f, x);
      if (d < bestD) {
        bestD = d;
        best = f;
      }
    }
    deviation = Number.isFinite(bestD) ? bestD : undefined;
    if (best !== undefined && bestD <= tolerance) {
      const dim = stateDimension(game);
      const J = new Float64Array(dim * dim);
      field.jacobian(best, J);
      const st = classifyRestPoint(J, layout);
      const support: number[] = [];
      best.forEach((v, i) => {
        if (v > 1e-9) support.push(i);
      });
      point = { state: best, support, stability: st.stability, eigenvalues: st.eigenvalues, scale: st.scale, nash: false, ess: null };
    }
  }
  if (point === undefined) {
    return {
      ...base,
      status: "contradicted",
      message: `The ${ctx.dynamics.kind} dynamics has no rest point within ${fmt(tolerance)} of the claimed state${deviation === undefined ? "" : `; the nearest lies ${fmt(deviation)} away`}.`,
      ...(deviation === undefined ? {} : { deviation }),
    };
  }
  const computed = { state: ctx.present(game, point.state), stability: point.stability, eigenvalues: roundEigenvalues(point.eigenvalues, point.scale) };
  const kink = kinkAt(game, ctx.dynamics, point.state);
  const where = (deviation ?? 0) === 0 ? "The claimed state is a rest point" : `A rest point lies ${fmt(deviation ?? 0)} from the claimed state (tolerance ${fmt(tolerance)})`;
  const ev = `restricted eigenvalues ${presentEigenvalues({ eigenvalues: roundEigenvalues(point.eigenvalues, point.scale) })}`;
  if (kink !== null) {
    const why = `the ${ctx.dynamics.kind} dynamics is not differentiable there (${kink}, where the switching rate has a kink), so linearisation decides nothing about its stability`;
    if (claim.stability === undefined) {
      return { ...base, status: "confirmed", message: `${where}; ${why}.`, deviation: deviation ?? 0, computed };
    }
    return { ...base, status: "inconclusive", message: `${where}, but ${why}.`, deviation: deviation ?? 0, computed };
  }
  if (claim.stability === undefined) {
    return { ...base, status: "confirmed", message: `${where}; it is ${words(point.stability)} (${ev}).`, deviation: deviation ?? 0, computed };
  }
  if (point.stability === claim.stability) {
    return { ...base, status: "confirmed", message: `${where} and it is ${words(point.stability)}, as claimed (${ev}).`, deviation: deviation ?? 0, computed };
  }
  if (point.stability === "non-hyperbolic") {
    return {
      ...base,
      status: "inconclusive",
      message: `${where}, but it is non-hyperbolic (${ev}): an eigenvalue's real part lies within the band of zero, so linearisation cannot show it ${words(claim.stability)}.`,
      deviation: deviation ?? 0,
      computed,
    };
  }
  return { ...base, status: "contradicted", message: `${where}, but it is ${words(point.stability)}, not ${words(claim.stability)} (${ev}).`, deviation: deviation ?? 0, computed };
}

function nashClaim(claim: Extract<Claim, { kind: "nash-equilibrium" }>, ctx: ClaimContext, tolerance: number): ClaimResult {
  const base = { id: claim.id, kind: claim.kind, tolerance } as const;
  const holds = claim.holds ?? true;
  const x = flatten(claim.state);
  const loc = locateReplicator(ctx, claim.parameters, x, tolerance);
  if (loc.inconclusive !== undefined) return { ...base, status: "inconclusive", message: loc.inconclusive };
  const game = ctx.game(claim.parameters);
  if (loc.point === undefined) {
    return {
      ...base,
      status: holds ? "contradicted" : "confirmed",
      message: `No rest point of the replicator dynamics lies within ${fmt(tolerance)} of the state${loc.deviation === undefined ? "" : ` (the nearest is ${fmt(loc.deviation)} away)`}, so it is not a Nash equilibrium${holds ? "" : ", as claimed"}.`,
      computed: { nash: false },
      ...(loc.deviation === undefined ? {} : { deviation: loc.deviation }),
    };
  }
  const p = loc.point;
  const r = game.kind === "symmetric" ? symmetricNash(game.A, game.n, p.state) : bimatrixNash(game.A, game.B, game.m, game.k, p.state);
  const names = game.kind === "symmetric" ? game.strategies : [...game.populations[0].strategies, ...game.populations[1].strategies];
  const why = r.nash
    ? "no pure strategy earns more than its population's average"
    : `${names[r.bestDeviation] ?? "a strategy"} earns ${fmt(r.maxGain)} more than its population's average`;
  const ok = r.nash === holds;
  return {
    ...base,
    status: ok ? "confirmed" : "contradicted",
    message: `${restPointAt(loc.deviation)} ${r.nash ? "is" : "is not"} a ${game.kind === "symmetric" ? "symmetric " : ""}Nash equilibrium: ${why}${ok ? "" : `; the claim says it ${holds ? "is" : "is not"}`}.`,
    deviation: loc.deviation ?? 0,
    computed: { state: ctx.present(game, p.state), nash: r.nash },
  };
}

function essClaim(claim: Extract<Claim, { kind: "ess" }>, ctx: ClaimContext, tolerance: number): ClaimResult {
  const base = { id: claim.id, kind: claim.kind, tolerance } as const;
  const holds = claim.holds ?? true;
  const x = flatten(claim.state);
  const loc = locateReplicator(ctx, claim.parameters, x, tolerance);
  if (loc.inconclusive !== undefined) return { ...base, status: "inconclusive", message: loc.inconclusive };
  const game = ctx.game(claim.parameters);
  if (loc.point === undefined) {
    return {
      ...base,
      status: holds ? "contradicted" : "confirmed",
      message: `No rest point of the replicator dynamics lies within ${fmt(tolerance)} of the state${loc.deviation === undefined ? "" : ` (the nearest is ${fmt(loc.deviation)} away)`}; an ESS is always a rest point, so this state is none${holds ? "" : ", as claimed"}.`,
      computed: { ess: false },
      ...(loc.deviation === undefined ? {} : { deviation: loc.deviation }),
    };
  }
  const e = loc.point.ess;
  const computedState = ctx.present(game, loc.point.state);
  if (e === null || e.ess === null) {
    return { ...base, status: "inconclusive", message: `The ESS test could not be completed: ${e?.reason ?? "not a symmetric game."}`, deviation: loc.deviation ?? 0, computed: { state: computedState, ess: null } };
  }
  const ok = e.ess === holds;
  return {
    ...base,
    status: ok ? "confirmed" : "contradicted",
    message: `${restPointAt(loc.deviation)} ${e.ess ? "is" : "is not"} an ESS. ${e.reason}${ok ? "" : ` The claim says it ${holds ? "is" : "is not"}.`}`,
    deviation: loc.deviation ?? 0,
    computed: { state: computedState, ess: e.ess },
  };
}

function countClaim(claim: Extract<Claim, { kind: "rest-point-count" }>, ctx: ClaimContext): ClaimResult {
  const base = { id: claim.id, kind: claim.kind } as const;
  const region = claim.region ?? "all";
  const an = ctx.analysis(claim.parameters);
  const game = an.game;
  if (!an.enumerated) {
    return { ...base, status: "inconclusive", message: `The game is too large for a complete enumeration of rest points (at most 20 strategies in all); the count is not decided.` };
  }
  const dim = stateDimension(game);
  const inRegion = (support: number[]): boolean => region === "all" || support.length === dim;
  const continua = an.continua.filter(inRegion);
  const undecided = an.undecided.filter(inRegion);
  // A continuum on a face touches the interior only if the face is the whole state space.
  if (region === "all" ? an.continua.length > 0 : continua.length > 0) {
    return {
      ...base,
      status: "inconclusive",
      message: `The replicator dynamics has a continuum of rest points (on the face spanned by ${supportNames(game, (region === "all" ? an.continua[0] : continua[0]) ?? [])}), so the number of rest points is infinite; a count of isolated rest points is not decided.`,
      computed: { continuum: true },
    };
  }
  if (region === "all" ? an.undecided.length > 0 : undecided.length > 0) {
    return {
      ...base,
      status: "inconclusive",
      message: `A face of the state space (spanned by ${supportNames(game, (region === "all" ? an.undecided[0] : undecided[0]) ?? [])}) has a singular system whose rest points the engine could not resolve, so the count is not decided.`,
    };
  }
  const count = an.points.filter((p) => inRegion(p.support)).length;
  const what = region === "interior" ? "interior rest points (every strategy present)" : "rest points";
  return {
    ...base,
    status: count === claim.count ? "confirmed" : "contradicted",
    message: `Support enumeration finds ${count} isolated ${count === 1 ? what.replace("rest points", "rest point") : what}${ctx.dynamics.kind === "replicator" ? "" : " of the replicator dynamics (counts always refer to it)"}${count === claim.count ? ", as claimed" : `, not ${claim.count}`}.`,
    deviation: Math.abs(count - claim.count),
    computed: { count, region },
  };
}

function runClaim(claim: Extract<Claim, { kind: "final-state" | "trajectory" }>, ctx: ClaimContext, tolerance: number): ClaimResult {
  const base = { id: claim.id, kind: claim.kind, tolerance } as const;
  const queryTimes = claim.kind === "trajectory" ? claim.points.map((p) => p.t) : [];
  const run = ctx.run(claim.experiment, claim.parameters, queryTimes);
  if (run.error !== undefined) {
    return { ...base, status: "inconclusive", message: `The run of experiment "${claim.experiment}" did not finish: ${run.error}` };
  }
  const game = ctx.game(claim.parameters);
  if (claim.kind === "final-state") {
    const last = run.states[run.states.length - 1];
    if (last === undefined) return { ...base, status: "inconclusive", message: "The run produced no states." };
    const d = maxDistance(last, flatten(claim.state));
    const ok = d <= tolerance;
    return {
      ...base,
      status: ok ? "confirmed" : "contradicted",
      message: `At t = ${fmt(run.times[run.times.length - 1] ?? 0)} the run is ${fmt(d)} from the claimed state (max-norm; tolerance ${fmt(tolerance)}).`,
      deviation: d,
      computed: { state: ctx.present(game, last) },
    };
  }
  let worst = 0;
  let worstIndex = 0;
  claim.points.forEach((pt, i) => {
    const q = run.queries[i];
    const d = q === undefined ? Infinity : maxDistance(q, flatten(pt.state));
    if (d > worst) {
      worst = d;
      worstIndex = i;
    }
  });
  const ok = worst <= tolerance;
  const wp = claim.points[worstIndex];
  return {
    ...base,
    status: ok ? "confirmed" : "contradicted",
    message: `At ${claim.points.length} listed time${claim.points.length === 1 ? "" : "s"} the solution is at most ${fmt(worst)} from the claimed states (max-norm; tolerance ${fmt(tolerance)})${ok ? "" : `; the largest deviation is at t = ${fmt(wp?.t ?? 0)}`}.`,
    deviation: worst,
    computed: { states: run.queries.map((q) => ctx.present(game, q)) },
  };
}

function fixationClaim(claim: Extract<Claim, { kind: "fixation-probability" }>, ctx: ClaimContext, tolerance: number): ClaimResult {
  const base = { id: claim.id, kind: claim.kind, tolerance } as const;
  const game = ctx.game(claim.parameters);
  if (game.kind !== "symmetric") return { ...base, status: "inconclusive", message: "Fixation probabilities are defined here for symmetric games only." };
  const mutant = game.strategies.indexOf(claim.mutant);
  const resident = game.strategies.indexOf(claim.resident);
  let value: number;
  try {
    value = fixationProbability(game.A, game.n, mutant, resident, claim.populationSize, claim.selectionIntensity);
  } catch (e) {
    if (e instanceof BudgetExceeded) throw e;
    const detail = e instanceof Error ? e.message : String(e);
    return { ...base, status: "inconclusive", message: `The fixation probability is not defined for these values: ${detail}` };
  }
  const d = Math.abs(value - claim.value);
  const ok = d <= tolerance;
  return {
    ...base,
    status: ok ? "confirmed" : "contradicted",
    message: `A single ${claim.mutant} among ${claim.populationSize - 1} residents playing ${claim.resident} fixes with probability ${fmt(value)} (Moran process, selection intensity ${fmt(claim.selectionIntensity)}); the claim says ${fmt(claim.value)}, a difference of ${fmt(d)} (tolerance ${fmt(tolerance)}).`,
    deviation: d,
    computed: { value },
  };
}

