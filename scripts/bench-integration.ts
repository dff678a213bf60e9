/**
 * Integration and finite-population figures for `npm run bench` (called from scripts/bench.ts)
 * or on their own: `npx tsx scripts/bench-integration.ts`. Prints timings; asserts nothing.
 */
import { pathToFileURL } from "node:url";
import { Budget } from "@/lib/engine/budget";
import { vectorField, type VectorField } from "@/lib/engine/dynamics";
import { integrate } from "@/lib/engine/integrate";
import { fixationProbability } from "@/lib/engine/moran";
import type { CompiledGame } from "@/lib/engine/types";

/** Mulberry32: a small deterministic generator of uniforms in [0, 1) (common practice). */
function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function game(n: number, A: Float64Array): CompiledGame {
  return { kind: "symmetric", n, strategies: Array.from({ length: n }, (_, i) => `s${i}`), A };
}

/** Payoffs uniform in [0, 1). */
function uniformGame(n: number, seed: number): CompiledGame {
  const rng = mulberry32(seed);
  return game(n, Float64Array.from({ length: n * n }, rng));
}

/** A random zero-sum game (A = -A^T): the interior orbits cycle for ever, so T = 1000 is all work. */
function zeroSumGame(n: number, seed: number): CompiledGame {
  const rng = mulberry32(seed);
  const A = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const v = 2 * rng() - 1;
      A[i * n + j] = v;
      A[j * n + i] = -v;
    }
  }
  return game(n, A);
}

/** Counts right-hand-side evaluations of a field. */
function counted(field: VectorField): { field: VectorField; count: () => number } {
  let calls = 0;
  return {
    field: {
      dim: field.dim,
      rhs(x, out) {
        calls++;
        field.rhs(x, out);
      },
      jacobian: (x, out) => field.jacobian(x, out),
    },
    count: () => calls,
  };
}

const WARM_UP_RUNS = 10;
const TIMED_RUNS = 7;

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] ?? NaN;
}

function runOnce(g: CompiledGame, T: number): { ms: number; evaluations: number; steps: number; final: Float64Array } {
  const n = g.kind === "symmetric" ? g.n : 0;
  const { field, count } = counted(vectorField(g, { kind: "replicator" }));
  const x0 = new Float64Array(n).fill(1 / n);
  // start off the barycentre (a rest point of the zero-sum game), deterministically
  for (let i = 0; i < n; i++) x0[i] = (1 + (i % 3)) / n;
  const s = x0.reduce((a, v) => a + v, 0);
  for (let i = 0; i < n; i++) x0[i] = (x0[i] ?? 0) / s;
  const t0 = performance.now();
  const result = integrate(field, x0, {
    duration: T,
    samples: 201,
    relativeTolerance: 1e-10,
    absoluteTolerance: 1e-12,
    budget: new Budget({ wallClockMs: 120_000, maxSteps: 10_000_000 }),
    layout: [n],
  });
  const ms = performance.now() - t0;
  if (result.error) throw new Error(`benchmark run failed: ${result.error.message}`);
  return { ms, evaluations: count(), steps: result.stats.steps, final: result.states[result.states.length - 1] ?? x0 };
}

function reportRun(label: string, g: CompiledGame): void {
  // the first runs are several times slower while V8 compiles odex and the field
  for (let k = 0; k < WARM_UP_RUNS; k++) runOnce(g, 1000);
  const runs = Array.from({ length: TIMED_RUNS }, () => runOnce(g, 1000));
  const ms = median(runs.map((r) => r.ms));
  const r = runs[0];
  if (!r) return;
  const perSecond = r.evaluations / (ms / 1000);
  console.log(
    `  ${label}: ${ms.toFixed(1)} ms (median of ${TIMED_RUNS} after ${WARM_UP_RUNS} warm-up runs), ${r.steps} steps, ` +
      `${r.evaluations} right-hand-side evaluations, ${(perSecond / 1e6).toFixed(2)} million evaluations/s`,
  );
}

function reportRawRhs(g: CompiledGame): void {
  const n = g.kind === "symmetric" ? g.n : 0;
  const field = vectorField(g, { kind: "replicator" });
  const x = new Float64Array(n).fill(1 / n);
  const out = new Float64Array(n);
  const calls = 2_000_000;
  for (let i = 0; i < 100_000; i++) field.rhs(x, out);
  const t0 = performance.now();
  for (let i = 0; i < calls; i++) {
    x[i % n] = 1 / n + 1e-9 * (i & 7); // keep the call from being hoisted
    field.rhs(x, out);
  }
  const ms = performance.now() - t0;
  console.log(`  right-hand side alone (n = ${n}): ${(calls / (ms / 1000) / 1e6).toFixed(1)} million evaluations/s`);
}

function reportMoran(): void {
  const A = Float64Array.from([3, 0, 5, 1]);
  const N = 100_000;
  fixationProbability(A, 2, 0, 1, N, 0.001); // warm-up
  const times: number[] = [];
  let rho = 0;
  for (let k = 0; k < 5; k++) {
    const t0 = performance.now();
    rho = fixationProbability(A, 2, 0, 1, N, 0.001);
    times.push(performance.now() - t0);
  }
  console.log(
    `  Moran fixation probability, N = ${N}, w = 0.001: ${median(times).toFixed(2)} ms (median of 5), rho = ${rho.toExponential(4)}`,
  );
}

/** Prints the integration and Moran figures. */
export async function benchIntegration(): Promise<void> {
  console.log("Integration (odex, Gragg-Bulirsch-Stoer with dense output; rtol 1e-10, atol 1e-12, 201 samples)");
  reportRun("10-strategy replicator to T = 1000, payoffs uniform in [0, 1) (seed 1)", uniformGame(10, 1));
  reportRun("10-strategy replicator to T = 1000, random zero-sum payoffs, cycling orbit (seed 2)", zeroSumGame(10, 2));
  reportRawRhs(uniformGame(10, 1));
  console.log("Finite populations");
  reportMoran();
  await Promise.resolve();
}

const invokedDirectly = process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href;
if (invokedDirectly) {
  benchIntegration().catch((e: unknown) => {
    console.error(e);
    process.exitCode = 1;
  });
}
