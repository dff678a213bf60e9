/**
 * Rest points of the replicator dynamics by support enumeration.
 *
 * Symmetric game (Hofbauer & Sigmund 1998, ch. 7): x with support S is a rest point of
 * dx_i/dt = x_i((Ax)_i - x.Ax) iff (Ax)_i = v for all i in S, sum_S x_i = 1 and x_i > 0 on
 * S. For each non-empty S this is the bordered linear system
 *
 *     [ A_SS  -1 ] [x_S]   [0]
 *     [ 1^T    0 ] [ v ] = [1],
 *
 * solved by Gaussian elimination with partial pivoting. Rest points need not be Nash
 * equilibria. Two populations: (x, y) with supports (S1, S2) is a rest point iff
 * (A y)_i is constant on S1, (B x)_j is constant on S2 and both sum to 1.
 *
 * A singular system is not guessed at: its solution set is computed exactly (rank, null
 * space); a one-dimensional solution set that meets the open face is a continuum of rest
 * points, a larger one that cannot be decided cheaply is reported as undecided. Either
 * makes rest-point counts inconclusive rather than wrong.
 */
import type { Budget } from "./budget";
import { solveGeneral, solveInPlace } from "./linalg";

/** Symmetric games up to this size are enumerated (2^n - 1 supports). */
export const MAX_ENUMERATED_STRATEGIES = 20;
/** Two-population games are enumerated when m + k is at most this. */
export const MAX_ENUMERATED_BIMATRIX = 20;

/** Relative pivot size below which a support's system is treated as singular. */
export const PIVOT_TOLERANCE = 1e-12;
/** A share must exceed this to count as inside the support; smaller ones belong to a smaller face. */
export const SHARE_TOLERANCE = 1e-12;

/** One isolated rest point found by enumeration. */
export interface RestPoint {
  /** Flat state: n shares, or m + k shares (population 1 first). */
  state: Float64Array;
  /** Indices into the flat state with positive share, ascending. */
  support: number[];
}

/** Everything the enumeration found: isolated points, and the faces it could not reduce to points. */
export interface RestPointSet {
  points: RestPoint[];
  /** Supports (flat indices) whose face holds a continuum of rest points. */
  continua: number[][];
  /** Supports whose singular system could not be decided. */
  undecided: number[][];
}

function scaleOf(...mats: Float64Array[]): number {
  let s = 0;
  for (const M of mats) for (let i = 0; i < M.length; i++) s = Math.max(s, Math.abs(M[i] as number));
  return s > 0 ? s : 1;
}

/** Solution set of a face's system on the open face; `last` is the value of the last unknown (the common payoff), constant on a continuum. */
export type Face = { kind: "none" } | { kind: "point"; x: Float64Array; last: number } | { kind: "continuum"; last: number } | { kind: "undecided" };

/**
 * Classifies the solution set of a singular bordered system, restricted to the open face
 * (first `s` unknowns positive; the last unknown is the common payoff).
 */
export function singularFace(M: Float64Array, b: Float64Array, rows: number, cols: number, s: number, tol: number): Face {
  const sol = solveGeneral(M, b, rows, cols, tol);
  if (!sol.consistent) return { kind: "none" };
  const d = sol.nullSpace.length;
  if (d === 0) {
    const x = sol.particular.slice(0, s);
    for (let i = 0; i < s; i++) if ((x[i] as number) <= SHARE_TOLERANCE) return { kind: "none" };
    return { kind: "point", x, last: sol.particular[s] ?? 0 };
  }
  // A null direction that moves no share leaves the point fixed (only the payoff unknown varies).
  const moving = sol.nullSpace.filter((q) => {
    for (let i = 0; i < s; i++) if (Math.abs(q[i] as number) > tol) return true;
    return false;
  });
  if (moving.length === 0) {
    const x = sol.particular.slice(0, s);
    for (let i = 0; i < s; i++) if ((x[i] as number) <= SHARE_TOLERANCE) return { kind: "none" };
    return { kind: "point", x, last: sol.particular[s] ?? 0 };
  }
  if (moving.length === 1) {
    const q = moving[0] as Float64Array;
    const p = sol.particular;
    // Interval of t with p_i + t q_i > 0 for every share.
    let lo = -Infinity;
    let hi = Infinity;
    for (let i = 0; i < s; i++) {
      const pi = p[i] as number;
      const qi = q[i] as number;
      if (Math.abs(qi) <= tol) {
        if (pi <= SHARE_TOLERANCE) return { kind: "none" };
      } else if (qi > 0) lo = Math.max(lo, -pi / qi);
      else hi = Math.min(hi, -pi / qi);
    }
    return hi - lo > 1e-9 ? { kind: "continuum", last: p[s] ?? 0 } : { kind: "none" };
  }
  // Larger solution sets: project the face's barycentre onto the solution set (least squares
  // in the shares); a projection with every share positive proves a continuum.
  const d2 = moving.length;
  const G = new Float64Array(d2 * d2);
  const r = new Float64Array(d2);
  const p = sol.particular;
  for (let a = 0; a < d2; a++) {
    const qa = moving[a] as Float64Array;
    for (let b2 = 0; b2 < d2; b2++) {
      const qb = moving[b2] as Float64Array;
      let g = 0;
      for (let i = 0; i < s; i++) g += (qa[i] as number) * (qb[i] as number);
      G[a * d2 + b2] = g;
    }
    let h = 0;
    for (let i = 0; i < s; i++) h += (qa[i] as number) * (1 / s - (p[i] as number));
    r[a] = h;
  }
  if (solveInPlace(G, r, d2, 1e-14)) {
    let ok = true;
    for (let i = 0; i < s && ok; i++) {
      let xi = p[i] as number;
      for (let a = 0; a < d2; a++) xi += (r[a] as number) * ((moving[a] as Float64Array)[i] as number);
      if (xi <= SHARE_TOLERANCE) ok = false;
    }
    if (ok) return { kind: "continuum", last: p[s] ?? 0 };
  }
  const best = largestMinimumShare(p, moving, s);
  if (best === null) return { kind: "undecided" };
  return best > SHARE_TOLERANCE ? { kind: "continuum", last: p[s] ?? 0 } : { kind: "none" };
}

/** Vertex enumeration of the linear program below stops beyond this many candidate vertices. */
const MAX_LP_VERTICES = 50_000;

/**
 * max tau subject to p_i + (Q t)_i >= tau for every share i: the largest smallest share on
 * the solution set x = p + Q t. The feasible set is a pointed polyhedron (the shares sum to
 * a constant, so B dt = dtau 1 forces dtau = 0 and, with B of full column rank, dt = 0) and
 * tau is bounded by 1/s, so the optimum sits at a vertex: r + 1 active constraints, r the
 * rank of Q's share part (Chvatal, Linear Programming, 1983, ch. 3). Every vertex is tried.
 * Returns null when there are too many to try.
 */
function largestMinimumShare(p: Float64Array, moving: Float64Array[], s: number): number | null {
  // Orthonormal basis of the span of the moving directions' shares (modified Gram-Schmidt).
  const basis: Float64Array[] = [];
  for (const q of moving) {
    const v = q.slice(0, s);
    const norm0 = Math.hypot(...v);
    for (const b of basis) {
      let dot = 0;
      for (let i = 0; i < s; i++) dot += (v[i] as number) * (b[i] as number);
      for (let i = 0; i < s; i++) v[i] = (v[i] as number) - dot * (b[i] as number);
    }
    const norm = Math.hypot(...v);
    if (norm > 1e-10 * Math.max(1, norm0)) basis.push(v.map((x) => x / norm));
  }
  const r = basis.length;
  const k = r + 1;
  if (k > s) return null;
  let count = 1;
  for (let i = 0; i < k; i++) count = (count * (s - i)) / (i + 1);
  if (count > MAX_LP_VERTICES) return null;
  const J = Array.from({ length: k }, (_, i) => i);
  const M = new Float64Array(k * k);
  const rhs = new Float64Array(k);
  let best = -Infinity;
  for (;;) {
    J.forEach((i, row) => {
      for (let a = 0; a < r; a++) M[row * k + a] = (basis[a] as Float64Array)[i] as number;
      M[row * k + r] = -1;
      rhs[row] = -(p[i] as number);
    });
    if (solveInPlace(M, rhs, k, 1e-12)) {
      const tau = rhs[r] as number;
      if (tau > best) {
        let feasible = true;
        for (let i = 0; i < s && feasible; i++) {
          let xi = p[i] as number;
          for (let a = 0; a < r; a++) xi += (rhs[a] as number) * ((basis[a] as Float64Array)[i] as number);
          if (xi - tau < -1e-10) feasible = false;
        }
        if (feasible) best = tau;
      }
    }
    // next combination of k indices out of s
    let i = k - 1;
    while (i >= 0 && (J[i] as number) === s - k + i) i--;
    if (i < 0) break;
    J[i] = (J[i] as number) + 1;
    for (let j = i + 1; j < k; j++) J[j] = (J[j - 1] as number) + 1;
  }
  return Number.isFinite(best) ? best : null;
}

/** Scratch buffers for square solves of faces (at most 25 x 25). */
const SCRATCH_M = new Float64Array(26 * 26);
const SCRATCH_B = new Float64Array(26);

/**
 * Face system for shares on `colsIdx` that make the payoffs (rows `rowsIdx` of P, whose row
 * stride is pCols) equal: [P_RC -1; 1^T 0][x; v] = [0; 1]. With more equations than
 * unknowns (generically inconsistent) a square subsystem is solved first and the remaining
 * equations are checked against its unique solution, which settles most such faces without
 * the general rank-revealing solve.
 */
function borderedFace(P: Float64Array, pCols: number, rowsIdx: number[], colsIdx: number[], tol: number, knownSingular = false): Face {
  const r = rowsIdx.length + 1;
  const c = colsIdx.length + 1;
  const entry = (a: number, bb: number): number => {
    if (a === r - 1) return bb === c - 1 ? 0 : 1;
    if (bb === c - 1) return -1;
    return P[(rowsIdx[a] as number) * pCols + (colsIdx[bb] as number)] as number;
  };
  if (r >= c && !(knownSingular && r === c)) {
    // Square subsystem: the first c - 1 equality rows and the sum row.
    const M2 = SCRATCH_M;
    const b2 = SCRATCH_B;
    for (let a = 0; a < c; a++) {
      const src = a === c - 1 ? r - 1 : a;
      for (let bb = 0; bb < c; bb++) M2[a * c + bb] = entry(src, bb);
      b2[a] = src === r - 1 ? 1 : 0;
    }
    if (solveInPlace(M2, b2, c, tol)) {
      const x = b2.slice(0, c);
      let scale = 1;
      for (let i = 0; i < c; i++) scale = Math.max(scale, Math.abs(x[i] as number));
      for (let a = c - 1; a < r - 1; a++) {
        let res = 0;
        for (let bb = 0; bb < c; bb++) res += entry(a, bb) * (x[bb] as number);
        if (Math.abs(res) > 1e-9 * scale * (tol / PIVOT_TOLERANCE)) return { kind: "none" }; // tol / PIVOT_TOLERANCE is the payoff scale
      }
      for (let i = 0; i < c - 1; i++) if ((x[i] as number) <= SHARE_TOLERANCE) return { kind: "none" };
      return { kind: "point", x: x.slice(0, c - 1), last: x[c - 1] as number };
    }
  }
  const M = new Float64Array(r * c);
  const b = new Float64Array(r);
  for (let a = 0; a < r; a++) for (let bb = 0; bb < c; bb++) M[a * c + bb] = entry(a, bb);
  b[r - 1] = 1;
  return singularFace(M, b, r, c, c - 1, tol);
}

function supportOf(mask: number, n: number, offset = 0): number[] {
  const out: number[] = [];
  for (let i = 0; i < n; i++) if ((mask >>> i) & 1) out.push(i + offset);
  return out;
}

/**
 * All rest points of the symmetric replicator dynamics for the n x n payoff matrix A
 * (row-major, A[i*n+j] = payoff to i against j), by enumeration of the 2^n - 1 supports.
 *
 * Supports are visited depth first (each extends its parent by a larger index), and the
 * LU factors of the bordered matrix are extended by one row and column per step (bordering,
 * Golub & Van Loan sect. 3.2), so a support costs O(s^2) instead of O(s^3). The bordering
 * does not pivot, so it only rules faces out: a face whose shares are not all clearly
 * negative-free (every share above -1e-6) is solved again from scratch with partial
 * pivoting and, if singular, for its whole solution set, and so is every face below a small
 * pivot or large multipliers. Buffers are allocated once.
 */
export function symmetricRestPoints(A: Float64Array, n: number, budget?: Budget): RestPointSet {
  if (n > MAX_ENUMERATED_STRATEGIES) throw new RangeError(`support enumeration is limited to ${MAX_ENUMERATED_STRATEGIES} strategies`);
  const scale = scaleOf(A);
  const tol = PIVOT_TOLERANCE * scale;
  const D = n + 1;
  // Row k of the bordered matrix: k = 0 is strategy idx[0], k = 1 the sum row, k >= 2 strategy idx[k-1].
  // Column c: c = 0 the common payoff v, c >= 1 the share of idx[c-1].
  const L = new Float64Array(D * D);
  const U = new Float64Array(D * D);
  const y = new Float64Array(D);
  const z = new Float64Array(D);
  const M = new Float64Array(D * D);
  const b = new Float64Array(D);
  const idx = new Int32Array(n);
  const points: RestPoint[] = [];
  const continua: number[][] = [];
  const undecided: number[][] = [];
  let visited = 0;

  /** Extends the factors by row and column d (the new strategy is idx[d-1]); false if unreliable. */
  const extend = (d: number): boolean => {
    const j = idx[d - 1] as number;
    const i0 = idx[0] as number;
    for (let k = 0; k < d; k++) {
      let v = k === 1 ? 1 : (A[(k === 0 ? i0 : (idx[k - 1] as number)) * n + j] as number);
      const lk = k * D;
      for (let m = 0; m < k; m++) v -= (L[lk + m] as number) * (U[m * D + d] as number);
      U[lk + d] = v;
    }
    const ld = d * D;
    let growth = 0;
    for (let c = 0; c < d; c++) {
      let v = c === 0 ? -1 : (A[j * n + (idx[c - 1] as number)] as number);
      for (let m = 0; m < c; m++) v -= (L[ld + m] as number) * (U[m * D + c] as number);
      const l = v / (U[c * D + c] as number);
      L[ld + c] = l;
      const al = l < 0 ? -l : l;
      if (al > growth) growth = al;
    }
    let piv = A[j * n + j] as number;
    let yd = 0;
    for (let m = 0; m < d; m++) {
      const l = L[ld + m] as number;
      piv -= l * (U[m * D + d] as number);
      yd -= l * (y[m] as number);
    }
    U[ld + d] = piv;
    y[d] = yd;
    return Math.abs(piv) > 1e-8 * scale && growth < 1e6;
  };

  /** Solves the current support (size s) from scratch, with pivoting and singular-face analysis. */
  const fresh = (s: number): void => {
    const d = s + 1;
    for (let a = 0; a < s; a++) {
      const ra = (idx[a] as number) * n;
      const row = a * d;
      for (let c = 0; c < s; c++) M[row + c] = A[ra + (idx[c] as number)] as number;
      M[row + s] = -1;
      b[a] = 0;
    }
    const last = s * d;
    for (let c = 0; c < s; c++) M[last + c] = 1;
    M[last + s] = 0;
    b[s] = 1;
    if (eliminate(M, b, d, tol)) {
      for (let a = 0; a < s; a++) if ((b[a] as number) <= SHARE_TOLERANCE) return;
      const state = new Float64Array(n);
      for (let a = 0; a < s; a++) state[idx[a] as number] = b[a] as number;
      points.push({ state, support: Array.from(idx.subarray(0, s)) });
      return;
    }
    const sup = Array.from(idx.subarray(0, s));
    const face = borderedFace(A, n, sup, sup, tol, true); // the pivoted solve above found it singular
    if (face.kind === "point") {
      const state = new Float64Array(n);
      sup.forEach((i, a) => {
        state[i] = face.x[a] as number;
      });
      points.push({ state, support: sup });
    } else if (face.kind === "continuum") continua.push(sup);
    else if (face.kind === "undecided") undecided.push(sup);
  };

  /** Decides the current support of size s from the factors (dimension s + 1). */
  const decide = (s: number, reliable: boolean): void => {
    if (!reliable) {
      fresh(s);
      return;
    }
    const d = s + 1;
    let minShare = Infinity;
    for (let k = d - 1; k >= 0; k--) {
      const lk = k * D;
      let v = y[k] as number;
      for (let c = k + 1; c < d; c++) v -= (U[lk + c] as number) * (z[c] as number);
      v /= U[lk + k] as number;
      z[k] = v;
      if (k >= 1 && v < minShare) {
        minShare = v;
        if (v < -1e-6) return; // clearly outside the face
      }
    }
    // Near the boundary the pivoted solve decides; a rest point found is solved again with
    // pivoting too (a few thousand supports at most), so every reported state comes from it.
    if (minShare > -1e-6) fresh(s);
  };

  const visit = (s: number, reliable: boolean): void => {
    if ((++visited & 0xfff) === 0) budget?.checkTime();
    decide(s, reliable);
    for (let j = (idx[s - 1] as number) + 1; j < n; j++) {
      idx[s] = j;
      visit(s + 1, reliable && extend(s + 1));
    }
  };

  for (let i = 0; i < n; i++) {
    idx[0] = i;
    // Support {i}: rows (strategy i, sum), columns (v, x_i): [[-1, a_ii], [0, 1]].
    L.fill(0);
    L[0] = 1;
    L[D + 1] = 1;
    U[0] = -1;
    U[1] = A[i * n + i] as number;
    U[D] = 0;
    U[D + 1] = 1;
    y[0] = 0;
    y[1] = 1;
    visit(1, true);
  }
  return { points: dedupe(points), continua, undecided };
}

/**
 * In-place Gaussian elimination with partial pivoting on a d x d system stored with row
 * stride d; the solution is left in b. Returns false on a pivot at or below tol.
 */
function eliminate(M: Float64Array, b: Float64Array, d: number, tol: number): boolean {
  for (let c = 0; c < d; c++) {
    let p = c;
    let best = Math.abs(M[c * d + c] as number);
    for (let r = c + 1; r < d; r++) {
      const v = Math.abs(M[r * d + c] as number);
      if (v > best) {
        best = v;
        p = r;
      }
    }
    if (best <= tol) return false;
    const cc = c * d;
    if (p !== c) {
      const pc = p * d;
      for (let j = c; j < d; j++) {
        const t = M[cc + j] as number;
        M[cc + j] = M[pc + j] as number;
        M[pc + j] = t;
      }
      const t = b[c] as number;
      b[c] = b[p] as number;
      b[p] = t;
    }
    const inv = 1 / (M[cc + c] as number);
    const bc = b[c] as number;
    for (let r = c + 1; r < d; r++) {
      const rc = r * d;
      const f = (M[rc + c] as number) * inv;
      if (f === 0) continue;
      for (let j = c + 1; j < d; j++) M[rc + j] = (M[rc + j] as number) - f * (M[cc + j] as number);
      b[r] = (b[r] as number) - f * bc;
    }
  }
  for (let r = d - 1; r >= 0; r--) {
    const rr = r * d;
    let s = b[r] as number;
    for (let j = r + 1; j < d; j++) s -= (M[rr + j] as number) * (b[j] as number);
    b[r] = s / (M[rr + r] as number);
  }
  return true;
}

/**
 * Removes near-duplicates (max-norm 1e-9) that arise when a share is numerically tiny: the
 * point is kept with the smaller support. Only points with a share below 1e-8 are compared.
 */
function dedupe(points: RestPoint[]): RestPoint[] {
  const suspicious = points.filter((p) => p.support.some((i) => (p.state[i] as number) < 1e-8));
  if (suspicious.length === 0) return points;
  const drop = new Set<RestPoint>();
  for (const p of suspicious) {
    for (const q of points) {
      if (q === p || drop.has(q) || q.support.length >= p.support.length) continue;
      let d = 0;
      for (let i = 0; i < p.state.length; i++) d = Math.max(d, Math.abs((p.state[i] as number) - (q.state[i] as number)));
      if (d <= 1e-9) {
        drop.add(p);
        break;
      }
    }
  }
  return points.filter((p) => !drop.has(p));
}

/**
 * All rest points of the two-population replicator dynamics
 * dx_i/dt = x_i((Ay)_i - x.Ay), dy_j/dt = y_j((Bx)_j - y.Bx), with A m x k and B k x m
 * (row-major), by enumeration of support pairs. States are flat: m shares then k shares.
 */
export function bimatrixRestPoints(A: Float64Array, B: Float64Array, m: number, k: number, budget?: Budget): RestPointSet {
  if (m + k > MAX_ENUMERATED_BIMATRIX) throw new RangeError(`support enumeration is limited to ${MAX_ENUMERATED_BIMATRIX} strategies in all`);
  const tol = PIVOT_TOLERANCE * scaleOf(A, B);
  const points: RestPoint[] = [];
  const continua: number[][] = [];
  const undecided: number[][] = [];
  let count = 0;
  for (let m1 = 1; m1 < 2 ** m; m1++) {
    const S1 = supportOf(m1, m);
    for (let m2 = 1; m2 < 2 ** k; m2++) {
      if ((++count & 0xfff) === 0) budget?.checkTime();
      const S2 = supportOf(m2, k);
      // Shares x on S1 are fixed by population 2's indifference on S2 (rows of B), and vice
      // versa. The system with more equations than unknowns is tried first: it rarely has a solution.
      let fx: Face;
      let fy: Face;
      if (S2.length >= S1.length) {
        fx = borderedFace(B, m, S2, S1, tol);
        if (fx.kind === "none") continue;
        fy = borderedFace(A, k, S1, S2, tol);
      } else {
        fy = borderedFace(A, k, S1, S2, tol);
        if (fy.kind === "none") continue;
        fx = borderedFace(B, m, S2, S1, tol);
      }
      if (fx.kind === "none" || fy.kind === "none") continue;
      const flat = [...S1, ...S2.map((j) => j + m)];
      if (fx.kind === "point" && fy.kind === "point") {
        const state = new Float64Array(m + k);
        S1.forEach((i, a) => {
          state[i] = fx.x[a] as number;
        });
        S2.forEach((j, a) => {
          state[m + j] = fy.x[a] as number;
        });
        points.push({ state, support: flat });
      } else if (fx.kind === "undecided" || fy.kind === "undecided") undecided.push(flat);
      else continua.push(flat);
    }
  }
  return { points: dedupe(points), continua, undecided };
}

/**
 * The rest point of the replicator dynamics whose support is exactly `support` (flat
 * indices; for two populations, population 1's indices first, then m + j), if that face's
 * system has a unique solution with every share positive. `game` gives the matrices.
 */
export function restPointOnSupport(
  game: { kind: "symmetric"; n: number; A: Float64Array } | { kind: "bimatrix"; m: number; k: number; A: Float64Array; B: Float64Array },
  support: number[],
): { kind: "point"; state: Float64Array } | { kind: "none" | "continuum" | "undecided" } {
  if (game.kind === "symmetric") {
    const tol = PIVOT_TOLERANCE * scaleOf(game.A);
    const sup = [...support].sort((a, b) => a - b);
    const face = borderedFace(game.A, game.n, sup, sup, tol);
    if (face.kind !== "point") return { kind: face.kind };
    const state = new Float64Array(game.n);
    sup.forEach((i, a) => {
      state[i] = face.x[a] as number;
    });
    return { kind: "point", state };
  }
  const { m, k, A, B } = game;
  const tol = PIVOT_TOLERANCE * scaleOf(A, B);
  const S1 = support.filter((i) => i < m).sort((a, b) => a - b);
  const S2 = support.filter((i) => i >= m).map((i) => i - m).sort((a, b) => a - b);
  if (S1.length === 0 || S2.length === 0) return { kind: "none" };
  const fx = borderedFace(B, m, S2, S1, tol);
  const fy = borderedFace(A, k, S1, S2, tol);
  if (fx.kind === "none" || fy.kind === "none") return { kind: "none" };
  if (fx.kind === "point" && fy.kind === "point") {
    const state = new Float64Array(m + k);
    S1.forEach((i, a) => {
      state[i] = fx.x[a] as number;
    });
    S2.forEach((j, a) => {
      state[m + j] = fy.x[a] as number;
    });
    return { kind: "point", state };
  }
  return { kind: fx.kind === "undecided" || fy.kind === "undecided" ? "undecided" : "continuum" };
}
