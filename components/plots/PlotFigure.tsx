/** The frame every plot shares: figure, caption, the drawing, its legend, notes and the data part. */

import type { ReactNode } from "react";
import type { LegendEntry } from "@/lib/plots/export-svg";
import type { CsvBlock } from "@/lib/plots/csv";
import { FigureData } from "./FigureData";
import { Legend } from "./Legend";

export interface PlotFigureProps {
  title: string;
  /** One-sentence description read by screen readers in place of the drawing. */
  summary: string;
  width: number;
  height: number;
  legend: readonly LegendEntry[];
  columns: readonly string[];
  blocks: readonly CsvBlock[];
  withRun: boolean;
  fileStem: string;
  /** Tailwind max-width class of the drawing (a square plot need not be as wide as a time series). */
  maxWidth?: "max-w-xl" | "max-w-2xl";
  /** Sentences shown under the drawing (runs that stopped early, states that could not be drawn). */
  notes?: readonly string[];
  children: ReactNode;
}

export function PlotFigure(props: PlotFigureProps): ReactNode {
  const { title, summary, width, height, legend, columns, blocks, withRun, fileStem, notes = [], maxWidth = "max-w-2xl", children } = props;
  return (
    <figure className="my-4 min-w-0">
      <figcaption className="mb-1 font-semibold">{title}</figcaption>
      <svg
        data-plot-svg=""
        role="img"
        aria-label={summary}
        width={width}
        height={height}
        viewBox={`0 0 ${width} ${height}`}
        className={`block h-auto w-full ${maxWidth} select-none overflow-visible`}
      >
        <title>{summary}</title>
        {children}
      </svg>
      <Legend entries={legend} label={`Legend of ${title}`} />
      {notes.length === 0 ? null : (
        <ul className="mt-2 list-disc pl-5 text-sm">
          {notes.map((n, i) => (
            <li key={i}>{n}</li>
          ))}
        </ul>
      )}
      <FigureData title={title} fileStem={fileStem} legend={legend} columns={columns} blocks={blocks} withRun={withRun} />
    </figure>
  );
}
