/**
 * Thinning long trajectories for drawing. The tables and CSV files always keep every sample;
 * only the drawn polylines are reduced, to at most a few points per pixel.
 */

export type Point = readonly [number, number];

/**
 * Indices of the samples to draw for a series y(x) on a chart `columns` pixels wide: per pixel
 * column the first, lowest, highest and last sample (the "M4" reduction of Jugel et al., VLDB
 * 2014), which draws the same picture as the full series at that width. Non-finite samples are
 * skipped. Returns indices in increasing order.
 */
export function minMaxIndices(
  xs: ArrayLike<number>,
  ys: ArrayLike<number>,
  columns: number,
): number[] {
  const n = Math.min(xs.length, ys.length);
  let xMin = Infinity;
  let xMax = -Infinity;
  for (let i = 0; i < n; i++) {
    const x = xs[i] ?? NaN;
    if (Number.isFinite(x)) {
      if (x < xMin) xMin = x;
      if (x > xMax) xMax = x;
    }
  }
  const cols = Math.max(1, Math.floor(columns));
  if (!(xMax >= xMin)) return [];
  // Few samples: nothing to gain, keep all finite ones.
  if (n <= cols * 4) {
    const all: number[] = [];
    for (let i = 0; i < n; i++) if (Number.isFinite(xs[i] ?? NaN) && Number.isFinite(ys[i] ?? NaN)) all.push(i);
    return all;
  }
  const span = xMax - xMin;
  const out: number[] = [];
  let bucket = -1;
  let first = -1;
  let last = -1;
  let lo = -1;
  let hi = -1;
  const flush = (): void => {
    if (first < 0) return;
    const picked = [first, lo, hi, last].sort((a, b) => a - b);
    for (const i of picked) if (out[out.length - 1] !== i) out.push(i);
  };
  for (let i = 0; i < n; i++) {
    const x = xs[i] ?? NaN;
    const y = ys[i] ?? NaN;
    if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
    const b = span === 0 ? 0 : Math.min(cols - 1, Math.floor(((x - xMin) / span) * cols));
    if (b !== bucket) {
      flush();
      bucket = b;
      first = last = lo = hi = i;
      continue;
    }
    last = i;
    if (y < (ys[lo] ?? y)) lo = i;
    if (y > (ys[hi] ?? y)) hi = i;
  }
  flush();
  return out;
}

/** Distance from p to the segment a-b. */
function segmentDistance(p: Point, a: Point, b: Point): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2));
  return Math.hypot(p[0] - (a[0] + t * dx), p[1] - (a[1] + t * dy));
}

/**
 * Simplifies a 2-D path (already in drawing units) so no dropped point lies farther than
 * `tolerance` from the drawn line: a radial-distance pass, then Ramer-Douglas-Peucker (Ramer 1972;
 * Douglas and Peucker 1973), run with an explicit stack so 10001-point paths cannot overflow the
 * call stack. The first and last points are always kept; non-finite points are dropped.
 */
export function simplifyPath(points: readonly Point[], tolerance: number): Point[] {
  const finite = points.filter((p) => Number.isFinite(p[0]) && Number.isFinite(p[1]));
  if (finite.length <= 2 || !(tolerance > 0)) return finite.slice();
  // Radial pass: consecutive points closer than the tolerance add nothing visible.
  const radial: Point[] = [];
  for (let i = 0; i < finite.length; i++) {
    const p = finite[i];
    if (p === undefined) continue;
    const prev = radial[radial.length - 1];
    if (prev === undefined || i === finite.length - 1 || Math.hypot(p[0] - prev[0], p[1] - prev[1]) > tolerance) {
      radial.push(p);
    }
  }
  if (radial.length <= 2) return radial;
  const keep = new Uint8Array(radial.length);
  keep[0] = 1;
  keep[radial.length - 1] = 1;
  const stack: [number, number][] = [[0, radial.length - 1]];
  while (stack.length > 0) {
    const range = stack.pop();
    if (range === undefined) break;
    const [from, to] = range;
    const a = radial[from];
    const b = radial[to];
    if (a === undefined || b === undefined) continue;
    let worst = -1;
    let worstDistance = tolerance;
    for (let i = from + 1; i < to; i++) {
      const p = radial[i];
      if (p === undefined) continue;
      const d = segmentDistance(p, a, b);
      if (d > worstDistance) {
        worstDistance = d;
        worst = i;
      }
    }
    if (worst > 0) {
      keep[worst] = 1;
      stack.push([from, worst], [worst, to]);
    }
  }
  return radial.filter((_, i) => keep[i] === 1);
}

/** SVG `points` attribute text, rounded to `decimals` (a tenth of a unit is below a pixel here). */
export function pointsAttribute(points: readonly Point[], decimals = 1): string {
  const out: string[] = [];
  for (const p of points) {
    const text = `${round(p[0], decimals)},${round(p[1], decimals)}`;
    // Points that coincide after rounding draw nothing new.
    if (out[out.length - 1] !== text) out.push(text);
  }
  return out.join(" ");
}

function round(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  // Drop a trailing ".0" to keep long polylines short.
  const trimmed = text.includes(".") ? text.replace(/\.?0+$/, "") : text;
  return trimmed === "-0" ? "0" : trimmed;
}
