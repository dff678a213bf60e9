/**
 * Nash equilibrium checks at a given state.
 *
 * Symmetric game: x is a symmetric Nash equilibrium iff no pure strategy earns more
 * against x than x itself: (Ax)_i <= x.Ax for all i (Nash 1951; Weibull 1995, sect. 1.5).
 * Two populations: (x, y) is a Nash equilibrium iff x is a best reply to y under A and y a
 * best reply to x under B.
 */

/**
 * Best-reply tolerance, relative to the payoff scale (largest |payoff|, at least 1): a pure
 * strategy whose payoff exceeds the mean by more than this is a profitable deviation, and
 * one within it of the mean is an alternative best reply. Rest points located by support
 * enumeration carry rounding errors near 1e-15 of the scale, far inside this.
 */
export const BEST_REPLY_TOLERANCE = 1e-9;

/** Largest absolute payoff, at least 1: the scale tolerances are relative to. */
export function payoffScale(...mats: Float64Array[]): number {
  let s = 0;
  for (const M of mats) for (let i = 0; i < M.length; i++) s = Math.max(s, Math.abs(M[i] ?? 0));
  return Math.max(1, s);
}

/** Outcome of a Nash check with the payoffs it was read from. */
export interface NashResult {
  nash: boolean;
  /** Largest gain of a pure strategy over the mean payoff (per population for bimatrix games, the larger). */
  maxGain: number;
  /** Flat index of the most profitable pure deviation. */
  bestDeviation: number;
  /** Payoffs of the pure strategies at the state (flat layout). */
  payoffs: Float64Array;
  /** Mean payoffs, one per population. */
  mean: number[];
}

/** f = M z for an r x c matrix. */
function times(M: Float64Array, r: number, c: number, z: ArrayLike<number>, out: Float64Array, offset: number): void {
  for (let i = 0; i < r; i++) {
    let s = 0;
    for (let j = 0; j < c; j++) s += (M[i * c + j] ?? 0) * (z[j] ?? 0);
    out[offset + i] = s;
  }
}

/** Symmetric Nash check of shares x for the n x n matrix A. */
export function symmetricNash(A: Float64Array, n: number, x: ArrayLike<number>): NashResult {
  const f = new Float64Array(n);
  times(A, n, n, x, f, 0);
  let phi = 0;
  for (let i = 0; i < n; i++) phi += (x[i] ?? 0) * (f[i] ?? 0);
  let maxGain = -Infinity;
  let best = 0;
  for (let i = 0; i < n; i++) {
    const g = (f[i] ?? 0) - phi;
    if (g > maxGain) {
      maxGain = g;
      best = i;
    }
  }
  const tol = BEST_REPLY_TOLERANCE * payoffScale(A);
  return { nash: maxGain <= tol, maxGain, bestDeviation: best, payoffs: f, mean: [phi] };
}

/** Nash check of the flat state (x, y) (m then k shares) for A (m x k) and B (k x m). */
export function bimatrixNash(A: Float64Array, B: Float64Array, m: number, k: number, state: ArrayLike<number>): NashResult {
  const x = Array.from({ length: m }, (_, i) => state[i] ?? 0);
  const y = Array.from({ length: k }, (_, j) => state[m + j] ?? 0);
  const f = new Float64Array(m + k);
  times(A, m, k, y, f, 0);
  times(B, k, m, x, f, m);
  let phi1 = 0;
  for (let i = 0; i < m; i++) phi1 += (x[i] ?? 0) * (f[i] ?? 0);
  let phi2 = 0;
  for (let j = 0; j < k; j++) phi2 += (y[j] ?? 0) * (f[m + j] ?? 0);
  let maxGain = -Infinity;
  let best = 0;
  for (let i = 0; i < m + k; i++) {
    const g = (f[i] ?? 0) - (i < m ? phi1 : phi2);
    if (g > maxGain) {
      maxGain = g;
      best = i;
    }
  }
  const tol = BEST_REPLY_TOLERANCE * payoffScale(A, B);
  return { nash: maxGain <= tol, maxGain, bestDeviation: best, payoffs: f, mean: [phi1, phi2] };
}
