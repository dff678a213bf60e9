/**
 * A verdict or claim status as a tag: colour, icon and word together, never colour alone.
 * Use for report verdicts (confirmed / contradicted / inconclusive / invalid) and per-claim
 * statuses (the first three).
 *
 *   <VerdictTag verdict="contradicted" />            // tag with the word "Contradicted"
 *   <VerdictTag verdict="confirmed" size="lg" />     // larger, for a report header
 *   <VerdictTag verdict="inconclusive" label="2 inconclusive" />
 */
import type { ReactElement } from "react";
import { BrokenIcon, CheckIcon, CrossIcon, QuestionIcon } from "./icons";

export const VERDICT_VALUES = ["confirmed", "contradicted", "inconclusive", "invalid"] as const;
export type Verdict = (typeof VERDICT_VALUES)[number];

export interface VerdictStyle {
  word: string;
  /** One sentence for tooltips and legends. */
  meaning: string;
  Icon: (props: { className?: string }) => ReactElement;
  className: string;
}

export const VERDICT_STYLES: Record<Verdict, VerdictStyle> = {
  confirmed: {
    word: "Confirmed",
    meaning: "The server re-ran the claim and reproduced it within tolerance.",
    Icon: CheckIcon,
    className: "text-confirmed bg-confirmed-wash border-confirmed/40",
  },
  contradicted: {
    word: "Contradicted",
    meaning: "The server re-ran the claim and the numbers disagree with it.",
    Icon: CrossIcon,
    className: "text-contradicted bg-contradicted-wash border-contradicted/40",
  },
  inconclusive: {
    word: "Inconclusive",
    meaning: "The re-run could not decide the claim either way.",
    Icon: QuestionIcon,
    className: "text-inconclusive bg-inconclusive-wash border-inconclusive/40",
  },
  invalid: {
    word: "Invalid",
    meaning: "The specification breaks the format's rules, so nothing was run.",
    Icon: BrokenIcon,
    className: "text-invalid bg-invalid-wash border-invalid/40",
  },
};

export function isVerdict(value: unknown): value is Verdict {
  return typeof value === "string" && (VERDICT_VALUES as readonly string[]).includes(value);
}

export function VerdictTag({ verdict, label, size = "md" }: { verdict: Verdict; label?: string; size?: "sm" | "md" | "lg" }) {
  const s = VERDICT_STYLES[verdict];
  const sizing = size === "sm" ? "text-2xs px-1.5 py-0.5 gap-1" : size === "lg" ? "text-base px-3 py-1 gap-2 font-semibold" : "text-xs px-2 py-0.5 gap-1.5 font-medium";
  return (
    <span className={`inline-flex items-center rounded-full border ${sizing} ${s.className}`} title={s.meaning} data-verdict={verdict}>
      <s.Icon className={size === "lg" ? "size-[1.1em]" : "size-[1.05em]"} />
      <span>{label ?? s.word}</span>
    </span>
  );
}
