/**
 * A number in scientific notation with a real superscript, e.g. 3.2 × 10<sup>-5</sup>; plain text in
 * its title. Latin-1 only (components/ui/Glyph.tsx): the spaces around × are margins, the
 * exponent's sign a hyphen-minus.
 */
import { scientificText, toScientific } from "./format";

export function Sci({ value, digits = 2 }: { value: number; digits?: number }) {
  if (!Number.isFinite(value)) return <span className="font-mono">{String(value)}</span>;
  const { mantissa, exponent } = toScientific(value, digits);
  if (exponent === 0) {
    return (
      <span className="font-mono tabular-nums" title={scientificText(value, 6)}>
        {mantissa}
      </span>
    );
  }
  return (
    <span className="font-mono tabular-nums whitespace-nowrap" title={scientificText(value, 6)}>
      {mantissa}
      <span className="mx-[0.16em]">×</span>10
      <sup>{exponent}</sup>
    </span>
  );
}
