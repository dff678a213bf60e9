/**
 * Renders our formula markup (lib/spec-view.ts) as text with italics, sub- and superscripts. Our
 * own symbols beyond Latin-1 (Greek letters, the minus sign) are glyphs drawn by CSS
 * (components/ui/Glyph.tsx); names from the model are rendered exactly as written.
 */
import { GlyphText } from "@/components/ui/Glyph";
import type { Formula as FormulaParts } from "@/lib/spec-view";
import { formulaReading } from "@/lib/spec-view";

function Parts({ parts }: { parts: FormulaParts }) {
  return parts.map((p, i) => {
    if ("text" in p) return <GlyphText key={i} text={p.text} />;
    if ("name" in p) return <span key={i}>{p.name}</span>;
    return (
      <span key={i}>
        {/* A time derivative is the symbol with a dot above, as in print (.rp-dot-above in app/globals.css). */}
        <span className={p.dot ? "rp-dot-above italic" : "italic"}>
          <GlyphText text={p.sym} />
        </span>
        {p.sub ? <sub className="italic">{p.sub}</sub> : null}
        {p.sup ? <sup>{p.sup}</sup> : null}
      </span>
    );
  });
}

/** An equation on a line of its own, read out from its plain-text reading. */
export function Formula({ parts }: { parts: FormulaParts }) {
  return (
    <span className="font-serif text-base whitespace-nowrap" aria-label={formulaReading(parts)} role="math">
      <span aria-hidden>
        <Parts parts={parts} />
      </span>
    </span>
  );
}

/** A sentence with symbols in it ("x_i is the share of strategy i"), wrapping like prose. */
export function FormulaProse({ parts }: { parts: FormulaParts }) {
  return <Parts parts={parts} />;
}
