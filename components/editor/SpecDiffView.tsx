/**
 * The canonical spec text of two versions, side by side in one column: line numbers of both,
 * a marker column (+ / − drawn as a bar and a sign), folded unchanged runs. Our own layout.
 * Long lines wrap inside their cell (the line numbers stay on the line's first row), and the
 * words that differ between a removed line and its replacement are marked.
 */
import type { DiffLine, DiffRow } from "@/lib/spec-diff";

function LineText({ line }: { line: DiffLine }) {
  if (line.parts === undefined) return <>{line.text}</>;
  const look = line.kind === "added" ? "bg-confirmed/25 text-ink" : "bg-contradicted/25 text-ink line-through decoration-contradicted/60";
  return (
    <>
      {line.parts.map((p, i) =>
        p.changed ? (
          line.kind === "added" ? (
            <ins key={i} className={`rounded-sm no-underline ${look}`}>
              {p.text}
            </ins>
          ) : (
            <del key={i} className={`rounded-sm ${look}`}>
              {p.text}
            </del>
          )
        ) : (
          <span key={i}>{p.text}</span>
        ),
      )}
    </>
  );
}

export function SpecDiffView({ rows, fromLabel, toLabel }: { rows: readonly DiffRow[]; fromLabel: string; toLabel: string }) {
  return (
    <div className="relative overflow-x-auto rounded-[var(--radius-card)] border border-line bg-surface" data-testid="spec-diff">
      <table className="w-full table-fixed border-collapse font-mono text-xs leading-5">
        <caption className="sr-only">
          Line diff from {fromLabel} to {toLabel}: removed lines are marked minus, added lines plus
        </caption>
        <thead className="border-b border-line bg-sunken/60 text-2xs text-ink-faint">
          <tr>
            <th scope="col" className="w-11 px-2 py-1 text-right font-semibold">{fromLabel}</th>
            <th scope="col" className="w-11 px-2 py-1 text-right font-semibold">{toLabel}</th>
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
                <td className="px-2 text-right align-top text-ink-faint select-none">{r.oldLine ?? ""}</td>
                <td className="px-2 text-right align-top text-ink-faint select-none">{r.newLine ?? ""}</td>
                <td className={`px-1 text-center align-top font-bold select-none ${r.kind === "added" ? "text-confirmed" : r.kind === "removed" ? "text-contradicted" : ""}`}>
                  {r.kind === "added" ? "+" : r.kind === "removed" ? "−" : ""}
                  <span className="sr-only">{r.kind === "added" ? " added" : r.kind === "removed" ? " removed" : ""}</span>
                </td>
                <td className="px-2 align-top whitespace-pre-wrap break-words text-ink [overflow-wrap:anywhere]">
                  <LineText line={r} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
