/** The game's payoffs as a table with the parameter values used (from lib/spec-view.ts). */
import { formatNumber } from "@/components/report/format";
import type { PayoffCell, PayoffTableView } from "@/lib/spec-view";
import { Glyph } from "@/components/ui/Glyph";

function CellText({ cell }: { cell: PayoffCell }) {
  if (cell.value === null) {
    return (
      <span className="text-danger" title={cell.error}>
        {cell.expression ?? "?"} <span className="sr-only">({cell.error})</span>
      </span>
    );
  }
  return (
    <span>
      <span className="font-mono tabular-nums">{formatNumber(cell.value)}</span>
      {cell.expression !== null && <span className="block font-mono text-2xs text-ink-faint break-all">{cell.expression}</span>}
    </span>
  );
}

/** Both populations' payoffs on one line, with what the author wrote beneath when either is an expression. */
function PairText({ a, b }: { a: PayoffCell; b: PayoffCell }) {
  if (a.value === null || b.value === null) {
    return (
      <span className="flex gap-1">
        <CellText cell={a} />
        <span className="text-ink-faint">,</span>
        <CellText cell={b} />
      </span>
    );
  }
  const written = a.expression !== null || b.expression !== null;
  return (
    <span>
      <span className="font-mono tabular-nums whitespace-nowrap">
        {formatNumber(a.value)}, {formatNumber(b.value)}
      </span>
      {written && (
        <span className="block font-mono text-2xs text-ink-faint break-all">
          {a.expression ?? formatNumber(a.value)}, {b.expression ?? formatNumber(b.value)}
        </span>
      )}
    </span>
  );
}

export function PayoffTable({ view }: { view: PayoffTableView }) {
  return (
    <div className="space-y-3">
      {view.parameters.length > 0 && (
        <dl className="flex flex-wrap gap-x-5 gap-y-1 text-sm" aria-label="Parameter values">
          {view.parameters.map((p) => (
            <div key={p.name} className="flex gap-1.5">
              <dt className="font-mono italic text-ink-soft">{p.name}</dt>
              <dd className="font-mono tabular-nums">= {formatNumber(p.value, 6)}</dd>
            </div>
          ))}
        </dl>
      )}
      <div role="region" aria-label="Payoff table" tabIndex={0} className="overflow-x-auto rounded-lg border border-line">
        <table className="min-w-full border-collapse text-sm" data-testid="payoff-table">
          <caption className="sr-only">{view.reading}</caption>
          <thead className="bg-sunken">
            <tr>
              <th scope="col" className="px-3 py-2 text-left font-medium text-ink-soft">
                {view.rowTitle} <span aria-hidden>
                  <Glyph char="╲" />
                </span> {view.columnTitle}
              </th>
              {view.columns.map((c, j) => (
                <th key={j} scope="col" className="px-3 py-2 text-left font-semibold">
                  {c}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {view.rows.map((r, i) => (
              <tr key={i} className="border-t border-line">
                <th scope="row" className="px-3 py-2 text-left font-semibold">
                  {r}
                </th>
                {view.columns.map((_, j) => {
                  const cells = view.cells[i]?.[j] ?? [];
                  return (
                    <td key={j} className="px-3 py-2 align-top">
                      {cells.length === 2 && cells[0] && cells[1] ? <PairText a={cells[0]} b={cells[1]} /> : cells[0] && <CellText cell={cells[0]} />}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-ink-soft">{view.reading}</p>
    </div>
  );
}
