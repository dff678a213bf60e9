/**
 * Shared types of the verification engine: the model specification as authors write it
 * (`restpoint/model@1`), the report the engine returns (`restpoint/report@1`), and the
 * compiled, numeric form of a game that the numerical routines work on.
 *
 * This module is imported by the client, the server and the worker alike: it imports
 * nothing and holds types plus a few constant helpers.
 */

export const SPEC_FORMAT = "restpoint/model@1" as const;
export const REPORT_FORMAT = "restpoint/report@1" as const;

// ---------------------------------------------------------------------------
// Specification (input)
// ---------------------------------------------------------------------------

/** A payoff entry: a finite number or an expression over the parameters. */
export type PayoffEntry = number | string;

export type Parameters = Record<string, number>;

/** Symmetric game: one state is n shares; bimatrix: [x, y], one array per population. */
export type SymmetricState = number[];
export type BimatrixState = [number[], number[]];
export type State = SymmetricState | BimatrixState;

export interface SpecAuthor {
  name: string;
  orcid?: string;
  affiliation?: string;
}

export interface SpecManuscript {
  title?: string;
  doi?: string;
  url?: string;
  year?: number;
}

export interface SymmetricGameSpec {
  kind: "symmetric";
  strategies: string[];
  payoffs: PayoffEntry[][];
}

export interface PopulationSpec {
  name: string;
  strategies: string[];
}

export interface BimatrixGameSpec {
  kind: "bimatrix";
  populations: [PopulationSpec, PopulationSpec];
  /** [P1 (m x k), P2 (k x m)]: each reads own strategy (row) against the other's (column). */
  payoffs: [PayoffEntry[][], PayoffEntry[][]];
}

export type GameSpec = SymmetricGameSpec | BimatrixGameSpec;

export type DynamicsSpec =
  | { kind: "replicator" }
  | { kind: "replicator-mutator"; mutationRate: number }
  | { kind: "logit"; noise: number }
  | { kind: "brown-von-neumann-nash" }
  | { kind: "smith" };

export type DynamicsKind = DynamicsSpec["kind"];

export interface NumericsSpec {
  relativeTolerance?: number;
  absoluteTolerance?: number;
}

export interface ExperimentSpec {
  id: string;
  initial: State;
  duration: number;
  samples?: number;
  parameters?: Parameters;
}

export type Stability = "asymptotically-stable" | "unstable" | "non-hyperbolic";

interface ClaimBase {
  id: string;
  tolerance?: number;
  parameters?: Parameters;
  /** Free text the author may add; shown beside the claim, never interpreted. */
  note?: string;
}

export interface RestPointClaim extends ClaimBase {
  kind: "rest-point";
  state: State;
  stability?: Stability;
}
export interface NashClaim extends ClaimBase {
  kind: "nash-equilibrium";
  state: State;
  holds?: boolean;
}
export interface EssClaim extends ClaimBase {
  kind: "ess";
  state: SymmetricState;
  holds?: boolean;
}
export interface RestPointCountClaim extends ClaimBase {
  kind: "rest-point-count";
  count: number;
  region?: "all" | "interior";
}
export interface FinalStateClaim extends ClaimBase {
  kind: "final-state";
  experiment: string;
  state: State;
}
export interface TrajectoryClaim extends ClaimBase {
  kind: "trajectory";
  experiment: string;
  points: { t: number; state: State }[];
}
export interface FixationClaim extends ClaimBase {
  kind: "fixation-probability";
  populationSize: number;
  selectionIntensity: number;
  mutant: string;
  resident: string;
  value: number;
}

export type Claim =
  | RestPointClaim
  | NashClaim
  | EssClaim
  | RestPointCountClaim
  | FinalStateClaim
  | TrajectoryClaim
  | FixationClaim;

export type ClaimKind = Claim["kind"];

export interface ModelSpec {
  format: typeof SPEC_FORMAT;
  title: string;
  summary?: string;
  authors?: SpecAuthor[];
  manuscript?: SpecManuscript;
  parameters?: Parameters;
  game: GameSpec;
  dynamics?: DynamicsSpec;
  numerics?: NumericsSpec;
  experiments?: ExperimentSpec[];
  claims: Claim[];
}

// ---------------------------------------------------------------------------
// Report (output)
// ---------------------------------------------------------------------------

export type Verdict = "confirmed" | "contradicted" | "inconclusive" | "invalid";
export type ClaimStatus = "confirmed" | "contradicted" | "inconclusive";

/** A problem with the spec: `path` is an RFC 6901 JSON pointer into the spec ("" is the root). */
export interface SpecError {
  path: string;
  message: string;
  /** 1-based line in the uploaded text, where the text has one (filled in by callers that hold the text). */
  line?: number;
}

export interface ClaimResult {
  id: string;
  kind: ClaimKind;
  status: ClaimStatus;
  message: string;
  /** Max-norm distance between what was claimed and what was computed, where one exists. */
  deviation?: number;
  tolerance?: number;
  /** What the engine computed (a state, a probability, a count, a stability class...). */
  computed?: unknown;
}

/** [re, im] */
export type Eigenvalue = [number, number];

export interface RestPointReport {
  state: State;
  /** Strategy names in the support; for bimatrix games, the union of both populations' supports. */
  support: string[];
  stability: Stability;
  eigenvalues: Eigenvalue[];
  nash: boolean;
  /** null for bimatrix games */
  ess: boolean | null;
}

export interface ExperimentReport {
  id: string;
  times: number[];
  states: State[];
  /** Present when the run stopped early (budget, left the state space...). */
  error?: string;
}

export interface Report {
  format: typeof REPORT_FORMAT;
  specSha256: string;
  engine: { version: string };
  verdict: Verdict;
  errors: SpecError[];
  claims: ClaimResult[];
  /** Omitted for symmetric games with n > 20, and when the spec is invalid. */
  restPoints?: RestPointReport[];
  experiments: ExperimentReport[];
  /** What was checked and how, in plain sentences; always says a confirmed claim is not a peer review. */
  notes?: string[];
}

// ---------------------------------------------------------------------------
// Compiled game (what the numerical routines take)
// ---------------------------------------------------------------------------

/** Payoffs evaluated to numbers, row-major in Float64Array. */
export type CompiledGame =
  | {
      kind: "symmetric";
      n: number;
      strategies: string[];
      /** n*n, A[i*n + j] = payoff to i against j */
      A: Float64Array;
    }
  | {
      kind: "bimatrix";
      m: number;
      k: number;
      populations: [PopulationSpec, PopulationSpec];
      /** m*k, A[i*k + j] = payoff to population 1's i against population 2's j */
      A: Float64Array;
      /** k*m, B[j*m + i] = payoff to population 2's j against population 1's i */
      B: Float64Array;
    };

/**
 * Dimension of the flat state vector: n for a symmetric game, m + k for a bimatrix game
 * (population 1's shares first).
 */
export function stateDimension(game: CompiledGame): number {
  return game.kind === "symmetric" ? game.n : game.m + game.k;
}
