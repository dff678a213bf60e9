/**
 * Plots of a report's runs, drawn as inline SVG and renderable on the server.
 *
 * `ExperimentFigures` picks the figures for a game; the single plots are exported for pages that
 * lay figures out themselves. Only `FigureData` (downloads and the paged table) is a client
 * component.
 *
 * CSS custom properties read (each with a fallback, so none is required):
 * - `--color-series-1` .. `--color-series-12`: series colours (fallback: a light/dark pair
 *   through `light-dark()`, which follows the inherited `color-scheme`).
 * - `--color-plot-grid`: grid lines, drawn at 16% opacity (fallback: currentColor).
 * - `--rp-surface`: outline around markers (fallback: white / near-black by colour scheme).
 * Text, axes and rest-point symbols use `currentColor`.
 */
export { ExperimentFigures, phasePlotKind, type ExperimentFiguresProps } from "./ExperimentFigures";
export { TimeSeriesPlot, type TimeSeriesPlotProps } from "./TimeSeriesPlot";
export { SimplexPlot, type SimplexPlotProps } from "./SimplexPlot";
export { UnitSquarePlot, type UnitSquarePlotProps } from "./UnitSquarePlot";
export { FigureData, TABLE_PAGE_SIZE, type FigureDataProps } from "./FigureData";
export type { PlotGame, PlotPopulation } from "@/lib/plots/data";
