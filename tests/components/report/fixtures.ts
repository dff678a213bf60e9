// A report of our own invention: three foraging tactics of a fictional marsh bird.
import type { GameSpec, Report } from "@/lib/engine/types";

export const marshGame: GameSpec = {
  kind: "symmetric",
  strategies: ["Sentinel", "Forager", "Lurker"],
  payoffs: [
    [0, -1, 1],
    [1, 0, -1],
    [-1, 1, 0],
  ],
};

export const marshReport: Report = {
  format: "restpoint/report@1",
  specSha256: "3f2a9c0d1e4b5a6f7081920a3b4c5d6e7f8091a2b3c4d5e6f708192a3b4c5d6e",
  engine: { version: "1.0.0" },
  verdict: "contradicted",
  errors: [],
  claims: [
    {
      id: "centre",
      kind: "rest-point",
      status: "confirmed",
      message: "rest point found at distance 3.1e-12; stability non-hyperbolic as claimed",
      deviation: 3.1e-12,
      tolerance: 1e-6,
    },
    {
      id: "centre-ess",
      kind: "ess",
      status: "contradicted",
      message: "the interior rest point is not an ESS: Forager is an alternative best reply",
      tolerance: 1e-6,
    },
    {
      id: "three-rest-points",
      kind: "rest-point-count",
      status: "inconclusive",
      message: "budget exceeded",
    },
  ],
  restPoints: [
    {
      state: [1 / 3, 1 / 3, 1 / 3],
      support: ["Sentinel", "Forager", "Lurker"],
      stability: "non-hyperbolic",
      eigenvalues: [
        [0, 0.5773502691896258],
        [0, -0.5773502691896258],
      ],
      nash: true,
      ess: false,
    },
    {
      state: [1, 0, 4e-17],
      support: ["Sentinel"],
      stability: "unstable",
      eigenvalues: [
        [1, 0],
        [-1, 0],
      ],
      nash: false,
      ess: false,
    },
  ],
  experiments: [{ id: "loop", times: [0, 1], states: [[0.5, 0.25, 0.25], [0.4, 0.35, 0.25]] }],
  notes: [
    "Rest points were found on every face of the simplex by solving the linear equations of each support.",
    "A confirmed claim is reproduced arithmetic, not a peer review.",
  ],
};

export const invalidReport: Report = {
  format: "restpoint/report@1",
  specSha256: "00aa",
  engine: { version: "1.0.0" },
  verdict: "invalid",
  errors: [
    { path: "/claims/0/state", message: "shares must sum to 1 (they sum to 0.9)", line: 14 },
    { path: "", message: "must have required property 'game'" },
  ],
  claims: [],
  experiments: [],
};
