/**
 * The editors' decisions on one version (or all versions) of a model, with their comments:
 * for the author's version page and the public version page. Server component.
 *
 *   <DecisionsForVersion modelId={model.id} versionNumber={3} />
 */
import { listDecisionsForModel } from "@/lib/decisions";
import { OUTCOME_WORDS, formatWhen } from "./labels";
import { StatusPill } from "./StatusPill";

export async function DecisionsForVersion({ modelId, versionNumber, showComments = true }: { modelId: string; versionNumber?: number; showComments?: boolean }) {
  const all = await listDecisionsForModel(modelId);
  const decisions = versionNumber === undefined ? all : all.filter((d) => d.versionNumber === versionNumber);
  if (decisions.length === 0) {
    return (
      <p className="text-sm text-ink-soft" data-testid="no-decision">
        {versionNumber === undefined ? "No editor has decided on a version of this model yet." : `No editor has decided on version ${versionNumber} yet.`}
      </p>
    );
  }
  return (
    <ul className="flex flex-col gap-3" data-testid="decisions">
      {decisions.map((d) => (
        <li key={d.id} className="rp-card flex flex-col items-start gap-2 p-4 text-sm" data-outcome={d.outcome}>
          <div className="flex flex-wrap items-center gap-2">
            <StatusPill status={d.outcome} />
            <span className="text-ink-soft">
              {versionNumber === undefined ? `version ${d.versionNumber} · ` : ""}
              {d.venue.name}
            </span>
          </div>
          {showComments && d.comment !== "" ? <p className="whitespace-pre-wrap">{d.comment}</p> : null}
          <p className="text-xs text-ink-faint">
            {OUTCOME_WORDS[d.outcome]} by {d.editor.name} · {formatWhen(d.createdAt)}
          </p>
        </li>
      ))}
    </ul>
  );
}
