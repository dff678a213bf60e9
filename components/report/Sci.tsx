/** A number in scientific notation with a real superscript, e.g. 3.2 × 10⁻⁵; plain text in its title. */
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
      {"\u2009×\u200910"}
      <sup>{exponent < 0 ? `\u2212${-exponent}` : exponent}</sup>
    </span>
  );
}
