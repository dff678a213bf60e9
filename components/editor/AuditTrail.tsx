/** A model's audit trail as a timeline: when, who, what, on which version. Read-only by nature. */
import type { AuditLine } from "@/lib/decisions";
import { AUDIT_WORDS, OUTCOME_WORDS, formatWhen } from "./labels";

function detailText(e: AuditLine): string | null {
  const d = e.detail;
  if (e.action === "decision.recorded") {
    const outcome = typeof d.outcome === "string" && d.outcome in OUTCOME_WORDS ? OUTCOME_WORDS[d.outcome as keyof typeof OUTCOME_WORDS] : String(d.outcome ?? "");
    const comment = typeof d.comment === "string" && d.comment !== "" ? ` — “${d.comment}”` : "";
    return `${outcome}${comment}${d.madePublic === true ? " (model made public)" : ""}`;
  }
  if (e.action === "version.submitted" && e.venue !== null) return `to ${e.venue.name}`;
  if (e.action === "job.failed" && typeof d.error === "string") return d.error;
  if (e.action === "model.updated" && typeof d.visibility === "string" && d.visibility !== d.previousVisibility) return `visibility: ${String(d.previousVisibility)} → ${d.visibility}`;
  return null;
}

export function AuditTrail({ events }: { events: readonly AuditLine[] }) {
  if (events.length === 0) return <p className="text-sm text-ink-soft">Nothing recorded yet.</p>;
  return (
    <ol className="relative flex flex-col gap-0 border-l-2 border-line pl-5" data-testid="audit-trail">
      {events.map((e) => {
        const text = detailText(e);
        return (
          <li key={e.id} className="relative pb-4 last:pb-0" data-action={e.action}>
            <span aria-hidden="true" className={`absolute top-1.5 -left-[1.69rem] size-3 rotate-45 border-2 ${e.action === "decision.recorded" ? "border-tide bg-tide" : "border-line-strong bg-surface"}`} />
            <p className="text-sm">
              <span className="font-semibold">{AUDIT_WORDS[e.action] ?? e.action}</span>
              {e.versionNumber === null ? null : <span className="font-mono text-xs text-ink-soft"> · v{e.versionNumber}</span>}
              {text === null ? null : <span className="text-ink-soft"> · {text}</span>}
            </p>
            <p className="text-xs text-ink-faint">
              {formatWhen(e.at)} · {e.actor?.name ?? "the system"}
            </p>
          </li>
        );
      })}
    </ol>
  );
}
