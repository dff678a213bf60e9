/** Renders our formula markup (lib/spec-view.ts) as text with italics, sub- and superscripts. */
import type { Formula as FormulaParts } from "@/lib/spec-view";
import { formulaText } from "@/lib/spec-view";

export function Formula({ parts }: { parts: FormulaParts }) {
  return (
    <span className="font-serif text-base whitespace-nowrap" aria-label={formulaText(parts)} role="math">
      {parts.map((p, i) => {
        if ("text" in p) return <span key={i}>{p.text}</span>;
        const base = p.dot ? (
          <span className="relative inline-block italic">
            {p.sym}
            <span aria-hidden className="absolute -top-2.5 left-0 right-0 text-center not-italic leading-none">
              ˙
            </span>
          </span>
        ) : (
          <span className="italic">{p.sym}</span>
        );
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
