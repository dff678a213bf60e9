/** The dynamics of a model as equations, what the symbols mean, and its constants. */
import { formatNumber } from "@/components/report/format";
import type { DynamicsView } from "@/lib/spec-view";
import { GlyphText } from "@/components/ui/Glyph";
import { Formula, FormulaProse } from "./Formula";

export function DynamicsPanel({ view }: { view: DynamicsView }) {
  return (
    <div className="space-y-3" data-testid="dynamics" data-kind={view.kind}>
      <p className="font-medium">{view.name}</p>
      <div role="region" aria-label="Equations of the dynamics" tabIndex={0} className="space-y-2 overflow-x-auto rounded-lg border border-line bg-surface px-4 py-3">
        {view.equations.map((eq, i) => (
          <p key={i} className="pt-1">
            <Formula parts={eq} />
          </p>
        ))}
      </div>
      {view.constants.length > 0 && (
        <p className="text-sm">
          {view.constants.map((c) => (
            <span key={c.symbol} className="mr-4">
              {c.name}{" "}
              <span className="font-serif italic">
                <GlyphText text={c.symbol} />
              </span>{" "}
              = <span className="font-mono">{formatNumber(c.value, 6)}</span>
            </span>
          ))}
        </p>
      )}
      <ul className="list-disc space-y-1 pl-5 text-sm text-ink-soft">
        {view.where.map((w, i) => (
          <li key={i}>
            <FormulaProse parts={w} />
          </li>
        ))}
      </ul>
    </div>
  );
}
