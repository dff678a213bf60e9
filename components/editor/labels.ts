/** Words for the editorial states and queue controls, shared by the queue, review and compare views. */
import type { DecisionOutcome } from "@/db/schema";
import type { QueueSort, QueueStatus } from "@/lib/queue";

export const STATUS_WORDS: Record<QueueStatus, string> = {
  "awaiting-check": "Being checked",
  "check-failed": "Check failed",
  "awaiting-decision": "Awaiting decision",
  verified: "Verified",
  "changes-requested": "Changes requested",
  declined: "Declined",
};

export const STATUS_MEANING: Record<QueueStatus, string> = {
  "awaiting-check": "The engine has not finished re-running this version's claims.",
  "check-failed": "The re-run failed three times; the author sees the error.",
  "awaiting-decision": "The report is ready and no editor has decided yet.",
  verified: "An editor recorded this version as verified.",
  "changes-requested": "An editor asked the authors for a new version.",
  declined: "An editor declined this version.",
};

export const QUEUE_STATUS_ORDER = Object.keys(STATUS_WORDS) as QueueStatus[];

export const OUTCOME_WORDS: Record<DecisionOutcome, string> = {
  verified: "Verified",
  "changes-requested": "Changes requested",
  declined: "Declined",
};

export const SORT_WORDS: Record<QueueSort, string> = {
  submitted: "Submitted",
  uploaded: "Uploaded",
  decided: "Decided",
  title: "Title",
  author: "Author",
  version: "Version",
  status: "Status",
  verdict: "Verdict",
  confirmed: "Confirmed claims",
  contradicted: "Contradicted claims",
  inconclusive: "Inconclusive claims",
};

export const AUDIT_WORDS: Record<string, string> = {
  "model.created": "Model entry created",
  "model.updated": "Model entry changed",
  "version.uploaded": "Version uploaded",
  "version.submitted": "Version submitted to the venue",
  "file.attached": "File attached",
  "job.failed": "Re-run failed",
  "decision.recorded": "Decision recorded",
  "venue.created": "Venue created",
  "venue.editor-added": "Editor assigned",
  "venue.editor-removed": "Editor removed",
  "token.created": "API token created",
  "token.revoked": "API token revoked",
};

/** "2 Dec 2026, 14:05 UTC": dates are shown in UTC so editors in different places agree. */
export function formatWhen(iso: string): string {
  const d = new Date(iso);
  const date = d.toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
  const time = d.toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit", timeZone: "UTC" });
  return `${date}, ${time} UTC`;
}

/** "2 Dec 2026" (UTC). */
export function formatDay(iso: string): string {
  return new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
}
