"use client";

/**
 * The interactive part of a figure: "Download SVG" and "Download CSV" buttons, and the data table
 * alternative, paged so a 10001-sample run stays light. The table and the CSV hold every sample.
 */

import { useState, type MouseEvent, type ReactNode } from "react";
import { trajectoryCsv, type CsvBlock } from "@/lib/plots/csv";
import { standaloneSvg, type LegendEntry } from "@/lib/plots/export-svg";
import { formatShare, formatTime } from "@/lib/plots/format";
import { pageOf } from "@/lib/plots/paging";

export const TABLE_PAGE_SIZE = 100;

export interface FigureDataProps {
  /** Figure title, used as the SVG file's title and the table caption. */
  title: string;
  /** File name stem for the downloads ("<stem>.svg", "<stem>.csv"). */
  fileStem: string;
  legend: readonly LegendEntry[];
  /** One header per value column (strategy, or "population: strategy"). */
  columns: readonly string[];
  blocks: readonly CsvBlock[];
  /** Adds a leading "Run" column (figures that draw several runs). */
  withRun: boolean;
}

function saveFile(content: string, type: string, name: string): void {
  const url = URL.createObjectURL(new Blob([content], { type }));
  const link = document.createElement("a");
  link.href = url;
  link.download = name;
  link.rel = "noopener";
  document.body.append(link);
  link.click();
  link.remove();
  // Revoke after the click has been handled, so the download has started.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

function downloadSvg(event: MouseEvent<HTMLButtonElement>, title: string, legend: readonly LegendEntry[], stem: string): void {
  const svg = event.currentTarget.closest("figure")?.querySelector<SVGSVGElement>("svg[data-plot-svg]");
  if (svg == null) return;
  const width = Number(svg.getAttribute("width") ?? "0");
  const height = Number(svg.getAttribute("height") ?? "0");
  const markup = new XMLSerializer().serializeToString(svg);
  saveFile(standaloneSvg({ plotSvg: markup, width, height, title, legend }), "image/svg+xml", `${stem}.svg`);
}

const buttonClass =
  "rounded-md border border-current/25 px-2.5 py-1 text-sm hover:bg-current/10 focus-visible:outline-2 " +
  "focus-visible:outline-offset-2 disabled:cursor-not-allowed disabled:opacity-40";

export function FigureData({ title, fileStem, legend, columns, blocks, withRun }: FigureDataProps): ReactNode {
  const [page, setPage] = useState(0);
  const { page: current, pages, total, first, last, rows } = pageOf(blocks, page, TABLE_PAGE_SIZE);

  const range = total === 0 ? "no rows" : `rows ${first + 1}–${last} of ${total}`;
  return (
    <div className="mt-3">
      <div className="flex flex-wrap gap-2">
        <button type="button" className={buttonClass} onClick={(e) => downloadSvg(e, title, legend, fileStem)}>
          Download SVG
        </button>
        <button
          type="button"
          className={buttonClass}
          disabled={total === 0}
          onClick={() => saveFile(trajectoryCsv(columns, blocks, withRun), "text/csv;charset=utf-8", `${fileStem}.csv`)}
        >
          Download CSV
        </button>
      </div>
      <details className="mt-2">
        <summary className="cursor-pointer text-sm underline-offset-2 hover:underline">
          Data table ({total} {total === 1 ? "row" : "rows"})
        </summary>
        <div className="mt-2 max-w-full overflow-x-auto" role="region" aria-label={`Data of ${title}`} tabIndex={0}>
          <table className="min-w-full border-collapse text-right text-xs tabular-nums">
            <caption className="mb-1 text-left text-xs">
              {title}: {range}. Shares rounded to 6 decimals; the CSV file has full precision.
            </caption>
            <thead>
              <tr className="border-b border-current/30">
                {withRun ? (
                  <th scope="col" className="px-2 py-1 text-left font-semibold">
                    Run
                  </th>
                ) : null}
                <th scope="col" className="px-2 py-1 font-semibold">
                  Time
                </th>
                {columns.map((c, i) => (
                  <th key={i} scope="col" className="px-2 py-1 font-semibold">
                    {c}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.key} className="border-b border-current/10">
                  {withRun ? <td className="px-2 py-0.5 text-left">{r.run}</td> : null}
                  <td className="px-2 py-0.5">{formatTime(r.t)}</td>
                  {r.values.map((v, i) => (
                    <td key={i} className="px-2 py-0.5">
                      {formatShare(v)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        {pages > 1 ? (
          <nav className="mt-2 flex flex-wrap items-center gap-2 text-sm" aria-label={`Pages of ${title}`}>
            <button type="button" className={buttonClass} disabled={current === 0} onClick={() => setPage(0)}>
              First
            </button>
            <button type="button" className={buttonClass} disabled={current === 0} onClick={() => setPage(current - 1)}>
              Previous
            </button>
            <span aria-live="polite">
              Page {current + 1} of {pages}
            </span>
            <button
              type="button"
              className={buttonClass}
              disabled={current >= pages - 1}
              onClick={() => setPage(current + 1)}
            >
              Next
            </button>
            <button
              type="button"
              className={buttonClass}
              disabled={current >= pages - 1}
              onClick={() => setPage(pages - 1)}
            >
              Last
            </button>
          </nav>
        ) : null}
      </details>
    </div>
  );
}
