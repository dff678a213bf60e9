"use client";
/**
 * Records a decision through a server action. The server checks everything again (editor of
 * the venue, not the owner, latest submitted version, comment present); this form shows what
 * it answered next to the field it concerns.
 */
import { useActionState } from "react";
import type { DecisionOutcome } from "@/db/schema";
import { Button } from "@/components/ui/Button";

export interface DecisionFormState {
  status: "idle" | "error";
  message?: string;
  fieldErrors?: Partial<Record<"outcome" | "comment", string>>;
  values?: { outcome?: string; comment?: string };
}

const CHOICES: { value: DecisionOutcome; label: string; help: string }[] = [
  { value: "verified", label: "Verified", help: "The re-run supports the claims. A private model becomes public." },
  { value: "changes-requested", label: "Changes requested", help: "The authors should upload a corrected version." },
  { value: "declined", label: "Declined", help: "The venue will not list this model." },
];

export function DecisionForm({
  action,
  versionNumber,
  verifiedBlockedReason,
}: {
  action: (prev: DecisionFormState, form: FormData) => Promise<DecisionFormState>;
  versionNumber: number;
  /** Why "verified" cannot be chosen now (no report yet, a contradicted claim), or null. */
  verifiedBlockedReason: string | null;
}) {
  const [state, formAction, pending] = useActionState(action, { status: "idle" });
  const chosen = state.values?.outcome;
  return (
    <form action={formAction} className="flex flex-col gap-4" data-testid="decision-form" noValidate>
      <fieldset className="flex flex-col gap-2" aria-describedby={state.fieldErrors?.outcome === undefined ? undefined : "decision-outcome-error"}>
        <legend className="mb-1 text-sm font-semibold">Decision on version {versionNumber}</legend>
        {CHOICES.map((c) => {
          const blocked = c.value === "verified" && verifiedBlockedReason !== null;
          return (
            <label
              key={c.value}
              className={`flex gap-3 rounded-[var(--radius-control)] border border-line px-3 py-2 has-[:checked]:border-tide has-[:checked]:bg-tide-wash ${blocked ? "opacity-60" : "cursor-pointer hover:border-tide"}`}
            >
              <input type="radio" name="outcome" value={c.value} defaultChecked={chosen === c.value} disabled={blocked} className="mt-1 accent-[var(--rp-tide)]" />
              <span className="flex flex-col">
                <span className="text-sm font-semibold">{c.label}</span>
                <span className="text-xs text-ink-soft">{blocked ? verifiedBlockedReason : c.help}</span>
              </span>
            </label>
          );
        })}
        {state.fieldErrors?.outcome === undefined ? null : (
          <p id="decision-outcome-error" className="text-sm text-danger" role="alert">
            {state.fieldErrors.outcome}
          </p>
        )}
      </fieldset>
      <div className="flex flex-col gap-1.5">
        <label htmlFor="decision-comment" className="text-sm font-semibold">
          Comment for the authors
        </label>
        <textarea
          id="decision-comment"
          name="comment"
          rows={5}
          className="rp-input"
          defaultValue={state.values?.comment ?? ""}
          aria-invalid={state.fieldErrors?.comment === undefined ? undefined : true}
          aria-describedby={state.fieldErrors?.comment === undefined ? "decision-comment-hint" : "decision-comment-error decision-comment-hint"}
        />
        <p id="decision-comment-hint" className="text-xs text-ink-faint">
          Sent to the authors by mail and kept in the audit trail. Decisions are final.
        </p>
        {state.fieldErrors?.comment === undefined ? null : (
          <p id="decision-comment-error" className="text-sm text-danger" role="alert">
            {state.fieldErrors.comment}
          </p>
        )}
      </div>
      {state.status === "error" && state.message !== undefined ? (
        <p className="rounded-[var(--radius-control)] border border-danger/40 bg-danger-wash px-3 py-2 text-sm" role="alert" data-testid="decision-error">
          {state.message}
        </p>
      ) : null}
      <Button type="submit" disabled={pending} className="self-start">
        {pending ? "Recording…" : "Record decision"}
      </Button>
    </form>
  );
}
