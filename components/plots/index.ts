export { ExperimentFigures, phasePlotKind, type ExperimentFiguresProps } from "./ExperimentFigures";
export { TimeSeriesPlot, type TimeSeriesPlotProps } from "./TimeSeriesPlot";
export { SimplexPlot, type SimplexPlotProps } from "./SimplexPlot";
export { UnitSquarePlot, type UnitSquarePlotProps } from "./UnitSquarePlot";
export { FigureData, TABLE_PAGE_SIZE, type FigureDataProps } from "./FigureData";
export type { PlotGame, PlotPopulation } from "@/lib/plots/data";
