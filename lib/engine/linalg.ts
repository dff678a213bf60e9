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
 * Reduces the n x n row-major matrix H in place to upper Hessenberg form by Householder
 * similarity transformations (Golub & Van Loan alg. 7.4.2; JAMA's orthes).
 */
function hessenberg(H: Float64Array, n: number): void {
  const ort = new Float64Array(n);
  for (let m = 1; m < n - 1; m++) {
    let scale = 0;
    for (let i = m; i < n; i++) scale += Math.abs(H[i * n + m - 1] as number);
    if (scale === 0) continue;
    let h = 0;
    for (let i = n - 1; i >= m; i--) {
      const v = (H[i * n + m - 1] as number) / scale;
      ort[i] = v;
      h += v * v;
    }
    let g = Math.sqrt(h);
    if ((ort[m] as number) > 0) g = -g;
    h -= (ort[m] as number) * g;
    ort[m] = (ort[m] as number) - g;
    for (let j = m; j < n; j++) {
      let f = 0;
      for (let i = n - 1; i >= m; i--) f += (ort[i] as number) * (H[i * n + j] as number);
      f /= h;
      for (let i = m; i < n; i++) H[i * n + j] = (H[i * n + j] as number) - f * (ort[i] as number);
    }
    for (let i = 0; i < n; i++) {
      let f = 0;
      for (let j = n - 1; j >= m; j--) f += (ort[j] as number) * (H[i * n + j] as number);
      f /= h;
      for (let j = m; j < n; j++) H[i * n + j] = (H[i * n + j] as number) - f * (ort[j] as number);
    }
    ort[m] = scale * (ort[m] as number);
    H[m * n + m - 1] = scale * g;
  }
}

const sign = (a: number, b: number): number => (b >= 0 ? Math.abs(a) : -Math.abs(a));

/**
 * Eigenvalues of an upper Hessenberg matrix by the shifted double-step (Francis) QR
 * iteration, eigenvalues only (EISPACK hqr; Press et al., Numerical Recipes, sect. 11.6).
 * Overwrites `a`; returns false if an eigenvalue needs more than 60 iterations.
 */
function hqr(a: Float64Array, n: number, wr: Float64Array, wi: Float64Array): boolean {
  const at = (i: number, j: number): number => a[i * n + j] as number;
  let anorm = 0;
  for (let i = 0; i < n; i++) for (let j = Math.max(i - 1, 0); j < n; j++) anorm += Math.abs(at(i, j));
  let nn = n - 1;
  let t = 0;
  let its = 0;
  let p = 0;
  let q = 0;
  let r = 0;
  let x = 0;
  let y = 0;
  let z = 0;
  let w = 0;
  let s = 0;
  while (nn >= 0) {
    let l = nn;
    for (; l >= 1; l--) {
      s = Math.abs(at(l - 1, l - 1)) + Math.abs(at(l, l));
      if (s === 0) s = anorm;
      if (Math.abs(at(l, l - 1)) + s === s) {
        a[l * n + l - 1] = 0;
        break;
      }
    }
    x = at(nn, nn);
    if (l === nn) {
      wr[nn] = x + t;
      wi[nn] = 0;
      nn--;
      its = 0;
      continue;
    }
    y = at(nn - 1, nn - 1);
    w = at(nn, nn - 1) * at(nn - 1, nn);
    if (l === nn - 1) {
      p = 0.5 * (y - x);
      q = p * p + w;
      z = Math.sqrt(Math.abs(q));
      x += t;
      if (q >= 0) {
        z = p + sign(z, p);
        wr[nn - 1] = x + z;
        wr[nn] = z !== 0 ? x - w / z : x + z;
        wi[nn - 1] = 0;
        wi[nn] = 0;
      } else {
        wr[nn - 1] = x + p;
        wr[nn] = x + p;
        wi[nn - 1] = z;
        wi[nn] = -z;
      }
      nn -= 2;
      its = 0;
      continue;
    }
    if (its >= 60) return false;
    if (its === 10 || its === 20) {
      // exceptional shift
      t += x;
      for (let i = 0; i <= nn; i++) a[i * n + i] = at(i, i) - x;
      s = Math.abs(at(nn, nn - 1)) + Math.abs(at(nn - 1, nn - 2));
      x = 0.75 * s;
      y = x;
      w = -0.4375 * s * s;
    }
    its++;
    let m = nn - 2;
    for (; m >= l; m--) {
      z = at(m, m);
      r = x - z;
      s = y - z;
      p = (r * s - w) / at(m + 1, m) + at(m, m + 1);
      q = at(m + 1, m + 1) - z - r - s;
      r = at(m + 2, m + 1);
      s = Math.abs(p) + Math.abs(q) + Math.abs(r);
      p /= s;
      q /= s;
      r /= s;
      if (m === l) break;
      const u = Math.abs(at(m, m - 1)) * (Math.abs(q) + Math.abs(r));
      const v = Math.abs(p) * (Math.abs(at(m - 1, m - 1)) + Math.abs(z) + Math.abs(at(m + 1, m + 1)));
      if (u + v === v) break;
    }
    for (let i = m + 2; i <= nn; i++) {
      a[i * n + i - 2] = 0;
      if (i !== m + 2) a[i * n + i - 3] = 0;
    }
    for (let k = m; k <= nn - 1; k++) {
      if (k !== m) {
        p = at(k, k - 1);
        q = at(k + 1, k - 1);
        r = k !== nn - 1 ? at(k + 2, k - 1) : 0;
        x = Math.abs(p) + Math.abs(q) + Math.abs(r);
        if (x !== 0) {
          p /= x;
          q /= x;
          r /= x;
        }
      }
      s = sign(Math.sqrt(p * p + q * q + r * r), p);
      if (s !== 0) {
        if (k === m) {
          if (l !== m) a[k * n + k - 1] = -at(k, k - 1);
        } else a[k * n + k - 1] = -s * x;
        p += s;
        x = p / s;
        y = q / s;
        z = r / s;
        q /= p;
        r /= p;
        for (let j = k; j <= nn; j++) {
          p = at(k, j) + q * at(k + 1, j);
          if (k !== nn - 1) {
            p += r * at(k + 2, j);
            a[(k + 2) * n + j] = at(k + 2, j) - p * z;
          }
          a[(k + 1) * n + j] = at(k + 1, j) - p * y;
          a[k * n + j] = at(k, j) - p * x;
        }
        const mmin = nn < k + 3 ? nn : k + 3;
        for (let i = l; i <= mmin; i++) {
          p = x * at(i, k) + y * at(i, k + 1);
          if (k !== nn - 1) {
            p += z * at(i, k + 2);
            a[i * n + k + 2] = at(i, k + 2) - p * r;
          }
          a[i * n + k + 1] = at(i, k + 1) - p * q;
          a[i * n + k] = at(i, k) - p;
        }
      }
    }
  }
  return true;
}

/**
 * Eigenvalues of a general real n x n matrix (row-major), as [re, im] pairs: Householder
 * reduction to Hessenberg form, then the shifted double-step QR iteration on Float64Array
 * (eigenvalues only). Should the iteration not converge, ml-matrix's
 * EigenvalueDecomposition (JAMA / EISPACK hqr2) is used instead.
 */
export function eigenvalues(M: Float64Array, n: number): Eigenvalue[] {
  if (n === 0) return [];
  if (n === 1) return [[M[0] ?? 0, 0]];
  const H = M.slice(0, n * n);
  hessenberg(H, n);
  const wr = new Float64Array(n);
  const wi = new Float64Array(n);
  if (hqr(H, n, wr, wi)) {
    const out: Eigenvalue[] = [];
    for (let i = 0; i < n; i++) out.push([wr[i] as number, wi[i] as number]);
    return out;
  }
  return eigenvaluesByMlMatrix(M, n);
}

/** Eigenvalues by ml-matrix's EigenvalueDecomposition (used as the fallback, and in tests). */
export function eigenvaluesByMlMatrix(M: Float64Array, n: number): Eigenvalue[] {
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
