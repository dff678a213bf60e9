/**
 * Differences between two versions of a model: the spec as canonical, pretty-printed JSON
 * compared line by line (with the `diff` package; replaced lines also word by word), and the verdict diff of their reports
 * (claims added, removed, or whose status or deviation changed).
 *
 * Pure functions: no database, no Next.js. The compare page and the diff API both call them.
 */
import { diffLines, diffWordsWithSpace } from "diff";
import type { ClaimResult, ClaimStatus, Verdict } from "@/lib/engine/types";

// ---------------------------------------------------------------------------
// Canonical pretty-printed JSON
// ---------------------------------------------------------------------------

/** Arrays of plain values that fit in this many characters stay on one line (states, payoff rows). */
const INLINE_ARRAY_WIDTH = 72;

/**
 * Object keys sorted by UTF-16 code units (the order RFC 8785 uses), two-space indentation,
 * numbers as ECMAScript prints them (as RFC 8785 does). Short arrays of numbers, strings,
 * booleans or null stay on one line, so a changed share or payoff shows as one changed line.
 * The same value always gives the same text, whatever the key order of the upload.
 */
export function canonicalPretty(value: unknown): string {
  return render(value, "") + "\n";
}

function isPlain(v: unknown): boolean {
  return v === null || typeof v === "number" || typeof v === "string" || typeof v === "boolean";
}

function scalar(v: unknown): string {
  if (typeof v === "number" && !Number.isFinite(v)) return "null"; // as JSON.stringify does
  return JSON.stringify(v);
}

function render(value: unknown, indent: string): string {
  if (isPlain(value)) return scalar(value);
  const inner = indent + "  ";
  if (Array.isArray(value)) {
    if (value.length === 0) return "[]";
    if (value.every(isPlain)) {
      const oneLine = `[${value.map(scalar).join(", ")}]`;
      if (oneLine.length + indent.length <= INLINE_ARRAY_WIDTH) return oneLine;
    }
    return `[\n${value.map((v) => inner + render(v, inner)).join(",\n")}\n${indent}]`;
  }
  if (typeof value === "object" && value !== undefined) {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    if (entries.length === 0) return "{}";
    return `{\n${entries.map(([k, v]) => `${inner}${JSON.stringify(k)}: ${render(v, inner)}`).join(",\n")}\n${indent}}`;
  }
  // undefined, functions, symbols, bigint: not JSON; the spec never holds them after JSON.parse.
  return "null";
}

// ---------------------------------------------------------------------------
// Line diff
// ---------------------------------------------------------------------------

export type LineKind = "same" | "added" | "removed";

/** A stretch of one line's text; `changed` marks words the other side of a pair does not have. */
export interface LinePart {
  text: string;
  changed: boolean;
}

export interface DiffLine {
  kind: LineKind;
  text: string;
  /**
   * For a removed line paired with the added line that replaced it (the nth removed line of a
   * change with its nth added line): the line cut into unchanged and changed words, so a small
   * change in a long line can be seen without reading both lines.
   */
  parts?: LinePart[];
  /** 1-based line in the older text (absent for an added line). */
  oldLine?: number;
  /** 1-based line in the newer text (absent for a removed line). */
  newLine?: number;
}

/** A run of unchanged lines left out of the view, between two shown parts. */
export interface SkippedLines {
  kind: "skipped";
  count: number;
  oldLine: number;
  newLine: number;
}

export type DiffRow = DiffLine | SkippedLines;

export interface SpecDiff {
  rows: DiffRow[];
  added: number;
  removed: number;
  /** True when both texts are the same. */
  identical: boolean;
}

/**
 * Line diff of two texts (the `diff` package's diffLines), with line numbers on both
 * sides; unchanged runs longer than 2 x `context` + 1 lines are folded into one
 * `skipped` row that keeps `context` lines either side of each change.
 */
export function diffText(oldText: string, newText: string, context = 3): SpecDiff {
  const lines: DiffLine[] = [];
  let o = 1;
  let n = 1;
  let added = 0;
  let removed = 0;
  for (const change of diffLines(oldText, newText)) {
    const parts = splitLines(change.value);
    for (const text of parts) {
      if (change.added) {
        lines.push({ kind: "added", text, newLine: n++ });
        added++;
      } else if (change.removed) {
        lines.push({ kind: "removed", text, oldLine: o++ });
        removed++;
      } else {
        lines.push({ kind: "same", text, oldLine: o++, newLine: n++ });
      }
    }
  }
  pairChangedWords(lines);
  return { rows: fold(lines, Math.max(0, context)), added, removed, identical: added === 0 && removed === 0 };
}

/**
 * Word diff (the `diff` package's diffWordsWithSpace, which keeps every space of both texts)
 * of a removed line and the added line that replaced it.
 */
export function wordParts(oldLine: string, newLine: string): { old: LinePart[]; new: LinePart[] } {
  const old: LinePart[] = [];
  const neu: LinePart[] = [];
  for (const c of diffWordsWithSpace(oldLine, newLine)) {
    if (!c.added) old.push({ text: c.value, changed: c.removed });
    if (!c.removed) neu.push({ text: c.value, changed: c.added });
  }
  return { old, new: neu };
}

/** Pairs each run of removed lines with the added lines right after it, position by position. */
function pairChangedWords(lines: DiffLine[]): void {
  let i = 0;
  while (i < lines.length) {
    if (lines[i]?.kind !== "removed") {
      i++;
      continue;
    }
    let r = i;
    while (lines[r]?.kind === "removed") r++;
    let a = r;
    while (lines[a]?.kind === "added") a++;
    const pairs = Math.min(r - i, a - r);
    for (let k = 0; k < pairs; k++) {
      const before = lines[i + k];
      const after = lines[r + k];
      if (before === undefined || after === undefined) continue;
      const w = wordParts(before.text, after.text);
      before.parts = w.old;
      after.parts = w.new;
    }
    i = a;
  }
}

/** The canonical pretty-printed texts of two specs, diffed line by line. */
export function diffSpecs(oldSpec: unknown, newSpec: unknown, context = 3): SpecDiff & { oldText: string; newText: string } {
  const oldText = canonicalPretty(oldSpec);
  const newText = canonicalPretty(newSpec);
  return { ...diffText(oldText, newText, context), oldText, newText };
}

function splitLines(value: string): string[] {
  const parts = value.split("\n");
  // A change's value ends with the newline of its last line: no extra empty line for it.
  if (parts.length > 1 && parts[parts.length - 1] === "") parts.pop();
  return parts;
}

function fold(lines: DiffLine[], context: number): DiffRow[] {
  const rows: DiffRow[] = [];
  let i = 0;
  while (i < lines.length) {
    const line = lines[i];
    if (line === undefined) break;
    if (line.kind !== "same") {
      rows.push(line);
      i++;
      continue;
    }
    let j = i;
    while (j < lines.length && lines[j]?.kind === "same") j++;
    const run = lines.slice(i, j);
    const atStart = i === 0;
    const atEnd = j === lines.length;
    const keepHead = atStart ? 0 : context;
    const keepTail = atEnd ? 0 : context;
    if (run.length > keepHead + keepTail + 1) {
      rows.push(...run.slice(0, keepHead));
      const first = run[keepHead];
      if (first !== undefined) {
        rows.push({
          kind: "skipped",
          count: run.length - keepHead - keepTail,
          oldLine: first.oldLine ?? 0,
          newLine: first.newLine ?? 0,
        });
      }
      rows.push(...run.slice(run.length - keepTail));
    } else {
      rows.push(...run);
    }
    i = j;
  }
  return rows;
}

// ---------------------------------------------------------------------------
// Verdict diff
// ---------------------------------------------------------------------------

/** The parts of a report the verdict diff reads; null when the version has no report yet. */
export interface ReportLike {
  verdict: Verdict;
  claims: Pick<ClaimResult, "id" | "kind" | "status" | "deviation" | "tolerance" | "message">[];
}

export interface ClaimSide {
  kind: string;
  status: ClaimStatus;
  deviation?: number;
  tolerance?: number;
  message: string;
}

export type ClaimChange =
  | { id: string; change: "added"; to: ClaimSide }
  | { id: string; change: "removed"; from: ClaimSide }
  | {
      id: string;
      change: "changed";
      from: ClaimSide;
      to: ClaimSide;
      statusChanged: boolean;
      deviationChanged: boolean;
      kindChanged: boolean;
    }
  | { id: string; change: "unchanged"; from: ClaimSide; to: ClaimSide };

export interface VerdictDiff {
  from: Verdict | null;
  to: Verdict | null;
  verdictChanged: boolean;
  /** Every claim of either report: the newer report's order first, then claims only the older had. */
  claims: ClaimChange[];
  counts: { added: number; removed: number; changed: number; unchanged: number };
}

/**
 * Significant digits a deviation is shown with (the compare view writes it as 3.3 × 10⁻⁷).
 * A deviation only counts as changed when the reader can see the change: two values that
 * print alike at this precision are the same, unless they fall on different sides of the
 * claim's tolerance (then the printed digits may agree, but the claim's standing does not).
 */
export const DEVIATION_DIGITS = 2;

/** The mantissa and exponent a deviation is shown with, as text ("3.3e-7"); non-finite values as themselves. */
export function shownDeviation(d: number): string {
  return Number.isFinite(d) ? d.toExponential(DEVIATION_DIGITS - 1) : String(d);
}

/** Equal as shown: both missing, or both print alike with DEVIATION_DIGITS significant digits (NaN equals NaN). */
export function sameDeviation(a: number | undefined, b: number | undefined): boolean {
  if (a === undefined || b === undefined) return a === b;
  return shownDeviation(a) === shownDeviation(b);
}

/** Whether `deviation` is within `tolerance` (undefined when either is missing). */
function within(deviation: number | undefined, tolerance: number | undefined): boolean | undefined {
  if (deviation === undefined || tolerance === undefined) return undefined;
  return deviation <= tolerance;
}

/**
 * A deviation changed between two runs of a claim when it differs at the shown precision, or
 * when it is within its tolerance on one side and outside on the other.
 */
export function deviationChanged(from: Pick<ClaimSide, "deviation" | "tolerance">, to: Pick<ClaimSide, "deviation" | "tolerance">): boolean {
  if (!sameDeviation(from.deviation, to.deviation)) return true;
  const a = within(from.deviation, from.tolerance);
  const b = within(to.deviation, to.tolerance);
  return a !== undefined && b !== undefined && a !== b;
}

function side(c: ReportLike["claims"][number]): ClaimSide {
  const s: ClaimSide = { kind: c.kind, status: c.status, message: c.message };
  if (c.deviation !== undefined) s.deviation = c.deviation;
  if (c.tolerance !== undefined) s.tolerance = c.tolerance;
  return s;
}

/** Claims matched by id; a report that is missing (not yet verified) counts as having no claims. */
export function diffVerdicts(from: ReportLike | null, to: ReportLike | null): VerdictDiff {
  const before = new Map((from?.claims ?? []).map((c) => [c.id, c]));
  const after = new Map((to?.claims ?? []).map((c) => [c.id, c]));
  const claims: ClaimChange[] = [];
  for (const [id, t] of after) {
    const f = before.get(id);
    if (f === undefined) {
      claims.push({ id, change: "added", to: side(t) });
      continue;
    }
    const statusChanged = f.status !== t.status;
    const devChanged = deviationChanged(f, t);
    const kindChanged = f.kind !== t.kind;
    if (statusChanged || devChanged || kindChanged) {
      claims.push({ id, change: "changed", from: side(f), to: side(t), statusChanged, deviationChanged: devChanged, kindChanged });
    } else {
      claims.push({ id, change: "unchanged", from: side(f), to: side(t) });
    }
  }
  for (const [id, f] of before) {
    if (!after.has(id)) claims.push({ id, change: "removed", from: side(f) });
  }
  const counts = { added: 0, removed: 0, changed: 0, unchanged: 0 };
  for (const c of claims) counts[c.change]++;
  const fromVerdict = from?.verdict ?? null;
  const toVerdict = to?.verdict ?? null;
  return { from: fromVerdict, to: toVerdict, verdictChanged: fromVerdict !== toVerdict, claims, counts };
}
