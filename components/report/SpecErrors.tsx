/** The problems that made a spec invalid: where (JSON pointer, line) and what. */
import type { SpecError } from "@/lib/engine/types";
import { pointerText } from "./format";

export function SpecErrors({ errors, title = "Problems in the specification" }: { errors: readonly SpecError[]; title?: string }) {
  if (errors.length === 0) return null;
  return (
    <section aria-labelledby="spec-errors-heading" data-testid="spec-errors">
      <h3 id="spec-errors-heading" className="mb-2 text-base font-semibold">
        {title} ({errors.length})
      </h3>
      <ol className="space-y-1.5 text-sm">
        {errors.map((e, i) => (
          <li key={i} className="flex flex-wrap items-baseline gap-x-2 border-l-2 border-invalid pl-3">
            <code className="rounded bg-sunken px-1 py-0.5 font-mono text-xs break-all">
              {pointerText(e.path)}
            </code>
            {e.line !== undefined && (
              <span className="text-xs text-ink-faint">line {e.line}</span>
            )}
            <span className="basis-full sm:basis-auto">{e.message}</span>
          </li>
        ))}
      </ol>
    </section>
  );
}
