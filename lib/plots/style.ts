/**
 * How each series is told apart: a colour, a dash pattern and a marker shape, so that colour is
 * never the only cue. The combination (dash, marker) is unique for the first 24 series (the
 * largest game the specification allows), and colours cycle through 12 hues.
 *
 * Colours are CSS values `var(--color-series-N, light-dark(<light>, <dark>))`: the app's palette
 * may define `--color-series-1` .. `--color-series-12`; otherwise the fallback pair follows the
 * inherited `color-scheme` (the app's root sets it for light and dark). The SVG export replaces
 * each with its light fallback.
 */

export type MarkerShape = "circle" | "square" | "triangle" | "diamond";

export interface SeriesStyle {
  /** CSS colour value (uses a custom property with fallbacks). */
  color: string;
  /** Light-scheme fallback colour (hex), used by the standalone SVG export. */
  lightColor: string;
  /** SVG stroke-dasharray, "" for a solid line. */
  dash: string;
  marker: MarkerShape;
}

/** [light, dark] pairs, chosen for at least 3:1 contrast on white and on near-black. */
export const SERIES_COLORS: readonly (readonly [string, string])[] = [
  ["#2166ac", "#6ea8e8"],
  ["#c8571b", "#f0925a"],
  ["#1b8a4c", "#5cc98a"],
  ["#b03a7c", "#e57fb8"],
  ["#6a4fc2", "#a893f0"],
  ["#8a6d00", "#d9b640"],
  ["#0f7f88", "#4fc6cf"],
  ["#c0302e", "#f07a72"],
  ["#557317", "#a2c45a"],
  ["#8c5a3c", "#c9956f"],
  ["#3f51c9", "#8a98f2"],
  ["#636b75", "#a9b1bb"],
];

export const DASH_PATTERNS: readonly string[] = ["", "8 4", "2 3", "10 3 2 3", "4 2", "10 3 2 3 2 3"];
export const MARKERS: readonly MarkerShape[] = ["circle", "square", "triangle", "diamond"];

/** Light fallback for text and axes (currentColor) in the standalone SVG export. */
export const EXPORT_INK = "#1d232a";
export const EXPORT_BACKGROUND = "#ffffff";

/** Grid line colour: the app's `--color-plot-grid`, else a faint currentColor. */
export const GRID_COLOR = "var(--color-plot-grid, currentColor)";

export function seriesStyle(index: number): SeriesStyle {
  const i = Math.max(0, Math.floor(index));
  const pair = SERIES_COLORS[i % SERIES_COLORS.length] ?? ["#2166ac", "#6ea8e8"];
  // dash = i mod 6, marker = (i + floor(i/12)) mod 4: by the Chinese remainder theorem the pair is
  // unique for i < 12, and the shift by one for 12..23 keeps it unique up to 24.
  return {
    color: `var(--color-series-${(i % SERIES_COLORS.length) + 1}, light-dark(${pair[0]}, ${pair[1]}))`,
    lightColor: pair[0],
    dash: DASH_PATTERNS[i % DASH_PATTERNS.length] ?? "",
    marker: MARKERS[(i + Math.floor(i / 12)) % MARKERS.length] ?? "circle",
  };
}
