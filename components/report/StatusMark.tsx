/**
 * A claim status or verdict as icon + word (never colour alone). The icon is decorative
 * (aria-hidden); the word carries the meaning for screen readers and in print.
 */
import type { ClaimStatus, Verdict } from "@/lib/engine/types";

export type Outcome = Verdict | ClaimStatus;

export const OUTCOME_WORDS: Record<Outcome, string> = {
  confirmed: "Confirmed",
  contradicted: "Contradicted",
  inconclusive: "Inconclusive",
  invalid: "Invalid",
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

export function OutcomeIcon({ outcome, className = "size-4" }: { outcome: Outcome; className?: string }) {
  const common = {
    className,
    viewBox: "0 0 16 16",
    fill: "none",
    stroke: "currentColor",
    strokeWidth: 1.8,
    strokeLinecap: "round" as const,
    strokeLinejoin: "round" as const,
    "aria-hidden": true,
    focusable: false,
  };
  switch (outcome) {
    case "confirmed":
      // A tick inside a circle.
      return (
        <svg {...common} data-icon="confirmed">
          <circle cx="8" cy="8" r="6.6" />
          <path d="M5 8.3l2 2 4-4.4" />
        </svg>
      );
    case "contradicted":
      // A cross inside a square turned 45 degrees: distinct in outline from the circle.
      return (
        <svg {...common} data-icon="contradicted">
          <path d="M8 1.2L14.8 8 8 14.8 1.2 8z" />
          <path d="M6 6l4 4M10 6l-4 4" />
        </svg>
      );
    case "inconclusive":
      // Two dots and a gap: the check could not decide.
      return (
        <svg {...common} data-icon="inconclusive">
          <circle cx="8" cy="8" r="6.6" strokeDasharray="3 2" />
          <path d="M5.2 8h1M9.8 8h1" />
        </svg>
      );
    case "invalid":
      // A triangle with a bar: the spec itself is at fault.
      return (
        <svg {...common} data-icon="invalid">
          <path d="M8 1.8l6.6 12H1.4z" />
          <path d="M8 6.2v3.4M8 11.8v.1" />
        </svg>
      );
  }
}

/** Inline icon + word, e.g. in a table cell. */
export function StatusMark({ outcome, className = "" }: { outcome: Outcome; className?: string }) {
  return (
    <span className={`inline-flex items-center gap-1.5 font-medium ${OUTCOME_TEXT[outcome]} ${className}`}>
      <OutcomeIcon outcome={outcome} />
      <span>{OUTCOME_WORDS[outcome]}</span>
    </span>
  );
}
