/** SVG building blocks shared by the plots: axes with ticks and grid, series lines, point symbols. */

import type { ReactNode } from "react";
import { formatTick, niceStep, niceTicks, type LinearScale } from "@/lib/plots/scale";
import { GRID_COLOR, seriesStyle } from "@/lib/plots/style";
import { markerPath, pointSymbol, type PointSymbol } from "@/lib/plots/symbols";
import type { Point } from "@/lib/plots/downsample";

/**
 * Background colour used to outline markers so they stay visible where lines cross: the app's
 * surface colour, else white or near-black by the inherited colour scheme.
 */
export const SURFACE = "var(--rp-surface, light-dark(#ffffff, #15181c))";

export const TICK_FONT = 12;
export const LABEL_FONT = 13;
/**
 * Text sizes: the attribute is what a standalone file uses; on a phone-width screen the drawing
 * is scaled down to about 0.65, so the class enlarges text in drawing units to stay legible.
 */
export const TICK_TEXT_CLASS = "text-[12px] max-sm:text-[18px]";
export const LABEL_TEXT_CLASS = "text-[13px] max-sm:text-[19px]";

interface AxesProps {
  x: LinearScale;
  y: LinearScale;
  xTickCount?: number;
  yTickCount?: number;
  xLabel: string;
  yLabel: string;
}

/** Frame, grid, ticks and labels of a rectangular plot area given by the scales' ranges. */
export function Axes({ x, y, xTickCount = 6, yTickCount = 5, xLabel, yLabel }: AxesProps): ReactNode {
  const [left, right] = x.range;
  const [bottom, top] = y.range;
  const [x0, x1] = x.domain;
  const [y0, y1] = y.domain;
  const xStep = niceStep(x1 - x0, xTickCount);
  const yStep = niceStep(y1 - y0, yTickCount);
  const xTicks = niceTicks(x0, x1, xTickCount);
  const yTicks = niceTicks(y0, y1, yTickCount);
  return (
    <g>
      <g stroke={GRID_COLOR} strokeOpacity={0.16} strokeWidth={1}>
        {xTicks.map((t) => (
          <line key={`gx${t}`} x1={x(t)} x2={x(t)} y1={top} y2={bottom} />
        ))}
        {yTicks.map((t) => (
          <line key={`gy${t}`} x1={left} x2={right} y1={y(t)} y2={y(t)} />
        ))}
      </g>
      <g stroke="currentColor" strokeWidth={1} strokeOpacity={0.7}>
        <line x1={left} x2={right} y1={bottom} y2={bottom} />
        <line x1={left} x2={left} y1={bottom} y2={top} />
        {xTicks.map((t) => (
          <line key={`tx${t}`} x1={x(t)} x2={x(t)} y1={bottom} y2={bottom + 5} />
        ))}
        {yTicks.map((t) => (
          <line key={`ty${t}`} x1={left - 5} x2={left} y1={y(t)} y2={y(t)} />
        ))}
      </g>
      <g fill="currentColor" fontSize={TICK_FONT} className={TICK_TEXT_CLASS} style={{ fontVariantNumeric: "tabular-nums" }}>
        {xTicks.map((t) => (
          <text key={`lx${t}`} x={x(t)} y={bottom + 20} textAnchor="middle">
            {formatTick(t, xStep)}
          </text>
        ))}
        {yTicks.map((t) => (
          <text key={`ly${t}`} x={left - 8} y={y(t) + 4} textAnchor="end">
            {formatTick(t, yStep)}
          </text>
        ))}
      </g>
      <g fill="currentColor" fontSize={LABEL_FONT} className={LABEL_TEXT_CLASS}>
        <text x={(left + right) / 2} y={bottom + 40} textAnchor="middle">
          {xLabel}
        </text>
        <text
          x={0}
          y={0}
          transform={`translate(${left - 44} ${(top + bottom) / 2}) rotate(-90)`}
          textAnchor="middle"
        >
          {yLabel}
        </text>
      </g>
    </g>
  );
}

/** One series: the thinned line plus a few markers of the series' shape along it. */
export function SeriesLine({
  index,
  points,
  markers,
}: {
  index: number;
  points: string;
  markers: readonly Point[];
}): ReactNode {
  const s = seriesStyle(index);
  return (
    <g data-series={index}>
      <polyline
        points={points}
        fill="none"
        style={{ stroke: s.color }}
        strokeWidth={1.8}
        strokeDasharray={s.dash === "" ? undefined : s.dash}
        strokeLinejoin="round"
        strokeLinecap="round"
      />
      {markers.map((p, k) => (
        <path key={k} d={markerPath(s.marker, p[0], p[1], 7)} style={{ fill: s.color, stroke: SURFACE }} strokeWidth={1} />
      ))}
    </g>
  );
}

/** A rest-point or start symbol; `index` colours it like a series (start markers), else ink. */
export function PointMark({
  kind,
  at,
  size = 11,
  index,
  label,
}: {
  kind: PointSymbol;
  at: Point;
  size?: number;
  index?: number;
  label?: string;
}): ReactNode {
  const p = pointSymbol(kind, at[0], at[1], size);
  const color = index === undefined ? "currentColor" : seriesStyle(index).color;
  return (
    <g data-symbol={kind}>
      {label === undefined ? null : <title>{label}</title>}
      <path d={p.d} style={{ fill: p.filled ? color : SURFACE, stroke: color }} strokeWidth={1.8} />
      {p.fillPart === "" ? null : <path d={p.fillPart} style={{ fill: color }} />}
    </g>
  );
}
