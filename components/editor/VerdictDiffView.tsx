/** Claims added, removed, or changed in status or deviation between two versions' reports. */
import { Sci } from "@/components/report";
import { VerdictTag } from "@/components/status/VerdictTag";
import { DEVIATION_DIGITS, type ClaimChange, type ClaimSide, type VerdictDiff } from "@/lib/spec-diff";

const CHANGE_WORDS: Record<ClaimChange["change"], string> = {
  added: "Added",
  removed: "Removed",
  changed: "Changed",
  unchanged: "Same",
};
const CHANGE_LOOK: Record<ClaimChange["change"], string> = {
  added: "border-confirmed/50 text-confirmed",
  removed: "border-contradicted/50 text-contradicted",
  changed: "border-ochre/60 text-ochre",
  unchanged: "border-line text-ink-faint",
};

function Side({ side }: { side: ClaimSide | undefined }) {
  if (side === undefined) return <span className="text-ink-faint">—</span>;
  return (
    <span className="flex flex-col items-start gap-0.5">
      <VerdictTag verdict={side.status} size="sm" />
      {side.deviation === undefined ? null : (
        <span className="font-mono text-2xs text-ink-soft">
          deviation <Sci value={side.deviation} digits={DEVIATION_DIGITS} />
        </span>
      )}
    </span>
  );
}

export function VerdictDiffView({ diff, fromLabel, toLabel }: { diff: VerdictDiff; fromLabel: string; toLabel: string }) {
  return (
    <div className="flex flex-col gap-4" data-testid="verdict-diff">
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <span className="text-ink-soft">Verdict</span>
        {diff.from === null ? <span className="text-ink-faint">not checked</span> : <VerdictTag verdict={diff.from} />}
        <span aria-hidden="true">→</span>
        <span className="sr-only">then</span>
        {diff.to === null ? <span className="text-ink-faint">not checked</span> : <VerdictTag verdict={diff.to} />}
        <span className="text-xs text-ink-faint">
          {diff.counts.added} added · {diff.counts.removed} removed · {diff.counts.changed} changed · {diff.counts.unchanged} same
        </span>
      </div>
      <div className="relative overflow-x-auto rounded-[var(--radius-card)] border border-line bg-surface">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">Claims compared by id</caption>
          <thead className="border-b border-line bg-sunken/60 text-xs">
            <tr>
              <th scope="col" className="px-3 py-2 text-left font-semibold">Claim</th>
              <th scope="col" className="px-3 py-2 text-left font-semibold">Change</th>
              <th scope="col" className="px-3 py-2 text-left font-semibold">{fromLabel}</th>
              <th scope="col" className="px-3 py-2 text-left font-semibold">{toLabel}</th>
            </tr>
          </thead>
          <tbody>
            {diff.claims.map((c) => {
              const from = c.change === "added" ? undefined : c.from;
              const to = c.change === "removed" ? undefined : c.to;
              const what =
                c.change === "changed"
                  ? [c.statusChanged ? "status" : null, c.deviationChanged ? "deviation" : null, c.kindChanged ? "kind" : null].filter((x) => x !== null).join(", ")
                  : null;
              return (
                <tr key={c.id} className="border-b border-line last:border-b-0" data-change={c.change} data-claim={c.id}>
                  <td className="px-3 py-2 align-top">
                    <code className="font-mono text-xs">{c.id}</code>
                    <div className="text-2xs text-ink-faint">{(to ?? from)?.kind}</div>
                  </td>
                  <td className="px-3 py-2 align-top">
                    <span className={`inline-block rounded-sm border px-1.5 text-xs font-semibold ${CHANGE_LOOK[c.change]}`}>{CHANGE_WORDS[c.change]}</span>
                    {what === null ? null : <div className="text-2xs text-ink-soft">{what}</div>}
                  </td>
                  <td className="px-3 py-2 align-top">
                    <Side side={from} />
                  </td>
                  <td className="px-3 py-2 align-top">
                    <Side side={to} />
                  </td>
                </tr>
              );
            })}
            {diff.claims.length === 0 ? (
              <tr>
                <td colSpan={4} className="px-3 py-4 text-ink-soft">
                  Neither version has a report with claims yet.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
