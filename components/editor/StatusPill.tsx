/** The editorial state of a submission: a tag with a heavy left edge, an icon and the word (never colour alone). */
import type { QueueStatus } from "@/lib/queue";
import { CheckIcon, ClockIcon, CrossIcon, InfoIcon, QuestionIcon } from "@/components/status/icons";
import { STATUS_MEANING, STATUS_WORDS } from "./labels";

const LOOK: Record<QueueStatus, { className: string; Icon: typeof CheckIcon }> = {
  "awaiting-check": { className: "border-line-strong bg-sunken text-ink-soft", Icon: ClockIcon },
  "check-failed": { className: "border-danger/50 bg-danger-wash text-danger", Icon: CrossIcon },
  "awaiting-decision": { className: "border-tide/50 bg-tide-wash text-tide", Icon: InfoIcon },
  verified: { className: "border-confirmed/50 bg-confirmed-wash text-confirmed", Icon: CheckIcon },
  "changes-requested": { className: "border-inconclusive/50 bg-inconclusive-wash text-inconclusive", Icon: QuestionIcon },
  declined: { className: "border-contradicted/50 bg-contradicted-wash text-contradicted", Icon: CrossIcon },
};

export function StatusPill({ status }: { status: QueueStatus }) {
  const l = LOOK[status];
  return (
    <span
      className={`inline-flex items-center gap-1.5 rounded-sm border border-l-4 px-2 py-0.5 text-xs font-semibold whitespace-nowrap ${l.className}`}
      title={STATUS_MEANING[status]}
      data-status={status}
    >
      <l.Icon className="size-[1.05em]" />
      {STATUS_WORDS[status]}
    </span>
  );
}
