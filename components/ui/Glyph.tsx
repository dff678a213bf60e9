/**
 * The few symbols of our own page text that lie beyond Latin-1 (Greek letters and operators of
 * the dynamics, dashes, arrows), drawn by CSS generated content instead of sent as characters.
 *
 * Why: Next.js keeps a cached page as one JavaScript string and writes it out on every request.
 * A single character above U+00FF makes V8 store the whole page as a two-byte string, and each
 * response then re-encodes it to UTF-8 the slow way. On the public model page that halved the
 * throughput (`npm run bench:web`, same page with and without such characters: about 560 vs
 * 1060 requests per second at 50 connections on a 2-core machine). So the markup stays Latin-1,
 * and a symbol beyond it is an empty span whose `::before` prints it from a CSS escape
 * (`.rp-glyph` in app/globals.css). tests/e2e/reader.test.ts checks the page stays Latin-1.
 *
 * Only our own symbols go through here; text from a model (titles, strategy and population
 * names) is rendered as it is. Generated content is read by screen readers but not copied with
 * a selection, so numbers keep the ASCII hyphen-minus (components/report/format.ts).
 */
import type { CSSProperties } from "react";

/** The symbols drawn as glyphs: everything our formulas, tables and labels use beyond Latin-1. */
const DRAWN = /[^\u0000-\u00ff]/u;

/** The CSS string for one code point, e.g. "φ" -> `"\3c6"` (an escape, so the markup stays Latin-1). */
export function cssEscape(char: string): string {
  return `"\\${(char.codePointAt(0) ?? 0x3f).toString(16)}"`;
}

/** One symbol beyond Latin-1. `label` names it for screen readers where the symbol alone would not. */
export function Glyph({ char, label }: { char: string; label?: string }) {
  const style = { "--rp-glyph": cssEscape(char) } as CSSProperties;
  return label === undefined ? (
    <span className="rp-glyph" style={style} />
  ) : (
    <span className="rp-glyph" style={style} role="img" aria-label={label} />
  );
}

/**
 * Our own text with any symbol beyond Latin-1 drawn as a glyph, e.g. "x\u1d62 is the share" or
 * "f\u1d62 \u2212 \u03c6". Text of Latin-1 only comes back as the same string.
 */
export function GlyphText({ text }: { text: string }) {
  if (!DRAWN.test(text)) return <>{text}</>;
  const out: React.ReactNode[] = [];
  let run = "";
  for (const char of text) {
    if (char.codePointAt(0)! > 0xff) {
      if (run !== "") out.push(run);
      run = "";
      out.push(<Glyph key={out.length} char={char} />);
    } else {
      run += char;
    }
  }
  if (run !== "") out.push(run);
  return <>{out}</>;
}
