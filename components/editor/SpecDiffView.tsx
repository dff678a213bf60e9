/**
 * The canonical spec text of two versions, side by side in one column: line numbers of both,
 * a marker column (+ / − drawn as a bar and a sign), folded unchanged runs. Our own layout.
 */
import type { DiffRow } from "@/lib/spec-diff";

export function SpecDiffView({ rows, fromLabel, toLabel }: { rows: readonly DiffRow[]; fromLabel: string; toLabel: string }) {
  return (
    <div className="relative overflow-x-auto rounded-[var(--radius-card)] border border-line bg-surface" data-testid="spec-diff">
      <table className="w-full border-collapse font-mono text-xs leading-5">
        <caption className="sr-only">
          Line diff from {fromLabel} to {toLabel}: removed lines are marked minus, added lines plus
        </caption>
        <thead className="border-b border-line bg-sunken/60 text-2xs text-ink-faint">
          <tr>
            <th scope="col" className="w-12 px-2 py-1 text-right font-semibold">{fromLabel}</th>
            <th scope="col" className="w-12 px-2 py-1 text-right font-semibold">{toLabel}</th>
            <th scope="col" className="w-6 px-1 py-1">
              <span className="sr-only">change</span>
            </th>
            <th scope="col" className="px-2 py-1 text-left font-semibold">canonical JSON</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r, i) => {
            if (r.kind === "skipped") {
              return (
                <tr key={`s${i}`} className="bg-sunken/40 text-ink-faint">
                  <td colSpan={4} className="px-3 py-1 text-center text-2xs">
                    ⋯ {r.count} unchanged line{r.count === 1 ? "" : "s"} (from line {r.oldLine}) ⋯
                  </td>
                </tr>
              );
            }
            const tone =
              r.kind === "added"
                ? "bg-confirmed-wash/70 [&>td:nth-child(3)]:border-l-4 [&>td:nth-child(3)]:border-confirmed"
                : r.kind === "removed"
                  ? "bg-contradicted-wash/70 [&>td:nth-child(3)]:border-l-4 [&>td:nth-child(3)]:border-contradicted"
                  : "";
            return (
              <tr key={`l${i}`} className={tone} data-kind={r.kind}>
                <td className="px-2 text-right text-ink-faint select-none">{r.oldLine ?? ""}</td>
                <td className="px-2 text-right text-ink-faint select-none">{r.newLine ?? ""}</td>
                <td className={`px-1 text-center font-bold select-none ${r.kind === "added" ? "text-confirmed" : r.kind === "removed" ? "text-contradicted" : ""}`}>
                  {r.kind === "added" ? "+" : r.kind === "removed" ? "−" : ""}
                  <span className="sr-only">{r.kind === "added" ? " added" : r.kind === "removed" ? " removed" : ""}</span>
                </td>
                <td className="px-2 whitespace-pre text-ink">{r.text}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
