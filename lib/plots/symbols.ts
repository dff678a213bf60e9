/**
 * Marker and rest-point symbols as SVG path data, shared by the React components and the
 * standalone SVG export so both draw the same shapes.
 */

import type { Stability } from "@/lib/engine/types";
import type { MarkerShape } from "./style";

/** Path data for a series marker of about `size` units across, centred on (cx, cy). */
export function markerPath(shape: MarkerShape, cx: number, cy: number, size: number): string {
  const r = size / 2;
  switch (shape) {
    case "circle":
      return circlePath(cx, cy, r);
    case "square": {
      const s = r * 0.88;
      return `M${f(cx - s)} ${f(cy - s)}h${f(2 * s)}v${f(2 * s)}h${f(-2 * s)}Z`;
    }
    case "triangle": {
      const h = r * 1.1;
      return `M${f(cx)} ${f(cy - h)}L${f(cx + h)} ${f(cy + h * 0.8)}L${f(cx - h)} ${f(cy + h * 0.8)}Z`;
    }
    case "diamond": {
      const d = r * 1.2;
      return `M${f(cx)} ${f(cy - d)}L${f(cx + d)} ${f(cy)}L${f(cx)} ${f(cy + d)}L${f(cx - d)} ${f(cy)}Z`;
    }
  }
}

export function circlePath(cx: number, cy: number, r: number): string {
  return `M${f(cx - r)} ${f(cy)}a${f(r)} ${f(r)} 0 1 0 ${f(2 * r)} 0a${f(r)} ${f(r)} 0 1 0 ${f(-2 * r)} 0Z`;
}

/** Kinds of point symbol in a phase portrait: rest points by stability, and the start of a run. */
export type PointSymbol = Stability | "start";

export interface SymbolPaint {
  /** Outline path(s). */
  d: string;
  /** Whether the outline is filled with the ink colour; otherwise filled with the background. */
  filled: boolean;
  /** Extra path drawn filled (the filled half of the non-hyperbolic symbol), or "". */
  fillPart: string;
}

/**
 * Rest points: asymptotically stable = filled disc; unstable = open square; non-hyperbolic =
 * diamond with its left half filled. Start of a run: open triangle (drawn in the run's colour).
 */
export function pointSymbol(kind: PointSymbol, cx: number, cy: number, size: number): SymbolPaint {
  const r = size / 2;
  switch (kind) {
    case "asymptotically-stable":
      return { d: circlePath(cx, cy, r), filled: true, fillPart: "" };
    case "unstable":
      return { d: markerPath("square", cx, cy, size), filled: false, fillPart: "" };
    case "non-hyperbolic": {
      const d = r * 1.25;
      return {
        d: `M${f(cx)} ${f(cy - d)}L${f(cx + d)} ${f(cy)}L${f(cx)} ${f(cy + d)}L${f(cx - d)} ${f(cy)}Z`,
        filled: false,
        fillPart: `M${f(cx)} ${f(cy - d)}L${f(cx)} ${f(cy + d)}L${f(cx - d)} ${f(cy)}Z`,
      };
    }
    case "start":
      return { d: markerPath("triangle", cx, cy, size * 0.9), filled: false, fillPart: "" };
  }
}

/** Words for each symbol, used by legends and summaries. */
export const SYMBOL_LABELS: Record<PointSymbol, string> = {
  "asymptotically-stable": "asymptotically stable rest point",
  unstable: "unstable rest point",
  "non-hyperbolic": "non-hyperbolic rest point",
  start: "start of a run",
};

function f(value: number): string {
  return String(Math.round(value * 100) / 100);
}
