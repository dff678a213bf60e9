/** The report's overall verdict with counts per status: the first thing a reader sees. */
import type { ClaimResult, Verdict } from "@/lib/engine/types";
import { OUTCOME_SURFACE, OUTCOME_TEXT, OUTCOME_WORDS, OutcomeIcon } from "./StatusMark";

const EXPLANATION: Record<Verdict, string> = {
  confirmed: "Every claim was reproduced within its tolerance.",
  contradicted: "At least one claim does not hold when the model is re-run.",
  inconclusive: "No claim is contradicted, but at least one could not be decided.",
  invalid: "The specification could not be read as a model, so nothing was run.",
};

export function claimCounts(claims: readonly ClaimResult[]) {
  const counts = { confirmed: 0, contradicted: 0, inconclusive: 0 };
  for (const c of claims) counts[c.status] += 1;
  return counts;
}

export function VerdictBanner({ verdict, claims }: { verdict: Verdict; claims: readonly ClaimResult[] }) {
  const counts = claimCounts(claims);
  const parts = (["confirmed", "contradicted", "inconclusive"] as const)
    .filter((s) => counts[s] > 0)
    .map((s) => `${counts[s]} ${s}`);
  return (
    <div
      role="status"
      data-testid="verdict-banner"
      data-verdict={verdict}
      className={`flex items-start gap-3 rounded-lg border p-4 ${OUTCOME_SURFACE[verdict]}`}
    >
      <OutcomeIcon outcome={verdict} className={`mt-0.5 size-7 shrink-0 ${OUTCOME_TEXT[verdict]}`} />
      <div>
        <p className={`text-lg font-semibold ${OUTCOME_TEXT[verdict]}`}>
          {OUTCOME_WORDS[verdict]}
        </p>
        <p className="text-sm text-ink">{EXPLANATION[verdict]}</p>
        {parts.length > 0 && (
          <p className="mt-1 text-sm text-ink-soft">
            {claims.length} {claims.length === 1 ? "claim" : "claims"}: {parts.join(", ")}.
          </p>
        )}
      </div>
    </div>
  );
}
