/**
 * Dense linear algebra on row-major Float64Array buffers: Gaussian elimination with
 * partial pivoting (square solve and a general rank-revealing solve for rectangular or
 * singular systems), and eigenvalues of a general real matrix.
 */
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import type { Eigenvalue } from "./types";

/**
 * Solves the square system M z = b in place by Gaussian elimination with partial pivoting
 * (Golub & Van Loan, Matrix Computations, alg. 3.4.1). `M` (n*n, row-major) and `b` are
 * overwritten; the solution is left in `b`. Returns false when a pivot falls below
 * `pivotTol` (the matrix is singular or nearly so), leaving the buffers garbled.
 */
export function solveInPlace(M: Float64Array, b: Float64Array, n: number, pivotTol: number): boolean {
  for (let c = 0; c < n; c++) {
    let p = c;
    let best = Math.abs(M[c * n + c] ?? 0);
    for (let r = c + 1; r < n; r++) {
      const v = Math.abs(M[r * n + c] ?? 0);
      if (v > best) {
        best = v;
        p = r;
      }
    }
    if (best <= pivotTol) return false;
    if (p !== c) {
      const pc = p * n;
      const cc = c * n;
      for (let j = c; j < n; j++) {
        const t = M[cc + j] ?? 0;
        M[cc + j] = M[pc + j] ?? 0;
        M[pc + j] = t;
      }
      const t = b[c] ?? 0;
      b[c] = b[p] ?? 0;
      b[p] = t;
    }
    const cc = c * n;
    const piv = M[cc + c] ?? 0;
    const bc = b[c] ?? 0;
    for (let r = c + 1; r < n; r++) {
      const rc = r * n;
      const f = (M[rc + c] ?? 0) / piv;
      if (f === 0) continue;
      for (let j = c + 1; j < n; j++) M[rc + j] = (M[rc + j] ?? 0) - f * (M[cc + j] ?? 0);
      b[r] = (b[r] ?? 0) - f * bc;
    }
  }
  for (let r = n - 1; r >= 0; r--) {
    const rr = r * n;
    let s = b[r] ?? 0;
    for (let j = r + 1; j < n; j++) s -= (M[rr + j] ?? 0) * (b[j] ?? 0);
    b[r] = s / (M[rr + r] ?? 1);
  }
  return true;
}

/** Result of a general linear solve: consistent systems give a particular solution plus a null-space basis. */
export interface LinearSolution {
  consistent: boolean;
  rank: number;
  /** A particular solution (free variables set to 0); empty when inconsistent. */
  particular: Float64Array;
  /** Basis of the null space of M (each of length cols). */
  nullSpace: Float64Array[];
}

/**
 * Solves M z = b for an r x c matrix by reduction to reduced row echelon form with partial
 * pivoting, treating pivots below `tol` as zero. Gives the rank, whether the system is
 * consistent (residual rows within `tol`), a particular solution and a null-space basis.
 * Inputs are not modified.
 */
export function solveGeneral(Min: Float64Array, bin: Float64Array, r: number, c: number, tol: number): LinearSolution {
  const w = c + 1;
  const T = new Float64Array(r * w);
  for (let i = 0; i < r; i++) {
    for (let j = 0; j < c; j++) T[i * w + j] = Min[i * c + j] ?? 0;
    T[i * w + c] = bin[i] ?? 0;
  }
  const pivotCols: number[] = [];
  let row = 0;
  for (let col = 0; col < c && row < r; col++) {
    let p = row;
    let best = Math.abs(T[row * w + col] ?? 0);
    for (let i = row + 1; i < r; i++) {
      const v = Math.abs(T[i * w + col] ?? 0);
      if (v > best) {
        best = v;
        p = i;
      }
    }
    if (best <= tol) {
      for (let i = row; i < r; i++) T[i * w + col] = 0;
      continue;
    }
    if (p !== row) {
      for (let j = 0; j < w; j++) {
        const t = T[row * w + j] ?? 0;
        T[row * w + j] = T[p * w + j] ?? 0;
        T[p * w + j] = t;
      }
    }
    const piv = T[row * w + col] ?? 1;
    for (let j = 0; j < w; j++) T[row * w + j] = (T[row * w + j] ?? 0) / piv;
    for (let i = 0; i < r; i++) {
      if (i === row) continue;
      const f = T[i * w + col] ?? 0;
      if (f === 0) continue;
      for (let j = 0; j < w; j++) T[i * w + j] = (T[i * w + j] ?? 0) - f * (T[row * w + j] ?? 0);
    }
    pivotCols.push(col);
    row++;
  }
  const rank = pivotCols.length;
  let bScale = 1;
  for (let i = 0; i < r; i++) bScale = Math.max(bScale, Math.abs(bin[i] ?? 0));
  for (let i = rank; i < r; i++) {
    if (Math.abs(T[i * w + c] ?? 0) > tol * bScale) {
      return { consistent: false, rank, particular: new Float64Array(0), nullSpace: [] };
    }
  }
  const particular = new Float64Array(c);
  pivotCols.forEach((col, i) => {
    particular[col] = T[i * w + c] ?? 0;
  });
  const isPivot = new Uint8Array(c);
  for (const col of pivotCols) isPivot[col] = 1;
  const nullSpace: Float64Array[] = [];
  for (let f = 0; f < c; f++) {
    if (isPivot[f] === 1) continue;
    const v = new Float64Array(c);
    v[f] = 1;
    pivotCols.forEach((col, i) => {
      v[col] = -(T[i * w + f] ?? 0);
    });
    nullSpace.push(v);
  }
  return { consistent: true, rank, particular, nullSpace };
}

/**
 * Eigenvalues of a general real n x n matrix (row-major), as [re, im] pairs, via the
 * Hessenberg reduction and shifted QR iteration of ml-matrix's EigenvalueDecomposition
 * (after JAMA / EISPACK hqr2).
 */
export function eigenvalues(M: Float64Array, n: number): Eigenvalue[] {
  if (n === 0) return [];
  if (n === 1) return [[M[0] ?? 0, 0]];
  const rows: number[][] = [];
  for (let i = 0; i < n; i++) rows.push(Array.from(M.subarray(i * n, i * n + n)));
  const evd = new EigenvalueDecomposition(new Matrix(rows));
  const re = evd.realEigenvalues;
  const im = evd.imaginaryEigenvalues;
  const out: Eigenvalue[] = [];
  for (let i = 0; i < n; i++) out.push([re[i] ?? Number.NaN, im[i] ?? 0]);
  return out;
}

/** Eigenvalues of a real symmetric n x n matrix (row-major), ascending. */
export function symmetricEigenvalues(M: Float64Array, n: number): number[] {
  if (n === 0) return [];
  const rows: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row: number[] = [];
    for (let j = 0; j < n; j++) row.push(0.5 * ((M[i * n + j] ?? 0) + (M[j * n + i] ?? 0)));
    rows.push(row);
  }
  const evd = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true });
  return [...evd.realEigenvalues].sort((a, b) => a - b);
}
