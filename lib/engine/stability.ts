/**
 * Linear stability of a rest point within the state space: eigenvalues of the Jacobian
 * restricted to the tangent space of the simplex (or of the product of simplices).
 *
 * For a block of size s at offset o, the tangent space is spanned by e_{o+i} - e_{o+s-1}
 * (i < s-1); with the left inverse that reads off the first s-1 coordinates of the block,
 * the restricted matrix is R = W P J V, where P projects each block onto its tangent space
 * (subtracting the block mean). When J already maps tangent vectors to tangent vectors, as
 * every dynamics on the simplex does, P changes nothing; it only guards against fields
 * whose extension off the simplex is not tangent (Hofbauer & Sigmund 1998, sect. 7.2).
 */
import { eigenvalues } from "./linalg";
import type { Eigenvalue, Stability } from "./types";

/**
 * Non-hyperbolic band: an eigenvalue with |Re| <= NONHYPERBOLIC_BAND * scale counts as
 * having zero real part, where scale is the largest absolute entry of the restricted
 * Jacobian. The width 1e-7 covers the error of eigenvalues of a defective matrix (a
 * Jordan block of size 2 turns rounding of 1e-16 into eigenvalue errors near 1e-8) while
 * staying far below the eigenvalues of any hyperbolic example we test.
 */
export const NONHYPERBOLIC_BAND = 1e-7;

/** Restricted Jacobian (row-major, size sum(layout) - layout.length) from a full dim x dim Jacobian. */
export function restrictedJacobian(J: Float64Array, layout: number[]): { R: Float64Array; size: number } {
  const dim = layout.reduce((a, b) => a + b, 0);
  const offsets: number[] = [];
  let o = 0;
  for (const s of layout) {
    offsets.push(o);
    o += s;
  }
  const size = dim - layout.length;
  // JV: dim x size
  const JV = new Float64Array(dim * size);
  let col = 0;
  layout.forEach((s, c) => {
    const oc = offsets[c] ?? 0;
    for (let j = 0; j < s - 1; j++) {
      for (let r = 0; r < dim; r++) JV[r * size + col] = (J[r * dim + oc + j] ?? 0) - (J[r * dim + oc + s - 1] ?? 0);
      col++;
    }
  });
  const R = new Float64Array(size * size);
  let row = 0;
  layout.forEach((s, b) => {
    const ob = offsets[b] ?? 0;
    for (let cc = 0; cc < size; cc++) {
      let mean = 0;
      for (let i = 0; i < s; i++) mean += JV[(ob + i) * size + cc] ?? 0;
      mean /= s;
      for (let i = 0; i < s - 1; i++) R[(row + i) * size + cc] = (JV[(ob + i) * size + cc] ?? 0) - mean;
    }
    row += s - 1;
  });
  return { R, size };
}

/** Classification of one rest point with the restricted eigenvalues it rests on. */
export interface StabilityResult {
  stability: Stability;
  /** Sorted by real part descending, then imaginary part descending. */
  eigenvalues: Eigenvalue[];
  /** Largest absolute entry of the restricted Jacobian; the band is NONHYPERBOLIC_BAND times this. */
  scale: number;
}

/**
 * Classifies a rest point from the full Jacobian J (dim x dim, row-major) of any dynamics:
 * asymptotically stable if every restricted eigenvalue has Re < -band, unstable if none is
 * inside the band and one has Re > band, non-hyperbolic if any lies inside the band
 * (Hartman-Grobman decides nothing there; Hofbauer & Sigmund 1998, sect. 2.4).
 */
export function classifyRestPoint(J: Float64Array, layout: number[]): StabilityResult {
  const { R, size } = restrictedJacobian(J, layout);
  let scale = 0;
  for (let i = 0; i < R.length; i++) scale = Math.max(scale, Math.abs(R[i] ?? 0));
  const ev = eigenvalues(R, size).sort((a, b) => b[0] - a[0] || b[1] - a[1]);
  return { stability: classify(ev, scale), eigenvalues: ev, scale };
}

/** Stability class of restricted eigenvalues, with the non-hyperbolic band NONHYPERBOLIC_BAND * scale. */
export function classify(ev: Eigenvalue[], scale: number): Stability {
  const band = NONHYPERBOLIC_BAND * scale;
  let inBand = false;
  let positive = false;
  for (const [re] of ev) {
    if (Math.abs(re) <= band) inBand = true;
    else if (re > 0) positive = true;
  }
  if (inBand) return "non-hyperbolic";
  return positive ? "unstable" : "asymptotically-stable";
}
