/**
 * Fixation probability of a single mutant in the frequency-dependent Moran process of
 * Nowak, Sasaki, Taylor and Fudenberg (2004), "Emergence of cooperation and evolutionary
 * stability in finite populations", Nature 428:646.
 *
 * With i mutants (strategy A) among N individuals and payoff matrix entries a = A_AA,
 * b = A_AB, c = A_BA, d = A_BB, each individual meets the other N - 1:
 *   f_i = 1 - w + w [a (i - 1) + b (N - i)] / (N - 1)     (mutant)
 *   g_i = 1 - w + w [c i + d (N - i - 1)] / (N - 1)       (resident)
 *   rho = 1 / (1 + sum_{k=1}^{N-1} prod_{i=1}^{k} g_i / f_i).
 * The partial products are kept as logarithms and summed with a running log-sum-exp, so
 * N = 100 000 neither overflows nor underflows on the way; O(N) time, O(1) memory.
 */

/** The Moran process needs positive fitness; this selection intensity makes one non-positive. */
export class NonPositiveFitness extends Error {
  constructor(
    readonly type: "mutant" | "resident",
    /** number of mutants in the population at which it happens */
    readonly mutants: number,
    readonly fitness: number,
    readonly selectionIntensity: number,
  ) {
    super(
      `the ${type}s' fitness is ${fitness} (not positive) with ${mutants} mutant${mutants === 1 ? "" : "s"} at selection intensity ${selectionIntensity}; the Moran process needs positive fitness, so choose a weaker selection intensity or shift the payoffs`,
    );
    this.name = "NonPositiveFitness";
  }
}

/** Arguments outside the process's domain (population size, selection intensity, strategy index). */
export class MoranInputError extends Error {
  constructor(
    readonly argument: "populationSize" | "selectionIntensity" | "mutant" | "resident" | "A",
    message: string,
  ) {
    super(message);
    this.name = "MoranInputError";
  }
}

/**
 * log(rho) for the process in the module comment; use it where rho itself would underflow
 * (a strongly disfavoured mutant in a large population). A is n x n row-major,
 * A[i*n + j] = payoff to i against j. Throws MoranInputError for bad arguments and
 * NonPositiveFitness when a fitness f_i or g_i (1 <= i <= N-1) is not positive.
 */
export function logFixationProbability(
  A: Float64Array,
  n: number,
  mutant: number,
  resident: number,
  populationSize: number,
  selectionIntensity: number,
): number {
  const N = populationSize;
  const w = selectionIntensity;
  if (A.length !== n * n) throw new MoranInputError("A", `the payoff matrix has ${A.length} entries, not ${n} x ${n}`);
  if (!(Number.isInteger(N) && N >= 2)) {
    throw new MoranInputError("populationSize", `the population size must be an integer of at least 2; got ${N}`);
  }
  if (!(w >= 0 && w <= 1)) {
    throw new MoranInputError("selectionIntensity", `the selection intensity must lie in [0, 1]; got ${w}`);
  }
  for (const [which, s] of [
    ["mutant", mutant],
    ["resident", resident],
  ] as const) {
    if (!(Number.isInteger(s) && s >= 0 && s < n)) {
      throw new MoranInputError(which, `the ${which} strategy index ${s} is not one of 0..${n - 1}`);
    }
  }
  const a = A[mutant * n + mutant] ?? 0;
  const b = A[mutant * n + resident] ?? 0;
  const c = A[resident * n + mutant] ?? 0;
  const d = A[resident * n + resident] ?? 0;
  // Running log-sum-exp over the terms L_0 = 0 (the leading 1) and L_k = sum_{i<=k} log(g_i/f_i).
  let top = 0;
  let scaled = 1; // sum of exp(L_k - top)
  let L = 0;
  for (let i = 1; i < N; i++) {
    // 1 - w + w*pi written as 1 + w*(pi - 1) so that log1p keeps precision under weak selection
    const pf = (a * (i - 1) + b * (N - i)) / (N - 1);
    const pg = (c * i + d * (N - i - 1)) / (N - 1);
    const uf = w * (pf - 1);
    const ug = w * (pg - 1);
    if (!(uf > -1)) throw new NonPositiveFitness("mutant", i, 1 + uf, w);
    if (!(ug > -1)) throw new NonPositiveFitness("resident", i, 1 + ug, w);
    L += Math.log1p(ug) - Math.log1p(uf);
    if (L > top) {
      scaled = scaled * Math.exp(top - L) + 1;
      top = L;
    } else {
      scaled += Math.exp(L - top);
    }
  }
  return -(top + Math.log(scaled));
}

/**
 * Probability that a single `mutant` fixes in a population of N - 1 `resident`s under the
 * frequency-dependent Moran process with fitness 1 - w + w * (expected payoff against the
 * other N - 1 individuals) (Nowak, Sasaki, Taylor and Fudenberg 2004; see the module
 * comment for the formula). exp of logFixationProbability: a value below about 1e-308
 * rounds to 0. Throws MoranInputError and NonPositiveFitness as that function does.
 */
export function fixationProbability(
  A: Float64Array,
  n: number,
  mutant: number,
  resident: number,
  populationSize: number,
  selectionIntensity: number,
): number {
  return Math.exp(logFixationProbability(A, n, mutant, resident, populationSize, selectionIntensity));
}
