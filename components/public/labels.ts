/** Words for the registry's filter values, shared by the search form and result cards. */
export const DYNAMICS_LABELS: Record<string, string> = {
  replicator: "Replicator",
  "replicator-mutator": "Replicator-mutator",
  logit: "Logit",
  "brown-von-neumann-nash": "Brown-von Neumann-Nash",
  smith: "Smith",
};

export const VERDICT_FILTER_LABELS: Record<string, string> = {
  confirmed: "Confirmed",
  contradicted: "Contradicted",
  inconclusive: "Inconclusive",
  invalid: "Invalid",
  pending: "Awaiting re-run",
};

export function dynamicsLabel(kind: string): string {
  return DYNAMICS_LABELS[kind] ?? kind;
}
