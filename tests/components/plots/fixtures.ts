/** Display fixtures for the plot tests: invented trajectories, not engine results. */

import type { ExperimentReport, RestPointReport } from "@/lib/engine/types";

/** A damped spiral around the barycentre of the simplex, sampled n times over [0, 40]. */
export function spiralRun(id: string, n: number, phase = 0, radius = 0.3): ExperimentReport {
  const times: number[] = [];
  const states: number[][] = [];
  for (let i = 0; i < n; i++) {
    const t = (i / (n - 1)) * 40;
    const r = radius * Math.exp(-t / 12);
    const u = r * Math.cos(t + phase);
    const v = r * Math.sin(t + phase);
    times.push(t);
    states.push([1 / 3 + u, 1 / 3 - u / 2 + (v * Math.sqrt(3)) / 2, 1 / 3 - u / 2 - (v * Math.sqrt(3)) / 2]);
  }
  return { id, times, states };
}

/** k shares drifting smoothly over [0, 100], normalised to sum to 1. */
export function wideRun(id: string, n: number, k: number): ExperimentReport {
  const times: number[] = [];
  const states: number[][] = [];
  for (let i = 0; i < n; i++) {
    const t = (i / (n - 1)) * 100;
    const w = Array.from({ length: k }, (_, j) => Math.exp(Math.sin(t / (5 + j) + j)));
    const sum = w.reduce((a, b) => a + b, 0);
    times.push(t);
    states.push(w.map((x) => x / sum));
  }
  return { id, times, states };
}

/** Two 2-strategy populations circling the centre of the unit square. */
export function squareRun(id: string, n: number, x0: number, y0: number): ExperimentReport {
  const times: number[] = [];
  const states: [number[], number[]][] = [];
  for (let i = 0; i < n; i++) {
    const t = (i / (n - 1)) * 20;
    const r = Math.exp(-t / 20);
    const x = 0.5 + (x0 - 0.5) * r * Math.cos(t / 3);
    const y = 0.5 + (y0 - 0.5) * r * Math.sin(t / 3 + 1);
    times.push(t);
    states.push([
      [x, 1 - x],
      [y, 1 - y],
    ]);
  }
  return { id, times, states };
}

export const simplexRestPoints: RestPointReport[] = [
  { state: [1 / 3, 1 / 3, 1 / 3], support: ["A", "B", "C"], stability: "asymptotically-stable", eigenvalues: [[-0.1, 1], [-0.1, -1]], nash: true, ess: true },
  { state: [1, 0, 0], support: ["A"], stability: "unstable", eigenvalues: [[1, 0], [0.5, 0]], nash: false, ess: false },
  { state: [0, 0, 1], support: ["C"], stability: "non-hyperbolic", eigenvalues: [[0, 0], [1, 0]], nash: false, ess: false },
];

export const squareRestPoints: RestPointReport[] = [
  { state: [[0.5, 0.5], [0.5, 0.5]], support: ["Inspect", "Trust", "Honest", "Cheat"], stability: "non-hyperbolic", eigenvalues: [[0, 0.5], [0, -0.5]], nash: true, ess: null },
  { state: [[1, 0], [1, 0]], support: ["Inspect", "Honest"], stability: "unstable", eigenvalues: [[1, 0], [1, 0]], nash: false, ess: null },
];

export const HOSTILE = `<script>alert("x")</script>`;

/** Counts non-overlapping matches of a pattern. */
export function count(markup: string, pattern: RegExp): number {
  return (markup.match(new RegExp(pattern.source, pattern.flags.includes("g") ? pattern.flags : `${pattern.flags}g`)) ?? []).length;
}

/** The `points` attributes of every polyline, as point counts. */
export function polylineSizes(markup: string): number[] {
  return [...markup.matchAll(/<polyline points="([^"]*)"/g)].map((m) => ((m[1] ?? "").trim() === "" ? 0 : (m[1] ?? "").trim().split(/\s+/).length));
}

/** Text of every <th> in document order. */
export function headers(markup: string): string[] {
  return [...markup.matchAll(/<th(?:\s[^>]*)?>(.*?)<\/th>/g)].map((m) => m[1] ?? "");
}
