/**
 * `npm run bench`: speed figures of the engine, printed; asserts nothing.
 *  1. full rest-point enumeration of random symmetric games (payoffs uniform in [0, 1),
 *     seeded) with n = 12, 16, 20: time and memory of the whole process;
 *  2. in-process time to verify a typical spec (the example spec: 3 strategies, 3 experiments
 *     of 201 samples, 10 claims) after warm-up;
 *  3. the integration and finite-population figures of scripts/bench-integration.ts.
 */
import { readFileSync } from "node:fs";
import { analyzeGame } from "../lib/engine/analysis";
import { symmetricRestPoints } from "../lib/engine/restpoints";
import { benchIntegration } from "./bench-integration";

/** Mulberry32 (common practice): deterministic uniforms in [0, 1). */
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

const mb = (bytes: number): string => `${(bytes / 2 ** 20).toFixed(1)} MB`;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] ?? Number.NaN;
}

async function benchTypicalSpec(): Promise<void> {
  // imported here, after the enumeration figures, so that their memory excludes the parser and schema validator
  const { verifySpecText } = await import("../lib/engine/verify");
  const text = readFileSync(new URL("../schemas/examples/fog-dune-beetles.json", import.meta.url), "utf8");
  const spec = JSON.parse(text) as { claims: unknown[]; experiments: { samples?: number }[] };
  for (let i = 0; i < 20; i++) verifySpecText(text);
  const times: number[] = [];
  for (let i = 0; i < 50; i++) {
    const t0 = performance.now();
    const r = verifySpecText(text);
    times.push(performance.now() - t0);
    if (r.verdict !== "confirmed") throw new Error(`the example spec is ${r.verdict}`);
  }
  console.log(
    `verify a typical spec (${spec.claims.length} claims, ${spec.experiments.length} experiments of ${spec.experiments[0]?.samples ?? 201} samples, 3 strategies): median ${median(times).toFixed(2)} ms, min ${Math.min(...times).toFixed(2)} ms over 50 runs after 20 warm-up runs (target < 50 ms)`,
  );
}

function benchEnumeration(): void {
  const targets: Record<number, number> = { 12: 0.005, 16: 0.1, 20: 2 };
  // warm the JIT on a small game first
  symmetricRestPoints(Float64Array.from({ length: 100 }, mulberry32(1)), 10);
  for (const n of [12, 16, 20]) {
    const A = Float64Array.from({ length: n * n }, mulberry32(1000 + n));
    const heapBefore = process.memoryUsage().heapUsed;
    const runs = n === 20 ? 2 : n === 16 ? 5 : 20;
    const times: number[] = [];
    let count = 0;
    for (let r = 0; r < runs; r++) {
      const t0 = performance.now();
      const set = symmetricRestPoints(A, n);
      times.push((performance.now() - t0) / 1000);
      count = set.points.length;
    }
    const heapAfter = process.memoryUsage().heapUsed;
    const t0 = performance.now();
    analyzeGame({ kind: "symmetric", n, strategies: Array.from({ length: n }, (_, i) => `s${i}`), A });
    const analysis = (performance.now() - t0) / 1000;
    const mem = process.memoryUsage();
    console.log(
      `enumerate rest points, random symmetric game n = ${n} (${2 ** n - 1} supports): median ${median(times).toFixed(4)} s, min ${Math.min(...times).toFixed(4)} s over ${runs} runs (target ${targets[n]} s); ${count} rest points; ` +
        `stability, Nash and ESS of all of them ${analysis.toFixed(3)} s; heap +${mb(Math.max(0, heapAfter - heapBefore))}, rss ${mb(mem.rss)}, peak rss ${mb(process.resourceUsage().maxRSS * 1024)}`,
    );
  }
}

benchEnumeration();
await benchTypicalSpec();
await benchIntegration();
