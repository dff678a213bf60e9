/**
 * What a reader's re-run changed about the claims, compared with the registered report, and
 * what the "Try your own values" form lets them change. Pure, so the page and tests share it.
 */
import type { ClaimResult, ClaimStatus, ModelSpec } from "@/lib/engine/types";

export interface ClaimChange {
  id: string;
  /** Status in the registered report; null when the registered report has no such claim. */
  from: ClaimStatus | null;
  to: ClaimStatus;
  /** The engine's sentence for the reader's run. */
  message: string;
}

/** Claims of the reader's run whose status differs from the registered report's, in the run's order. */
export function claimChanges(registered: readonly ClaimResult[], mine: readonly ClaimResult[]): ClaimChange[] {
  const before = new Map(registered.map((c) => [c.id, c.status]));
  const out: ClaimChange[] = [];
  for (const c of mine) {
    const from = before.get(c.id) ?? null;
    if (from !== c.status) out.push({ id: c.id, from, to: c.status, message: c.message });
  }
  return out;
}

/** The lede of the form: names only what the model lets a reader change. */
export function tryLede(spec: Pick<ModelSpec, "parameters">): string {
  const hasParameters = Object.keys(spec.parameters ?? {}).length > 0;
  return hasParameters
    ? "Change the parameters, the starting shares or the durations, and the server re-runs the model for you. Nothing you enter is stored."
    : "This model has no parameters; change the starting shares or the durations of its runs, and the server re-runs the model for you. Nothing you enter is stored.";
}
