/**
 * Trajectories of a vector field on the simplex (or a product of simplices) with odex, the
 * Gragg-Bulirsch-Stoer extrapolation code of Hairer, Norsett and Wanner (Solving Ordinary
 * Differential Equations I, 2nd ed., 1993, section II.9) in Colin Smith's JavaScript port.
 *
 * The whole interval [0, T] is one integration; samples (equally spaced, 0 and T included)
 * and queries (any times in [0, T]) are read from the dense-output polynomial of the step
 * that covers them, so they carry the integrator's own accuracy rather than an
 * interpolation between samples. Every accepted step is charged to the run's Budget.
 */
import { Outcome, Solver } from "odex";
import { BudgetExceeded, type Budget } from "./budget";
import type { VectorField } from "./dynamics";

/** How far a state may stray from the simplex (a negative share, or a sum off 1) before the run fails. */
export const STATE_SPACE_SLACK = 1e-9;

/** odex's own step cap; the Budget stops runs long before it (an integration to T = 1e6 needs far fewer). */
const SOLVER_MAX_STEPS = 1_000_000_000;

/** Wall-clock check every this many right-hand-side evaluations (between step charges). */
const TIME_CHECK_EVERY = 1024;

export interface IntegrationOptions {
  duration: number;
  samples: number;
  queryTimes?: number[];
  relativeTolerance: number;
  absoluteTolerance: number;
  budget: Budget;
  /** Block sizes of the state, e.g. [n] or [m, k]; each block is a simplex. */
  layout: number[];
  /** Names of the state components, used in error messages (default "component i"). */
  labels?: string[];
  /** odex's own cap on steps (default 1e9, far above what the Budget allows); a safety net. */
  solverStepLimit?: number;
}

export type IntegrationErrorKind = "budget" | "left-state-space" | "non-finite" | "integrator";

export interface IntegrationResult {
  /** Sample times reached (all of them unless the run failed). */
  times: number[];
  states: Float64Array[];
  /** One state per query time, in the order given; empty when the run failed. */
  queries: Float64Array[];
  error?: { kind: IntegrationErrorKind; message: string };
  stats: { steps: number; rhsEvaluations: number };
}

/** Options that make no integration problem (caller's mistake, not a property of the model). */
export class IntegrationInputError extends Error {
  constructor(
    readonly option: keyof IntegrationOptions | "x0",
    message: string,
  ) {
    super(message);
    this.name = "IntegrationInputError";
  }
}

class RunFailure extends Error {
  constructor(
    readonly kind: "left-state-space" | "non-finite" | "integrator",
    message: string,
  ) {
    super(message);
  }
}

const show = (v: number): string => String(Number(v.toPrecision(6)));

function validate(field: VectorField, x0: Float64Array, opts: IntegrationOptions): void {
  const { duration, samples, layout } = opts;
  if (x0.length !== field.dim) {
    throw new IntegrationInputError("x0", `the initial state has ${x0.length} components; the dynamics has ${field.dim}`);
  }
  const total = layout.reduce((s, b) => s + b, 0);
  if (total !== field.dim || layout.some((b) => !Number.isInteger(b) || b < 1)) {
    throw new IntegrationInputError(
      "layout",
      `the block sizes [${layout.join(", ")}] must be positive integers adding up to the dimension ${field.dim}`,
    );
  }
  if (!(duration > 0 && Number.isFinite(duration))) {
    throw new IntegrationInputError("duration", `the duration must be a positive finite number; got ${duration}`);
  }
  if (!(Number.isInteger(samples) && samples >= 2)) {
    throw new IntegrationInputError("samples", `the number of samples must be an integer of at least 2; got ${samples}`);
  }
  for (const t of opts.queryTimes ?? []) {
    if (!(t >= 0 && t <= duration)) {
      throw new IntegrationInputError("queryTimes", `the query time ${t} lies outside [0, ${duration}]`);
    }
  }
  const { relativeTolerance: rtol, absoluteTolerance: atol } = opts;
  if (!(rtol >= 0 && atol >= 0 && Number.isFinite(rtol) && Number.isFinite(atol) && rtol + atol > 0)) {
    throw new IntegrationInputError(
      "relativeTolerance",
      `the tolerances must be non-negative finite numbers, not both 0; got relative ${rtol}, absolute ${atol}`,
    );
  }
}

/**
 * Integrates x' = F(x) from x0 over [0, duration] with odex at the given tolerances.
 * Samples at t_i = duration * i / (samples - 1), i = 0..samples-1; queries at the given times,
 * both from dense output. The run fails (result.error, samples so far kept) when a state has
 * a share below -1e-9 or a population whose shares sum off 1 by more than 1e-9
 * ("left-state-space"), when a state or the right-hand side is not finite ("non-finite"),
 * when the Budget runs out ("budget", message "budget exceeded ..."), or when odex itself
 * fails ("integrator"). Throws IntegrationInputError for options that make no problem.
 */
export function integrate(field: VectorField, x0: Float64Array, opts: IntegrationOptions): IntegrationResult {
  validate(field, x0, opts);
  const d = field.dim;
  const T = opts.duration;
  const samples = opts.samples;
  const budget = opts.budget;
  const layout = opts.layout;
  const label = (i: number): string => opts.labels?.[i] ?? `component ${i}`;
  const space = layout.length === 1 ? "the simplex" : "the product of simplices";
  const sampleTime = (i: number): number => (i === samples - 1 ? T : (T * i) / (samples - 1));

  const queryTimes = opts.queryTimes ?? [];
  const queryOrder = queryTimes.map((_, i) => i).sort((a, b) => (queryTimes[a] ?? 0) - (queryTimes[b] ?? 0));
  const answered: (Float64Array | undefined)[] = new Array<Float64Array | undefined>(queryTimes.length);
  const times: number[] = [];
  const states: Float64Array[] = [];
  let nextSample = 0;
  let nextQuery = 0;
  let reached = 0;
  let steps = 0;
  let evaluations = 0;

  const checkState = (x: Float64Array, t: number): void => {
    let o = 0;
    for (let b = 0; b < layout.length; b++) {
      const size = layout[b] ?? 0;
      let s = 0;
      for (let i = o; i < o + size; i++) {
        const v = x[i] ?? 0;
        if (!Number.isFinite(v)) {
          throw new RunFailure("non-finite", `the state became non-finite at t = ${show(t)}: ${label(i)} is ${v}`);
        }
        if (v < -STATE_SPACE_SLACK) {
          throw new RunFailure(
            "left-state-space",
            `the state left ${space} at t = ${show(t)}: the share of ${label(i)} is ${v.toExponential(3)}, below 0 by more than ${STATE_SPACE_SLACK}`,
          );
        }
        s += v;
      }
      if (Math.abs(s - 1) > STATE_SPACE_SLACK) {
        const whose = layout.length === 1 ? "the shares" : `the shares of population ${b + 1}`;
        throw new RunFailure(
          "left-state-space",
          `the state left ${space} at t = ${show(t)}: ${whose} sum to ${s}, off 1 by more than ${STATE_SPACE_SLACK}`,
        );
      }
      o += size;
    }
  };

  // Emits every sample and query time up to t, reading the state from `at`.
  const emitUpTo = (t: number, at: (time: number) => Float64Array): void => {
    while (nextSample < samples && sampleTime(nextSample) <= t) {
      const ts = sampleTime(nextSample);
      const x = at(ts);
      checkState(x, ts);
      times.push(ts);
      states.push(x);
      nextSample++;
    }
    while (nextQuery < queryOrder.length) {
      const q = queryOrder[nextQuery] ?? 0;
      const tq = queryTimes[q] ?? 0;
      if (tq > t) break;
      const x = at(tq);
      checkState(x, tq);
      answered[q] = x;
      nextQuery++;
    }
  };

  const xBuf = new Float64Array(d);
  const outBuf = new Float64Array(d);
  const ret: number[] = new Array<number>(d).fill(0);
  // odex copies the returned array into its own storage, so one array serves every call.
  const derivative = (t: number, y: number[]): number[] => {
    for (let i = 0; i < d; i++) xBuf[i] = y[i] ?? 0;
    field.rhs(xBuf, outBuf);
    for (let i = 0; i < d; i++) {
      const v = outBuf[i] ?? 0;
      if (!Number.isFinite(v)) {
        throw new RunFailure(
          "non-finite",
          `the right-hand side became non-finite near t = ${show(t)}: its ${label(i)} is ${v}`,
        );
      }
      ret[i] = v;
    }
    evaluations++;
    if (evaluations % TIME_CHECK_EVERY === 0) budget.checkTime();
    return ret;
  };

  const solver = new Solver(d);
  solver.relativeTolerance = opts.relativeTolerance;
  solver.absoluteTolerance = opts.absoluteTolerance;
  solver.denseOutput = true;
  solver.maxSteps = opts.solverStepLimit ?? SOLVER_MAX_STEPS;

  const fail = (kind: IntegrationErrorKind, message: string): IntegrationResult => ({
    times,
    states,
    queries: [],
    error: { kind, message },
    stats: { steps, rhsEvaluations: evaluations },
  });

  let outcome: Outcome;
  let final: Float64Array;
  try {
    const result = solver.solve(derivative, 0, Array.from(x0), T, (nr, _xOld, x, y, dense) => {
      const yv = Float64Array.from(y);
      if (nr === 1) {
        emitUpTo(0, () => Float64Array.from(yv));
        return;
      }
      budget.chargeSteps(1);
      steps++;
      checkState(yv, x);
      if (!dense) throw new Error("no dense output for a step");
      emitUpTo(x, (time) => {
        if (time >= x) return Float64Array.from(yv);
        const s = new Float64Array(d);
        for (let c = 0; c < d; c++) s[c] = dense(c, time);
        return s;
      });
      reached = x;
    });
    outcome = result.outcome;
    final = Float64Array.from(result.y);
  } catch (e) {
    if (e instanceof BudgetExceeded) {
      return fail("budget", `${e.message} (the run had reached t = ${show(reached)} of ${show(T)})`);
    }
    if (e instanceof RunFailure) return fail(e.kind, e.message);
    return fail("integrator", `the integrator failed: ${e instanceof Error ? e.message : String(e)}`);
  }
  if (outcome !== Outcome.Converged) {
    return fail("integrator", `the integrator stopped at t = ${show(reached)} of ${show(T)} without reaching the end`);
  }
  try {
    // odex ends within rounding of T; whatever is left is at T.
    emitUpTo(Infinity, () => Float64Array.from(final));
  } catch (e) {
    if (e instanceof RunFailure) return fail(e.kind, e.message);
    throw e;
  }
  // every query time is at most T, so the sweep to Infinity above answered all of them
  const queries = answered.map((q) => q ?? final);
  return { times, states, queries, stats: { steps, rhsEvaluations: evaluations } };
}
