/**
 * Vector fields of the five evolutionary dynamics on the simplex (symmetric games) or the
 * product of two simplices (bimatrix games), with analytic Jacobians.
 *
 * Equations (f = payoffs of the pure strategies at the state, phi = x.f), as in Hofbauer and
 * Sigmund (2003), "Evolutionary game dynamics", Bull. AMS 40:479, and Sandholm (2010),
 * Population Games and Evolutionary Dynamics:
 *   replicator            x_i' = x_i (f_i - phi)
 *   replicator-mutator    x_i' = sum_j x_j f_j q_ji - x_i phi,  q_ii = 1 - mu, q_ji = mu/(n-1)
 *   logit                 x_i' = softmax(f/eta)_i - x_i
 *   Brown-von Neumann-Nash x_i' = k_i - x_i sum_j k_j,  k_i = [f_i - phi]+
 *   Smith                 x_i' = sum_j x_j [f_i - f_j]+ - x_i sum_j [f_j - f_i]+
 * In a bimatrix game each population's payoffs are computed against the other's state.
 *
 * Off the simplex (S = sum_i x_i != 1) every field is extended so that the components of each
 * population sum to exactly zero: phi = x.f / S, and the outflow terms use the shares x_i / S
 * (logit: x_i' = softmax_i - x_i / S; BNN: x_i' = k_i - (x_i / S) sum_j k_j). On the simplex
 * this is the equation above unchanged; off it, the sum is a first integral, so integrators
 * that preserve linear invariants (Runge-Kutta and extrapolation methods do) keep the state
 * on the simplex to rounding error even where the plain equation would repel from it (for
 * the replicator, S' = phi (1 - S), unstable when phi < 0). The Jacobian of this extension
 * maps every vector into the tangent space, and on tangent vectors it equals the Jacobian of
 * the plain equation, so restricted eigenvalues are unaffected.
 *
 * Kinks: BNN and Smith contain [u]+ = max(u, 0). The Jacobian uses slope 1 for u > band,
 * 0 for u < -band and 1/2 for |u| <= band (band = KINK_BAND * (1 + largest |payoff|)): the
 * mean of the two one-sided derivatives, which is also the limit of central differences
 * across a kink where u is linear. At an interior Nash equilibrium every f_i - phi is 0,
 * so the linearisation there is this averaged one; stability read from it is indicative,
 * not a theorem, for these two piecewise-smooth dynamics.
 */
import { stateDimension, type CompiledGame, type DynamicsSpec } from "./types";

export interface VectorField {
  dim: number;
  /** out = F(x); writes every component, allocates nothing. */
  rhs(x: Float64Array, out: Float64Array): void;
  /** out = dF/dx at x, dim*dim row-major (out[i*dim + j] = dF_i/dx_j), analytic. */
  jacobian(x: Float64Array, out: Float64Array): void;
}

/** Relative width of the band around a kink of [u]+ where the slope is taken as 1/2 (see above). */
export const KINK_BAND = 1e-9;

/** A dynamics parameter outside its range (mutation rate outside [0, 1], noise not positive). */
export class DynamicsParameterError extends Error {
  constructor(
    readonly parameter: "mutationRate" | "noise",
    readonly value: number,
    message: string,
  ) {
    super(message);
    this.name = "DynamicsParameterError";
  }
}

/** One population: its slice of the state and the payoff matrix against the opponent slice. */
interface Block {
  offset: number;
  size: number;
  oppOffset: number;
  oppSize: number;
  /** size x oppSize, row-major: payoff of own strategy i against the opponent's strategy l. */
  M: Float64Array;
}

/**
 * Per-population kernel. `rhs` writes out[o + i] given the payoffs f (length n). `partials`
 * writes D (derivative with the payoffs held fixed, D_ij = dg_i/dx_j) and E (derivative with
 * respect to the payoffs, E_il = dg_i/df_l), both n x n with stride n; the chain rule through
 * f = M z is applied by the caller.
 */
interface Kernel {
  rhs(x: Float64Array, o: number, n: number, f: Float64Array, out: Float64Array): void;
  partials(x: Float64Array, o: number, n: number, f: Float64Array, D: Float64Array, E: Float64Array): void;
}

function blocksOf(game: CompiledGame): Block[] {
  if (game.kind === "symmetric") {
    return [{ offset: 0, size: game.n, oppOffset: 0, oppSize: game.n, M: game.A }];
  }
  return [
    { offset: 0, size: game.m, oppOffset: game.m, oppSize: game.k, M: game.A },
    { offset: game.m, size: game.k, oppOffset: 0, oppSize: game.m, M: game.B },
  ];
}

function sumOf(x: Float64Array, o: number, n: number): number {
  let s = 0;
  for (let i = 0; i < n; i++) s += x[o + i] ?? 0;
  return s;
}

function dotOf(x: Float64Array, o: number, f: Float64Array, n: number): number {
  let s = 0;
  for (let i = 0; i < n; i++) s += (x[o + i] ?? 0) * (f[i] ?? 0);
  return s;
}

const replicator: Kernel = {
  rhs(x, o, n, f, out) {
    const phi = dotOf(x, o, f, n) / sumOf(x, o, n);
    for (let i = 0; i < n; i++) out[o + i] = (x[o + i] ?? 0) * ((f[i] ?? 0) - phi);
  },
  partials(x, o, n, f, D, E) {
    const S = sumOf(x, o, n);
    const phi = dotOf(x, o, f, n) / S;
    for (let i = 0; i < n; i++) {
      const xi = x[o + i] ?? 0;
      for (let j = 0; j < n; j++) {
        const xj = x[o + j] ?? 0;
        const diag = i === j ? 1 : 0;
        D[i * n + j] = diag * ((f[i] ?? 0) - phi) - (xi * ((f[j] ?? 0) - phi)) / S;
        E[i * n + j] = xi * (diag - xj / S);
      }
    }
  },
};

function replicatorMutator(mu: number): Kernel {
  // h_i = sum_j q_ji x_j f_j = a x_i f_i + b sum_j x_j f_j with b = mu/(n-1), a = q_ii - b
  // (one strategy: q = 1, so a = 1 and b = 0); scalars, so that no call allocates.
  const spread = (n: number): number => (n <= 1 ? 0 : mu / (n - 1));
  const own = (n: number): number => (n <= 1 ? 1 : 1 - mu - mu / (n - 1));
  return {
    rhs(x, o, n, f, out) {
      const a = own(n);
      const b = spread(n);
      const T = dotOf(x, o, f, n);
      const phi = T / sumOf(x, o, n);
      for (let i = 0; i < n; i++) {
        const xi = x[o + i] ?? 0;
        out[o + i] = a * xi * (f[i] ?? 0) + b * T - xi * phi;
      }
    },
    partials(x, o, n, f, D, E) {
      const a = own(n);
      const b = spread(n);
      const S = sumOf(x, o, n);
      const phi = dotOf(x, o, f, n) / S;
      for (let i = 0; i < n; i++) {
        const xi = x[o + i] ?? 0;
        const fi = f[i] ?? 0;
        for (let j = 0; j < n; j++) {
          const xj = x[o + j] ?? 0;
          const fj = f[j] ?? 0;
          const diag = i === j ? 1 : 0;
          D[i * n + j] = diag * (a * fi - phi) + b * fj - (xi * (fj - phi)) / S;
          E[i * n + j] = diag * a * xi + b * xj - (xi * xj) / S;
        }
      }
    },
  };
}

function logit(eta: number, sigma: Float64Array): Kernel {
  const softmax = (n: number, f: Float64Array): void => {
    let top = -Infinity;
    for (let i = 0; i < n; i++) top = Math.max(top, f[i] ?? 0);
    let z = 0;
    for (let i = 0; i < n; i++) {
      const e = Math.exp(((f[i] ?? 0) - top) / eta);
      sigma[i] = e;
      z += e;
    }
    for (let i = 0; i < n; i++) sigma[i] = (sigma[i] ?? 0) / z;
  };
  return {
    rhs(x, o, n, f, out) {
      softmax(n, f);
      const S = sumOf(x, o, n);
      for (let i = 0; i < n; i++) out[o + i] = (sigma[i] ?? 0) - (x[o + i] ?? 0) / S;
    },
    partials(x, o, n, f, D, E) {
      softmax(n, f);
      const S = sumOf(x, o, n);
      for (let i = 0; i < n; i++) {
        const xi = x[o + i] ?? 0;
        const si = sigma[i] ?? 0;
        for (let j = 0; j < n; j++) {
          const diag = i === j ? 1 : 0;
          D[i * n + j] = -diag / S + xi / (S * S);
          E[i * n + j] = (si * (diag - (sigma[j] ?? 0))) / eta;
        }
      }
    },
  };
}

/** Slope of [u]+ with the kink convention of this module. */
function kinkSlope(u: number, band: number): number {
  if (u > band) return 1;
  if (u < -band) return 0;
  return 0.5;
}

function brownVonNeumannNash(band: number, excess: Float64Array, chi: Float64Array): Kernel {
  return {
    rhs(x, o, n, f, out) {
      const S = sumOf(x, o, n);
      const phi = dotOf(x, o, f, n) / S;
      let K = 0;
      for (let i = 0; i < n; i++) {
        const k = Math.max((f[i] ?? 0) - phi, 0);
        excess[i] = k;
        K += k;
      }
      for (let i = 0; i < n; i++) out[o + i] = (excess[i] ?? 0) - ((x[o + i] ?? 0) * K) / S;
    },
    partials(x, o, n, f, D, E) {
      const S = sumOf(x, o, n);
      const phi = dotOf(x, o, f, n) / S;
      let K = 0;
      let X = 0;
      for (let i = 0; i < n; i++) {
        const e = (f[i] ?? 0) - phi;
        excess[i] = e;
        K += Math.max(e, 0);
        const c = kinkSlope(e, band);
        chi[i] = c;
        X += c;
      }
      // k_i = [e_i]+, e_i = f_i - phi: de_i/dx_j = -e_j / S, de_i/df_l = delta_il - x_l / S.
      for (let i = 0; i < n; i++) {
        const xi = x[o + i] ?? 0;
        const ci = chi[i] ?? 0;
        for (let j = 0; j < n; j++) {
          const xj = x[o + j] ?? 0;
          const ej = excess[j] ?? 0;
          const diag = i === j ? 1 : 0;
          D[i * n + j] = (-ci * ej) / S - (diag * K) / S + (xi * K) / (S * S) + (xi * X * ej) / (S * S);
          E[i * n + j] = ci * (diag - xj / S) - (xi / S) * ((chi[j] ?? 0) - (X * xj) / S);
        }
      }
    },
  };
}

function smith(band: number): Kernel {
  return {
    rhs(x, o, n, f, out) {
      for (let i = 0; i < n; i++) {
        const fi = f[i] ?? 0;
        let inflow = 0;
        let outRate = 0;
        for (let j = 0; j < n; j++) {
          const d = fi - (f[j] ?? 0);
          if (d > 0) inflow += (x[o + j] ?? 0) * d;
          else outRate -= d;
        }
        out[o + i] = inflow - (x[o + i] ?? 0) * outRate;
      }
    },
    partials(x, o, n, f, D, E) {
      for (let i = 0; i < n; i++) {
        const fi = f[i] ?? 0;
        const xi = x[o + i] ?? 0;
        let outRate = 0;
        let inSlope = 0; // sum_j x_j chi_ij
        let outSlope = 0; // sum_j chi_ji
        for (let j = 0; j < n; j++) {
          const d = fi - (f[j] ?? 0);
          outRate += Math.max(-d, 0);
          inSlope += (x[o + j] ?? 0) * kinkSlope(d, band);
          outSlope += kinkSlope(-d, band);
        }
        for (let j = 0; j < n; j++) {
          const d = fi - (f[j] ?? 0);
          const diag = i === j ? 1 : 0;
          D[i * n + j] = Math.max(d, 0) - diag * outRate;
          E[i * n + j] =
            diag * (inSlope + xi * outSlope) - (x[o + j] ?? 0) * kinkSlope(d, band) - xi * kinkSlope(-d, band);
        }
      }
    },
  };
}

function maxAbs(values: Float64Array): number {
  let m = 0;
  for (const v of values) m = Math.max(m, Math.abs(v));
  return m;
}

/**
 * The vector field of `dynamics` for `game` on the flat state (population 1 first for a
 * bimatrix game). Equations and the off-simplex extension: see the module comment.
 * Throws DynamicsParameterError for a mutation rate outside [0, 1] or a noise that is not
 * a positive finite number.
 */
export function vectorField(game: CompiledGame, dynamics: DynamicsSpec): VectorField {
  const blocks = blocksOf(game);
  const dim = stateDimension(game);
  const width = Math.max(...blocks.map((b) => b.size));
  const payoffScale = Math.max(...blocks.map((b) => maxAbs(b.M)));
  const band = KINK_BAND * (1 + payoffScale);
  const f = new Float64Array(width);
  const work1 = new Float64Array(width);
  const work2 = new Float64Array(width);
  const D = new Float64Array(width * width);
  const E = new Float64Array(width * width);

  let kernel: Kernel;
  switch (dynamics.kind) {
    case "replicator":
      kernel = replicator;
      break;
    case "replicator-mutator": {
      const mu = dynamics.mutationRate;
      if (!(mu >= 0 && mu <= 1)) {
        throw new DynamicsParameterError("mutationRate", mu, `the mutation rate must lie in [0, 1]; got ${mu}`);
      }
      kernel = replicatorMutator(mu);
      break;
    }
    case "logit": {
      const eta = dynamics.noise;
      if (!(eta > 0 && Number.isFinite(eta))) {
        throw new DynamicsParameterError("noise", eta, `the logit noise must be a positive finite number; got ${eta}`);
      }
      kernel = logit(eta, work1);
      break;
    }
    case "brown-von-neumann-nash":
      kernel = brownVonNeumannNash(band, work1, work2);
      break;
    case "smith":
      kernel = smith(band);
      break;
  }

  const payoffs = (b: Block, x: Float64Array): void => {
    for (let i = 0; i < b.size; i++) {
      let s = 0;
      const row = i * b.oppSize;
      for (let l = 0; l < b.oppSize; l++) s += (b.M[row + l] ?? 0) * (x[b.oppOffset + l] ?? 0);
      f[i] = s;
    }
  };

  return {
    dim,
    rhs(x, out) {
      for (const b of blocks) {
        payoffs(b, x);
        kernel.rhs(x, b.offset, b.size, f, out);
      }
    },
    jacobian(x, out) {
      out.fill(0);
      for (const b of blocks) {
        const n = b.size;
        payoffs(b, x);
        kernel.partials(x, b.offset, n, f, D, E);
        for (let i = 0; i < n; i++) {
          const row = (b.offset + i) * dim;
          for (let j = 0; j < n; j++) out[row + b.offset + j] = (out[row + b.offset + j] ?? 0) + (D[i * n + j] ?? 0);
          // chain rule through f = M z: dg_i/dz_c = sum_l E_il M_lc
          for (let c = 0; c < b.oppSize; c++) {
            let s = 0;
            for (let l = 0; l < n; l++) s += (E[i * n + l] ?? 0) * (b.M[l * b.oppSize + c] ?? 0);
            out[row + b.oppOffset + c] = (out[row + b.oppOffset + c] ?? 0) + s;
          }
        }
      }
    },
  };
}
