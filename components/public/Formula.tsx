/** Renders our formula markup (lib/spec-view.ts) as text with italics, sub- and superscripts. */
import type { Formula as FormulaParts } from "@/lib/spec-view";
import { formulaText } from "@/lib/spec-view";

export function Formula({ parts }: { parts: FormulaParts }) {
  return (
    <span className="font-serif text-base whitespace-nowrap" aria-label={formulaText(parts)} role="math">
      {parts.map((p, i) => {
        if ("text" in p) return <span key={i}>{p.text}</span>;
        // A time derivative is the symbol with a combining dot above (U+0307), as in print.
        const base = <span className="italic">{p.dot ? `${p.sym}\u0307` : p.sym}</span>;
        return (
          <span key={i} aria-hidden>
            {base}
            {p.sub ? <sub className="italic">{p.sub}</sub> : null}
            {p.sup ? <sup>{p.sup}</sup> : null}
          </span>
        );
      })}
    </span>
  );
}
