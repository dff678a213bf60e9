/** Number formatting shared by plot labels, table cells and accessible summaries. */

/** A share in [0, 1] as shown in tables and summaries: fixed decimals, no "-0". */
export function formatShare(value: number, decimals = 6): string {
  if (!Number.isFinite(value)) return String(value);
  const text = value.toFixed(decimals);
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text;
}

/** A time value: up to `digits` significant digits, without trailing zeros or exponent for common ranges. */
export function formatTime(value: number, digits = 6): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return "0";
  const abs = Math.abs(value);
  if (abs >= 1e-4 && abs < 1e9) return String(Number(value.toPrecision(digits)));
  return value.toPrecision(digits);
}

/** Shortens a label for display inside a drawing; the full text stays in tables and summaries. */
export function truncateLabel(text: string, max: number): string {
  const chars = Array.from(text);
  return chars.length <= max ? text : `${chars.slice(0, Math.max(1, max - 1)).join("")}…`;
}

/** A file-name stem from an arbitrary id: keeps letters, digits, dot, dash and underscore. */
export function fileStem(text: string): string {
  const stem = text.replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^[-.]+|-+$/g, "");
  return stem === "" ? "figure" : stem.slice(0, 80);
}
