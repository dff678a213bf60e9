/**
 * A claim status or verdict as icon + word (never colour alone), drawn with the app's shared
 * verdict tag so the report, lists and badges use one vocabulary of icons.
 */
import { VERDICT_STYLES, VerdictTag } from "@/components/status/VerdictTag";
import type { ClaimStatus, Verdict } from "@/lib/engine/types";

export type Outcome = Verdict | ClaimStatus;

export const OUTCOME_WORDS: Record<Outcome, string> = {
  confirmed: VERDICT_STYLES.confirmed.word,
  contradicted: VERDICT_STYLES.contradicted.word,
  inconclusive: VERDICT_STYLES.inconclusive.word,
  invalid: VERDICT_STYLES.invalid.word,
};

/** Text colour per outcome (the palette in app/globals.css switches light/dark); icon and word carry the meaning. */
export const OUTCOME_TEXT: Record<Outcome, string> = {
  confirmed: "text-confirmed",
  contradicted: "text-contradicted",
  inconclusive: "text-inconclusive",
  invalid: "text-invalid",
};

export const OUTCOME_SURFACE: Record<Outcome, string> = {
  confirmed: "border-confirmed/40 bg-confirmed-wash",
  contradicted: "border-contradicted/40 bg-contradicted-wash",
  inconclusive: "border-inconclusive/40 bg-inconclusive-wash",
  invalid: "border-invalid/40 bg-invalid-wash",
};

/** The outcome's icon alone (decorative: pair it with the word). */
export function OutcomeIcon({ outcome, className = "size-4" }: { outcome: Outcome; className?: string }) {
  const Icon = VERDICT_STYLES[outcome].Icon;
  return <Icon className={className} />;
}

/** Inline tag with icon + word, e.g. in a table cell. */
export function StatusMark({ outcome, size = "md" }: { outcome: Outcome; size?: "sm" | "md" | "lg" }) {
  return <VerdictTag verdict={outcome} size={size} />;
}
