/**
 * Standalone SVG files from a plot's markup: adds the XML namespace, a background, the ink colour
 * and font, resolves CSS custom properties to their light fallbacks (a standalone file has no page
 * style sheet, and not every SVG viewer understands var() or light-dark()), and appends the legend
 * that the page shows as HTML.
 */

import { EXPORT_BACKGROUND, EXPORT_INK, seriesStyle } from "./style";
import { markerPath, pointSymbol, type PointSymbol } from "./symbols";

export type LegendEntry =
  | { kind: "series"; index: number; label: string }
  | { kind: "symbol"; symbol: PointSymbol; label: string; /** series index colouring a start marker */ index?: number }
  | { kind: "heading"; label: string };

/** Escapes text for XML character data and attribute values. */
export function xmlEscape(text: string): string {
  return text
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&apos;");
}

/**
 * Replaces every `var(--name, fallback)` by its fallback and every `light-dark(a, b)` by `a`,
 * innermost first; a var() without a fallback becomes `currentColor`.
 */
export function resolveCssFunctions(text: string): string {
  let out = text;
  for (let guard = 0; guard < 1000; guard++) {
    const match = /(var|light-dark)\(/i.exec(out);
    if (match === null) return out;
    const start = match.index;
    const open = start + match[0].length - 1;
    const close = matchingParen(out, open);
    if (close < 0) return out;
    const args = splitTopLevel(out.slice(open + 1, close));
    const name = (match[1] ?? "").toLowerCase();
    let replacement: string;
    if (name === "var") replacement = args.length > 1 ? args.slice(1).join(",").trim() : "currentColor";
    else replacement = (args[0] ?? "").trim();
    out = out.slice(0, start) + replacement + out.slice(close + 1);
  }
  return out;
}

function matchingParen(text: string, open: number): number {
  let depth = 0;
  for (let i = open; i < text.length; i++) {
    const c = text[i];
    if (c === "(") depth++;
    else if (c === ")") {
      depth--;
      if (depth === 0) return i;
    }
  }
  return -1;
}

function splitTopLevel(text: string): string[] {
  const parts: string[] = [];
  let depth = 0;
  let current = "";
  for (const c of text) {
    if (c === "(") depth++;
    if (c === ")") depth--;
    if (c === "," && depth === 0) {
      parts.push(current);
      current = "";
    } else current += c;
  }
  parts.push(current);
  return parts;
}

const LEGEND_ROW = 20;
const LEGEND_FONT = 12;
const CHAR_WIDTH = 6.8; // average advance of a 12-unit sans-serif glyph, for laying out columns

/** The legend as SVG markup, laid out in columns below the plot; returns the markup and its height. */
export function legendMarkup(entries: readonly LegendEntry[], width: number, top: number): { markup: string; height: number } {
  if (entries.length === 0) return { markup: "", height: 0 };
  const longest = Math.max(...entries.map((e) => Array.from(e.label).length));
  const itemWidth = 44 + Math.min(longest, 48) * CHAR_WIDTH;
  const columns = Math.max(1, Math.min(4, Math.floor((width - 24) / itemWidth)));
  const parts: string[] = [];
  let row = 0;
  let col = 0;
  for (const entry of entries) {
    if (entry.kind === "heading") {
      if (col > 0) row++;
      col = 0;
      const y = top + row * LEGEND_ROW + 14;
      parts.push(`<text x="12" y="${y}" font-size="${LEGEND_FONT}" font-weight="600">${xmlEscape(entry.label)}</text>`);
      row++;
      continue;
    }
    const x = 12 + col * ((width - 24) / columns);
    const cy = top + row * LEGEND_ROW + 10;
    parts.push(swatchMarkup(entry, x, cy));
    const label = Array.from(entry.label);
    const shown = label.length > 48 ? `${label.slice(0, 47).join("")}…` : entry.label;
    parts.push(`<text x="${x + 36}" y="${cy + 4}" font-size="${LEGEND_FONT}">${xmlEscape(shown)}</text>`);
    col++;
    if (col === columns) {
      col = 0;
      row++;
    }
  }
  if (col > 0) row++;
  return { markup: `<g class="legend">${parts.join("")}</g>`, height: row * LEGEND_ROW + 12 };
}

function swatchMarkup(entry: Exclude<LegendEntry, { kind: "heading" }>, x: number, cy: number): string {
  if (entry.kind === "series") {
    const s = seriesStyle(entry.index);
    const dash = s.dash === "" ? "" : ` stroke-dasharray="${s.dash}"`;
    return (
      `<line x1="${x}" y1="${cy}" x2="${x + 28}" y2="${cy}" stroke="${s.lightColor}" stroke-width="2"${dash}/>` +
      `<path d="${markerPath(s.marker, x + 14, cy, 7)}" fill="${s.lightColor}" stroke="${EXPORT_BACKGROUND}" stroke-width="1"/>`
    );
  }
  const p = pointSymbol(entry.symbol, x + 14, cy, 9);
  const color = entry.index === undefined ? EXPORT_INK : seriesStyle(entry.index).lightColor;
  const fill = p.filled ? color : EXPORT_BACKGROUND;
  const part = p.fillPart === "" ? "" : `<path d="${p.fillPart}" fill="${color}"/>`;
  return `<path d="${p.d}" fill="${fill}" stroke="${color}" stroke-width="1.6"/>${part}`;
}

export interface StandaloneSvgInput {
  /** Serialised <svg> element of the plot, with width and height attributes set. */
  plotSvg: string;
  width: number;
  height: number;
  title: string;
  legend: readonly LegendEntry[];
}

/** Breaks text into lines of at most `maxChars` characters at spaces (a longer word gets its own line). */
export function wrapText(text: string, maxChars: number): string[] {
  const lines: string[] = [];
  let line = "";
  for (const word of text.split(/\s+/).filter((w) => w !== "")) {
    if (line === "") line = word;
    else if (Array.from(line).length + 1 + Array.from(word).length <= maxChars) line = `${line} ${word}`;
    else {
      lines.push(line);
      line = word;
    }
  }
  if (line !== "") lines.push(line);
  return lines.length === 0 ? [""] : lines;
}

const TITLE_FONT = 14;
const TITLE_LINE = 19;

/** A complete SVG document: XML declaration, namespace, background, title, plot and legend. */
export function standaloneSvg({ plotSvg, width, height, title, legend }: StandaloneSvgInput): string {
  // Bold 14-unit glyphs average about 8.2 units: wrap the title to the drawing's width.
  const titleLines = wrapText(title, Math.max(10, Math.floor((width - 24) / 8.2)));
  const titleHeight = 10 + titleLines.length * TITLE_LINE;
  const legendPart = legendMarkup(legend, width, titleHeight + height);
  const total = titleHeight + height + legendPart.height;
  const plot = resolveCssFunctions(plotSvg)
    // The nested element must not carry page classes or a second XML declaration.
    .replace(/^<\?xml[^>]*>\s*/, "")
    .replace(/^<svg\b/, `<svg x="0" y="${titleHeight}"`);
  return (
    `<?xml version="1.0" encoding="UTF-8"?>\n` +
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${total}" viewBox="0 0 ${width} ${total}" ` +
    `color="${EXPORT_INK}" fill="${EXPORT_INK}" font-family="system-ui, -apple-system, 'Segoe UI', Roboto, sans-serif" ` +
    `style="color:${EXPORT_INK};background:${EXPORT_BACKGROUND}">` +
    `<title>${xmlEscape(title)}</title>` +
    `<rect width="100%" height="100%" fill="${EXPORT_BACKGROUND}"/>` +
    `<text font-size="${TITLE_FONT}" font-weight="600">` +
    titleLines.map((l, i) => `<tspan x="12" y="${19 + i * TITLE_LINE}">${xmlEscape(l)}</tspan>`).join("") +
    `</text>` +
    plot +
    legendPart.markup +
    `</svg>\n`
  );
}
