/**
 * Rest points of a vector field on the simplex (or a product of simplices) by damped Newton
 * iteration restricted to the state space, from given seeds and a deterministic grid.
 *
 * Each Newton step solves, on the tangent space T = {v : every population's entries of v sum
 * to 0}, the linearised equation P J v = -P F(x) (P the orthogonal projection onto T, so
 * fields that are not tangent still work), written as the bordered system
 *   [ P J  C ] [v]   [-P F]
 *   [ C^T  0 ] [l] = [  0 ]          (C: one indicator column per population),
 * which is square and nonsingular exactly when P J is invertible on T (Allgower and Georg
 * 1990, Numerical Continuation Methods, for the bordering; from memory). Steps are halved until
 * the residual |P F|_inf decreases (Armijo-type backtracking, Dennis and Schnabel 1983,
 * ch. 6), and each trial point is projected back onto the simplices (Euclidean projection,
 * Held, Wolfe and Crowder 1974). A singular P J (non-isolated or non-hyperbolic points) is
 * regularised by a small multiple of the identity, so the step still moves downhill.
 *
 * A start has converged when the residual is small relative to the field's scale and the
 * Newton correction is negligible; shares that end below 1e-6 are tried at exactly 0.
 * Near Brown-von Neumann-Nash equilibria the field grows like the square of the distance
 * and Newton converges only linearly, so such points can be accurate to about 1e-7 rather
 * than to rounding; their correction is kept as an error estimate and widens the
 * de-duplication radius (see DUPLICATE_DISTANCE). A grid is a heuristic: it can miss rest
 * points, which is why callers pass known candidates (the replicator's rest points, which
 * include every Nash equilibrium) as seeds.
 */
import type { Budget } from "./budget";
import type { VectorField } from "./dynamics";

/** Residual test: |P F|_inf <= this times (1 + |J|_inf), the field's scale (row-sum norm). */
export const REST_POINT_RESIDUAL = 1e-12;
/**
 * Two rest points closer than this in the max-norm are one. Where convergence was slow (the
 * last Newton correction, an estimate of the remaining error, is not negligible) the radius
 * grows to 4 times the two corrections, up to MERGE_RADIUS_CAP; the more accurate point is kept.
 */
export const DUPLICATE_DISTANCE = 1e-7;
const MERGE_RADIUS_CAP = 1e-5;
/**
 * Converged also needs the Newton correction to be below this: at a degenerate root (BNN near
 * an equilibrium, where F grows like the square of the distance) a small residual alone
 * leaves the point about sqrt(residual) away. A start whose residual is small but whose
 * correction is not, and that can no longer decrease the residual, is kept with that
 * correction as its error estimate (used for de-duplication).
 */
const STEP_TOLERANCE = 1e-13;
const MAX_ITERATIONS = 200;
/**
 * Where Newton converges only linearly onto a face (BNN at an equilibrium whose unused
 * strategies decay at a rate that itself vanishes there), it stalls with those shares near
 * 1e-8; shares below this are tried at exactly 0.
 */
const SNAP_SHARE = 1e-6;
const MAX_HALVINGS = 40;
/** Lattice denominators stay at or below this; finer grids add starts, not rest points. */
const MAX_LATTICE_DENOMINATOR = 10;
/** Extra pseudo-random interior starts when the lattice is coarse (denominator below 3). */
const EXTRA_STARTS = 64;

export interface RestPointSearchOptions {
  /** Upper bound on the number of grid starts tried after the seeds (default 256; 0: seeds only). */
  maxStarts?: number;
  residualTolerance?: number;
  duplicateDistance?: number;
}

/** A layout that does not match the field or the seeds. */
export class RestPointSearchError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "RestPointSearchError";
  }
}

function binomial(n: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return Math.round(r);
}

/** Points k/h of the simplex with n vertices (compositions of h into n parts), in lexicographic order. */
function lattice(n: number, h: number): number[][] {
  const out: number[][] = [];
  const parts = new Array<number>(n).fill(0);
  const fill = (i: number, left: number): void => {
    if (i === n - 1) {
      parts[i] = left;
      out.push(parts.map((p) => p / h));
      return;
    }
    for (let p = left; p >= 0; p--) {
      parts[i] = p;
      fill(i + 1, left - p);
    }
  };
  fill(0, h);
  return out;
}

/** Mulberry32, a small deterministic generator (common practice). */
function generator(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Deterministic starting points for a layout (block sizes, e.g. [n] or [m, k]), at most
 * maxStarts of them: the product of the lattices {k/h} of each simplex with the largest
 * h <= 10 whose size is at most maxStarts, then the barycentre, then, when that lattice is
 * coarse (h < 3), up to 64 interior points from a fixed-seed generator, while room is left.
 * maxStarts = 0 gives no starts, 1 the barycentre alone. The same arguments always give the
 * same list.
 */
export function gridStarts(layout: number[], maxStarts = 256): Float64Array[] {
  const size = (h: number): number => layout.reduce((p, n) => p * binomial(h + n - 1, n - 1), 1);
  let h = 0;
  while (h < MAX_LATTICE_DENOMINATOR && size(h + 1) <= maxStarts) h++;
  const dim = layout.reduce((s, n) => s + n, 0);
  let points: number[][] = [[]];
  if (h > 0) {
    for (const n of layout) {
      const block = lattice(n, h);
      points = points.flatMap((p) => block.map((q) => [...p, ...q]));
    }
  } else {
    points = [];
  }
  const starts = points.map((p) => Float64Array.from(p));
  const barycentre = Float64Array.from(layout.flatMap((n) => new Array<number>(n).fill(1 / n)));
  if (starts.length < maxStarts && !starts.some((s) => s.every((v, i) => v === barycentre[i]))) {
    starts.push(barycentre);
  }
  if (h < 3) {
    const rng = generator(0x5eed);
    const extra = Math.min(EXTRA_STARTS, maxStarts - starts.length);
    for (let s = 0; s < extra; s++) {
      const x = new Float64Array(dim);
      let o = 0;
      for (const n of layout) {
        let total = 0;
        for (let i = 0; i < n; i++) {
          const e = -Math.log(1 - rng());
          x[o + i] = e;
          total += e;
        }
        for (let i = 0; i < n; i++) x[o + i] = (x[o + i] ?? 0) / total;
        o += n;
      }
      starts.push(x);
    }
  }
  return starts;
}

/** Euclidean projection of each block of x onto its simplex, in place (Held, Wolfe and Crowder 1974). */
function projectOntoSimplices(x: Float64Array, layout: number[]): void {
  let o = 0;
  for (const n of layout) {
    const u = Array.from(x.subarray(o, o + n)).sort((a, b) => b - a);
    let cumulative = 0;
    let theta = 0;
    for (let j = 0; j < n; j++) {
      cumulative += u[j] ?? 0;
      const t = (cumulative - 1) / (j + 1);
      if ((u[j] ?? 0) - t > 0) theta = t;
    }
    for (let i = o; i < o + n; i++) x[i] = Math.max((x[i] ?? 0) - theta, 0);
    o += n;
  }
}

/** out = P F(x): the field with each block's mean removed; returns |P F|_inf. */
function projectedResidual(field: VectorField, x: Float64Array, layout: number[], out: Float64Array): number {
  field.rhs(x, out);
  let worst = 0;
  let o = 0;
  for (const n of layout) {
    let mean = 0;
    for (let i = o; i < o + n; i++) mean += out[i] ?? 0;
    mean /= n;
    for (let i = o; i < o + n; i++) {
      const v = (out[i] ?? 0) - mean;
      out[i] = v;
      worst = Math.max(worst, Number.isFinite(v) ? Math.abs(v) : Infinity);
    }
    o += n;
  }
  return worst;
}

/** Solves M z = b in place (M is size x size row-major) by Gaussian elimination with partial pivoting; false if singular. */
function solveInPlace(M: Float64Array, b: Float64Array, size: number, scale: number): boolean {
  for (let col = 0; col < size; col++) {
    let pivot = col;
    for (let r = col + 1; r < size; r++) {
      if (Math.abs(M[r * size + col] ?? 0) > Math.abs(M[pivot * size + col] ?? 0)) pivot = r;
    }
    const p = M[pivot * size + col] ?? 0;
    if (!(Math.abs(p) > 1e-13 * scale)) return false;
    if (pivot !== col) {
      for (let c = 0; c < size; c++) {
        const t = M[col * size + c] ?? 0;
        M[col * size + c] = M[pivot * size + c] ?? 0;
        M[pivot * size + c] = t;
      }
      const t = b[col] ?? 0;
      b[col] = b[pivot] ?? 0;
      b[pivot] = t;
    }
    for (let r = col + 1; r < size; r++) {
      const factor = (M[r * size + col] ?? 0) / p;
      if (factor === 0) continue;
      for (let c = col; c < size; c++) M[r * size + c] = (M[r * size + c] ?? 0) - factor * (M[col * size + c] ?? 0);
      b[r] = (b[r] ?? 0) - factor * (b[col] ?? 0);
    }
  }
  for (let r = size - 1; r >= 0; r--) {
    let s = b[r] ?? 0;
    for (let c = r + 1; c < size; c++) s -= (M[r * size + c] ?? 0) * (b[c] ?? 0);
    b[r] = s / (M[r * size + r] ?? 1);
  }
  return true;
}

function maxNorm(a: Float64Array, b: Float64Array): number {
  let d = 0;
  for (let i = 0; i < a.length; i++) d = Math.max(d, Math.abs((a[i] ?? 0) - (b[i] ?? 0)));
  return d;
}

/**
 * Rest points F(x) = 0 of `field` on the product of simplices given by `layout`, found by the
 * damped, projected Newton iteration of the module comment from each seed (in order) and
 * then from gridStarts(layout). Converged points closer than DUPLICATE_DISTANCE in the
 * max-norm to one found earlier are dropped, so the result is in order of discovery: seeds
 * first. Deterministic. Checks the budget's wall clock every iteration (throws
 * BudgetExceeded); throws RestPointSearchError when the layout does not fit.
 */
export function findRestPoints(
  field: VectorField,
  layout: number[],
  seeds: Float64Array[],
  budget: Budget,
  options: RestPointSearchOptions = {},
): Float64Array[] {
  const d = field.dim;
  if (layout.reduce((s, n) => s + n, 0) !== d || layout.some((n) => !Number.isInteger(n) || n < 1)) {
    throw new RestPointSearchError(
      `the block sizes [${layout.join(", ")}] must be positive integers adding up to the dimension ${d}`,
    );
  }
  seeds.forEach((s, i) => {
    if (s.length !== d) throw new RestPointSearchError(`seed ${i} has ${s.length} components; the dynamics has ${d}`);
  });
  const tolerance = options.residualTolerance ?? REST_POINT_RESIDUAL;
  const duplicate = options.duplicateDistance ?? DUPLICATE_DISTANCE;
  const b = layout.length;
  const size = d + b;
  const J = new Float64Array(d * d);
  const M = new Float64Array(size * size);
  const rhs = new Float64Array(size);
  const residual = new Float64Array(d);
  const trialResidual = new Float64Array(d);
  const blockOf = new Int32Array(d);
  {
    let o = 0;
    layout.forEach((n, k) => {
      blockOf.fill(k, o, o + n);
      o += n;
    });
  }

  const jacobianNorm = (): number => {
    let worst = 0;
    for (let i = 0; i < d; i++) {
      let s = 0;
      for (let j = 0; j < d; j++) s += Math.abs(J[i * d + j] ?? 0);
      worst = Math.max(worst, s);
    }
    return worst;
  };

  // Fills the bordered matrix for the Jacobian in J, with mu added on the P J block's diagonal.
  const assemble = (mu: number): void => {
    M.fill(0);
    let o = 0;
    for (let k = 0; k < b; k++) {
      const n = layout[k] ?? 0;
      for (let j = 0; j < d; j++) {
        let mean = 0;
        for (let i = o; i < o + n; i++) mean += J[i * d + j] ?? 0;
        mean /= n;
        for (let i = o; i < o + n; i++) M[i * size + j] = (J[i * d + j] ?? 0) - mean;
      }
      o += n;
    }
    for (let i = 0; i < d; i++) {
      M[i * size + i] = (M[i * size + i] ?? 0) + mu;
      const k = blockOf[i] ?? 0;
      M[i * size + d + k] = 1;
      M[(d + k) * size + i] = 1;
    }
  };

  interface Polished {
    x: Float64Array;
    /** max-norm of the Newton correction at x: an estimate of the distance to the exact root */
    error: number;
  }

  // Solves for the Newton correction at x (Jacobian already in J) into rhs; false if hopeless.
  const newtonStep = (scale: number): boolean => {
    for (const mu of [0, 1e-8 * scale, 1e-4 * scale]) {
      assemble(mu);
      for (let i = 0; i < d; i++) rhs[i] = -(residual[i] ?? 0);
      rhs.fill(0, d);
      if (solveInPlace(M, rhs, size, scale)) return true;
    }
    return false;
  };

  const polish = (start: Float64Array): Polished | undefined => {
    const x = Float64Array.from(start);
    projectOntoSimplices(x, layout);
    let res = projectedResidual(field, x, layout, residual);
    const trial = new Float64Array(d);
    for (let iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
      budget.checkTime();
      if (!Number.isFinite(res)) return undefined;
      if (res === 0) return { x, error: 0 };
      field.jacobian(x, J);
      const scale = 1 + jacobianNorm();
      if (!newtonStep(scale)) return undefined;
      let step = 0;
      for (let i = 0; i < d; i++) step = Math.max(step, Math.abs(rhs[i] ?? 0));
      const small = res <= tolerance * scale;
      if (small && step <= STEP_TOLERANCE) return { x, error: step };
      // At the residual's rounding floor a long correction comes from an ill-conditioned
      // Jacobian, not from distance to the root (near a root with F ~ distance^2 the
      // correction is about sqrt(residual)): stay, rather than drift along a flat direction.
      const floorDistance = Math.sqrt(res / scale);
      if (small && step > 10 * floorDistance) return { x, error: floorDistance };
      let alpha = 1;
      let accepted = false;
      for (let halving = 0; halving < MAX_HALVINGS; halving++) {
        for (let i = 0; i < d; i++) trial[i] = (x[i] ?? 0) + alpha * (rhs[i] ?? 0);
        projectOntoSimplices(trial, layout);
        const r = projectedResidual(field, trial, layout, trialResidual);
        // sufficient decrease (Armijo), so that the iteration does not creep
        if (r <= (1 - 1e-4 * alpha) * res) {
          x.set(trial);
          residual.set(trialResidual);
          res = r;
          accepted = true;
          break;
        }
        alpha /= 2;
      }
      // no decrease: the residual is at its rounding floor, or the start leads nowhere
      if (!accepted) return small ? { x, error: step } : undefined;
    }
    field.jacobian(x, J);
    const scale = 1 + jacobianNorm();
    if (!(res <= tolerance * scale) || !newtonStep(scale)) return undefined;
    let step = 0;
    for (let i = 0; i < d; i++) step = Math.max(step, Math.abs(rhs[i] ?? 0));
    return { x, error: step };
  };

  // Shares below SNAP_SHARE are set to 0 and the point polished again; kept only if it is
  // still a rest point by the residual test (so a genuine small share, as under mutation, stays).
  const polishAndSnap = (start: Float64Array): Polished | undefined => {
    const p = polish(start);
    if (!p || !p.x.some((v) => v > 0 && v < SNAP_SHARE)) return p;
    const snapped = p.x.map((v) => (v < SNAP_SHARE ? 0 : v));
    projectOntoSimplices(snapped, layout);
    const q = polish(snapped);
    return q && q.error <= p.error ? q : p;
  };

  const found: Polished[] = [];
  for (const start of [...seeds, ...gridStarts(layout, options.maxStarts)]) {
    const p = polishAndSnap(start);
    if (!p) continue;
    const same = found.findIndex(
      (q) => maxNorm(p.x, q.x) < Math.min(MERGE_RADIUS_CAP, Math.max(duplicate, 4 * (p.error + q.error))),
    );
    if (same < 0) found.push(p);
    else if (p.error < (found[same]?.error ?? 0)) found[same] = p;
  }
  return found.map((p) => p.x);
}
