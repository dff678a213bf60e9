/** A callout with an icon and a word for its tone, so the tone never rests on colour alone. */
import type { ReactNode } from "react";
import { CheckIcon, CrossIcon, InfoIcon } from "@/components/status/icons";

export type NoticeTone = "info" | "success" | "error";

const tones: Record<NoticeTone, { word: string; className: string; Icon: typeof InfoIcon }> = {
  info: { word: "Note", className: "border-tide/40 bg-tide-wash text-ink", Icon: InfoIcon },
  success: { word: "Done", className: "border-confirmed/40 bg-confirmed-wash text-ink", Icon: CheckIcon },
  error: { word: "Problem", className: "border-danger/40 bg-danger-wash text-ink", Icon: CrossIcon },
};

export function Notice({ tone = "info", title, children }: { tone?: NoticeTone; title?: string; children?: ReactNode }) {
  const t = tones[tone];
  return (
    <div className={`flex gap-3 rounded-[var(--radius-card)] border px-4 py-3 text-sm ${t.className}`} role={tone === "error" ? "alert" : "status"}>
      <t.Icon className={`mt-0.5 size-4 ${tone === "error" ? "text-danger" : tone === "success" ? "text-confirmed" : "text-tide"}`} />
      <div className="flex flex-col gap-1">
        <p className="font-semibold">
          <span className="sr-only">{t.word}: </span>
          {title ?? t.word}
        </p>
        {children === undefined ? null : <div className="text-ink-soft">{children}</div>}
      </div>
    </div>
  );
}
