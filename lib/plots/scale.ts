/**
 * Linear scales and tick selection for the plot components. Pure functions: no DOM, no React.
 */

export interface LinearScale {
  (value: number): number;
  domain: readonly [number, number];
  range: readonly [number, number];
}

/**
 * Maps [d0, d1] affinely onto [r0, r1]. A degenerate domain (d0 === d1) maps every value to the
 * middle of the range, so a constant series still draws as a flat line instead of NaN.
 */
export function linearScale(domain: readonly [number, number], range: readonly [number, number]): LinearScale {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  const span = d1 - d0;
  const f = (value: number): number => (span === 0 ? (r0 + r1) / 2 : r0 + ((value - d0) / span) * (r1 - r0));
  return Object.assign(f, { domain, range });
}

/**
 * A "nice" step for covering `span` with about `count` intervals: 1, 2 or 5 times a power of ten,
 * the raw step rounded to the nearest of them (the rounding variant of "nicenum" in Heckbert,
 * "Nice numbers for graph labels", Graphics Gems, 1990).
 */
export function niceStep(span: number, count: number): number {
  if (!(span > 0) || !Number.isFinite(span)) return 1;
  const raw = span / Math.max(1, count);
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const fraction = raw / magnitude;
  const nice = fraction < 1.5 ? 1 : fraction < 3 ? 2 : fraction < 7 ? 5 : 10;
  return nice * magnitude;
}

/**
 * Tick values inside [min, max] (inclusive, up to rounding), spaced by a nice step chosen for about
 * `count` intervals. Values are rounded to the step's decimals so 0.30000000000000004 reads 0.3.
 */
export function niceTicks(min: number, max: number, count = 5): number[] {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return [];
  if (min > max) [min, max] = [max, min];
  if (min === max) return [min];
  const step = niceStep(max - min, count);
  const decimals = stepDecimals(step);
  const first = Math.ceil(min / step - 1e-9);
  const last = Math.floor(max / step + 1e-9);
  const ticks: number[] = [];
  for (let k = first; k <= last; k++) ticks.push(Number((k * step).toFixed(decimals)));
  return ticks;
}

/** Number of decimals needed to print multiples of `step` exactly (0 for steps of 1 and above). */
export function stepDecimals(step: number): number {
  if (!(step > 0) || !Number.isFinite(step)) return 0;
  return Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
}

/** Tick label text: a multiple of `step` printed with the step's decimals, never "-0". */
export function formatTick(value: number, step: number): string {
  const text = value.toFixed(stepDecimals(step));
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text;
}
