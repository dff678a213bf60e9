/**
 * Evolutionarily stable strategies of a symmetric game, decided by Haigh's criterion.
 *
 * x is an ESS iff it is a symmetric Nash equilibrium and y.Ay < 0 for every y != 0 in the
 * cone of feasible directions within the best-reply face,
 *     K = { y : sum y = 0, y_j >= 0 for j in T, y_j = 0 outside S u T },
 * where S is the support of x and T the pure strategies outside S that are alternative
 * best replies (Haigh 1975, Adv. Appl. Prob. 7:8; Bomze 1986; Hofbauer & Sigmund 1998,
 * sect. 6.4). With T empty (the regular case) K is a subspace and the test is negative
 * definiteness; otherwise it is strict copositivity on a cone, which a subspace test gets
 * wrong.
 *
 * Coordinates: fix s0 in S, F = S \ {s0}; y = sum_F u_f (e_f - e_s0) + sum_T w_t (e_t - e_s0)
 * with w >= 0. The form is Q = [u; w]^T M [u; w]. Q < 0 on K iff M_FF is negative
 * definite and the Schur complement C = M_TT - M_TF M_FF^{-1} M_FT satisfies w.Cw < 0 for
 * all w >= 0, w != 0; the latter is decided by the largest value of w.Cw on the simplex,
 * attained at a point where C_JJ w_J is constant on its support J (every J is tried).
 */
import { solveInPlace, symmetricEigenvalues } from "./linalg";
import { BEST_REPLY_TOLERANCE, payoffScale, symmetricNash } from "./nash";
import { singularFace } from "./restpoints";

/**
 * Quadratic-form tolerance, relative to the payoff scale: a form value or eigenvalue within
 * this of zero counts as zero, and zero means a mutant does exactly as well as the
 * resident, so the state is not evolutionarily stable.
 */
export const FORM_TOLERANCE = 1e-9;
/** Alternative best replies beyond this many make the copositivity test too large; the answer is then undecided. */
export const MAX_ALTERNATIVE_BEST_REPLIES = 16;

/** Outcome of Haigh's test. */
export interface EssResult {
  /** true / false, or null when the test could not be completed (see reason). */
  ess: boolean | null;
  /** One sentence: why. */
  reason: string;
  /** Alternative best replies outside the support (indices); non-empty means the non-regular case. */
  alternativeBestReplies: number[];
}

/** Haigh's criterion for shares x (a rest point, computed exactly) of the n x n game A. */
export function essSymmetric(A: Float64Array, n: number, x: ArrayLike<number>, names: string[] = []): EssResult {
  const name = (i: number): string => names[i] ?? `strategy ${i + 1}`;
  const scale = payoffScale(A);
  const nash = symmetricNash(A, n, x);
  if (!nash.nash) {
    return {
      ess: false,
      reason: `It is not a Nash equilibrium: ${name(nash.bestDeviation)} earns ${fmt(nash.maxGain)} more than the population average, so it can invade.`,
      alternativeBestReplies: [],
    };
  }
  const S: number[] = [];
  const T: number[] = [];
  const phi = nash.mean[0] ?? 0;
  for (let i = 0; i < n; i++) {
    if ((x[i] ?? 0) > 0) S.push(i);
    else if (Math.abs((nash.payoffs[i] ?? 0) - phi) <= BEST_REPLY_TOLERANCE * scale) T.push(i);
  }
  const s0 = S[S.length - 1];
  if (s0 === undefined) return { ess: null, reason: "The state has an empty support.", alternativeBestReplies: [] };
  const F = S.slice(0, -1);
  if (F.length === 0 && T.length === 0) {
    return { ess: true, reason: `It is a strict Nash equilibrium: every other strategy earns less against ${name(s0)}.`, alternativeBestReplies: [] };
  }
  if (T.length > MAX_ALTERNATIVE_BEST_REPLIES) {
    return { ess: null, reason: `${T.length} strategies outside the support are alternative best replies; the engine decides at most ${MAX_ALTERNATIVE_BEST_REPLIES}.`, alternativeBestReplies: T };
  }
  // M = V^T A V over directions d_a = e_a - e_s0, a in F then T (y.Ay only sees the symmetric part).
  const dirs = [...F, ...T];
  const q = dirs.length;
  const a = (i: number, j: number): number => A[i * n + j] ?? 0;
  const M = new Float64Array(q * q);
  for (let r = 0; r < q; r++) {
    for (let c = 0; c < q; c++) {
      const i = dirs[r] ?? 0;
      const j = dirs[c] ?? 0;
      const v = a(i, j) - a(i, s0) - a(s0, j) + a(s0, s0);
      const vt = a(j, i) - a(j, s0) - a(s0, i) + a(s0, s0);
      M[r * q + c] = 0.5 * (v + vt);
    }
  }
  const tol = FORM_TOLERANCE * scale;
  const f = F.length;
  if (f > 0) {
    const MFF = new Float64Array(f * f);
    for (let r = 0; r < f; r++) for (let c = 0; c < f; c++) MFF[r * f + c] = M[r * q + c] ?? 0;
    const top = symmetricEigenvalues(MFF, f).at(-1) ?? 0;
    if (top > -tol) {
      return {
        ess: false,
        reason:
          top > tol
            ? "A mutant mixing the same strategies differently does better against itself than the resident does against it (the payoff form is not negative on the support)."
            : "A mutant mixing the same strategies differently does exactly as well as the resident (the payoff form has a zero direction on the support), so it is not evolutionarily stable.",
        alternativeBestReplies: T,
      };
    }
  }
  if (T.length === 0) {
    return { ess: true, reason: "It is a regular ESS: Nash equilibrium with the payoff form negative definite on the support (Haigh's criterion).", alternativeBestReplies: [] };
  }
  // Schur complement C = M_TT - M_TF M_FF^{-1} M_FT.
  const t = T.length;
  const C = new Float64Array(t * t);
  for (let r = 0; r < t; r++) {
    for (let c = 0; c < t; c++) C[r * t + c] = M[(f + r) * q + f + c] ?? 0;
  }
  if (f > 0) {
    for (let c = 0; c < t; c++) {
      const MFF = new Float64Array(f * f);
      for (let r = 0; r < f; r++) for (let cc = 0; cc < f; cc++) MFF[r * f + cc] = M[r * q + cc] ?? 0;
      const z = new Float64Array(f);
      for (let r = 0; r < f; r++) z[r] = M[r * q + f + c] ?? 0;
      if (!solveInPlace(MFF, z, f, 0)) return { ess: null, reason: "The payoff form on the support is singular; the test could not be completed.", alternativeBestReplies: T };
      for (let r = 0; r < t; r++) {
        let s = 0;
        for (let k = 0; k < f; k++) s += (M[(f + r) * q + k] ?? 0) * (z[k] ?? 0);
        C[r * t + c] = (C[r * t + c] ?? 0) - s;
      }
    }
  }
  const top = maxOnSimplex(C, t);
  const names2 = T.map(name).join(", ");
  if (top.value === null) {
    return { ess: null, reason: `The copositivity test over the alternative best replies (${names2}) met a degenerate face and could not be completed.`, alternativeBestReplies: T };
  }
  if (top.value < -tol) {
    return { ess: true, reason: `It is an ESS in the non-regular case: ${names2} ${T.length === 1 ? "is an alternative best reply" : "are alternative best replies"}, and the payoff form is negative on the whole cone of mutant directions (Haigh's criterion with copositivity).`, alternativeBestReplies: T };
  }
  return {
    ess: false,
    reason: `A mutant using ${names2} (an alternative best reply outside the support) does ${top.value > tol ? "better" : "exactly as well"} against itself than the resident does against it, so it is not evolutionarily stable.`,
    alternativeBestReplies: T,
  };
}

/**
 * Largest value of w.Cw over the simplex {w >= 0, sum w = 1}: the maximum sits at a point
 * where (C_JJ w_J) is constant (= the value) on the support J; every non-empty J is tried.
 * Returns value null when a face with a positive solution set is singular and no face
 * already shows a non-negative value.
 */
function maxOnSimplex(C: Float64Array, t: number): { value: number | null } {
  let best = -Infinity;
  let degenerate = false;
  let scale = 0;
  for (let i = 0; i < C.length; i++) scale = Math.max(scale, Math.abs(C[i] ?? 0));
  const tol = 1e-12 * Math.max(1, scale);
  for (let mask = 1; mask < 2 ** t; mask++) {
    const J: number[] = [];
    for (let i = 0; i < t; i++) if ((mask >>> i) & 1) J.push(i);
    const d = J.length + 1;
    const M = new Float64Array(d * d);
    const b = new Float64Array(d);
    J.forEach((i, r) => {
      J.forEach((j, c) => {
        M[r * d + c] = C[i * t + j] ?? 0;
      });
      M[r * d + d - 1] = -1;
      M[(d - 1) * d + r] = 1;
    });
    b[d - 1] = 1;
    const M2 = M.slice();
    const b2 = b.slice();
    if (solveInPlace(M2, b2, d, tol)) {
      let ok = true;
      for (let r = 0; r < J.length; r++) if ((b2[r] ?? 0) <= 0) ok = false;
      if (ok) best = Math.max(best, b2[d - 1] ?? -Infinity);
      continue;
    }
    // Singular face: on a segment of stationary points the value (the last unknown) is
    // constant, since w.Cw = mu * sum(w) there; larger solution sets are not resolved.
    const face = singularFace(M, b, d, d, J.length, tol);
    if (face.kind === "point" || face.kind === "continuum") best = Math.max(best, face.last);
    else if (face.kind === "undecided") degenerate = true;
  }
  if (degenerate && best < 0) return { value: null };
  return { value: best };
}

function fmt(v: number): string {
  return Number(v.toPrecision(6)).toString();
}
