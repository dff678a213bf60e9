/** Barycentric projection of 3-strategy states onto an equilateral triangle. */

import type { Point } from "./downsample";

export interface Triangle {
  /** Vertex of strategy 1 (bottom left), strategy 2 (bottom right), strategy 3 (top). */
  vertices: readonly [Point, Point, Point];
}

/**
 * The largest equilateral triangle with a horizontal base that fits in the box, centred in it.
 * SVG coordinates: y grows downwards.
 */
export function fitTriangle(x: number, y: number, width: number, height: number): Triangle {
  const side = Math.min(width, (2 * height) / Math.sqrt(3));
  const h = (side * Math.sqrt(3)) / 2;
  const left = x + (width - side) / 2;
  const bottom = y + (height + h) / 2;
  return {
    vertices: [
      [left, bottom],
      [left + side, bottom],
      [left + side / 2, bottom - h],
    ],
  };
}

/**
 * Point of the triangle with barycentric coordinates `shares` (x1, x2, x3): sum_i x_i V_i / sum_i x_i.
 * Dividing by the sum keeps a state that sums to 1 only up to rounding on the triangle; tiny
 * negative shares from integration error are clamped to 0. Returns null for a state that is not
 * three finite numbers with a positive sum.
 */
export function barycentricToPoint(shares: readonly number[], triangle: Triangle): Point | null {
  if (shares.length !== 3) return null;
  const w = shares.map((s) => (Number.isFinite(s) ? Math.max(0, s) : NaN));
  const [a, b, c] = w as [number, number, number];
  const sum = a + b + c;
  if (!(sum > 0)) return null;
  const [v1, v2, v3] = triangle.vertices;
  return [(a * v1[0] + b * v2[0] + c * v3[0]) / sum, (a * v1[1] + b * v2[1] + c * v3[1]) / sum];
}

/**
 * Grid segments of constant share (0.2, 0.4, ...) for each strategy: for strategy i at level s, the
 * line joining the two edge points where x_i = s.
 */
export function simplexGrid(triangle: Triangle, step = 0.2): [Point, Point][] {
  const lines: [Point, Point][] = [];
  const count = Math.round(1 / step);
  for (let k = 1; k < count; k++) {
    const s = k * step;
    for (let i = 0; i < 3; i++) {
      const j = (i + 1) % 3;
      const l = (i + 2) % 3;
      const p = [0, 0, 0];
      const q = [0, 0, 0];
      p[i] = s;
      p[j] = 1 - s;
      q[i] = s;
      q[l] = 1 - s;
      const a = barycentricToPoint(p, triangle);
      const b = barycentricToPoint(q, triangle);
      if (a !== null && b !== null) lines.push([a, b]);
    }
  }
  return lines;
}
