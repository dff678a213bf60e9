/**
 * A readable view of a model spec: the game as a payoff table with every expression evaluated
 * at the parameter values, and the dynamics as a formula in a small markup of our own (text,
 * symbols with subscripts and superscripts) that a component renders as HTML text and that
 * also reads as plain text. Pure: no React, no database.
 */
import { evaluateEntry, PayoffError } from "@/lib/engine/payoffs";
import type { DynamicsSpec, GameSpec, ModelSpec, Parameters, PayoffEntry } from "@/lib/engine/types";

// ---------------------------------------------------------------------------
// Formula markup
// ---------------------------------------------------------------------------

/**
 * Plain text (operators, words), a name taken from the model (rendered exactly as written), or a
 * symbol: `sym` in italics, optional dot above (time derivative), sub- and superscript.
 */
export type FormulaPart = { text: string } | { name: string } | { sym: string; sub?: string; sup?: string; dot?: boolean };
export type Formula = FormulaPart[];

const t = (text: string): FormulaPart => ({ text });
const nm = (name: string): FormulaPart => ({ name });
const s = (sym: string, sub?: string, extra: { sup?: string; dot?: boolean } = {}): FormulaPart => ({ sym, sub, ...extra });

/** Plain-text reading of a formula: "dx_i/dt = x_i (f_i − φ)". */
export function formulaText(f: Formula): string {
  return f
    .map((p) => {
      if ("text" in p) return p.text;
      if ("name" in p) return p.name;
      const base = p.dot ? `d${p.sym}${p.sub ? `_${p.sub}` : ""}/dt` : `${p.sym}${p.sub ? `_${p.sub}` : ""}`;
      return p.sup ? `${base}^${p.sup}` : base;
    })
    .join("");
}

/** Our symbols beyond Latin-1 spelled out, for a reading that is Latin-1 like the page (components/ui/Glyph.tsx). */
const SPOKEN: Record<string, string> = { "φ": "phi", "Σ": "sum", "μ": "mu", "η": "eta", "−": "-", "≠": "not equal to" };

/** The reading of a formula for assistive technology: formulaText with our own symbols spelled out. */
export function formulaReading(f: Formula): string {
  return formulaText(f.map((p) => ("text" in p ? { text: spell(p.text) } : "sym" in p ? { ...p, sym: spell(p.sym) } : p)));
}

function spell(text: string): string {
  return text.replace(/[φΣμη−≠]/gu, (c) => SPOKEN[c] ?? c);
}

export interface DynamicsView {
  kind: string;
  /** A name in words, e.g. "Replicator dynamics". */
  name: string;
  /** The equations, one per line; the first is the law of motion. */
  equations: Formula[];
  /** What the symbols mean, one sentence each. */
  where: Formula[];
  /** The dynamics' own constants with their values. */
  constants: { name: string; symbol: string; value: number }[];
}

const DYNAMICS_NAMES: Record<string, string> = {
  replicator: "Replicator dynamics",
  "replicator-mutator": "Replicator-mutator dynamics",
  logit: "Logit dynamics",
  "brown-von-neumann-nash": "Brown-von Neumann-Nash dynamics",
  smith: "Smith dynamics",
};

/**
 * The law of motion of the spec's dynamics (default replicator), written as in the
 * specification contract; for two populations, each population's shares move by the same law
 * with its payoffs against the other population's state.
 */
export function dynamicsView(dynamics: DynamicsSpec | undefined, game: GameSpec): DynamicsView {
  const d: DynamicsSpec = dynamics ?? { kind: "replicator" };
  const two = game.kind === "bimatrix";
  const where: Formula[] = [];
  if (two) {
    const [p1, p2] = game.populations;
    where.push(
      [
        s("x"), t(" is the state of "), nm(p1.name), t(" and "), s("y"), t(" that of "), nm(p2.name), t("; "),
        s("f", "i"), t(" = (A "), s("y"), t(")"), s("", "i"), t(" is the payoff to strategy "), s("i"), t(" of "), nm(p1.name), t(" against "), s("y"), t(", and "),
        s("g", "j"), t(" = (B "), s("x"), t(")"), s("", "j"), t(" the payoff to strategy "), s("j"), t(" of "), nm(p2.name), t(" against "), s("x"), t("."),
      ],
      [t("The same law moves "), s("y"), t(", with "), s("g"), t(" in place of "), s("f"), t(".")],
    );
  } else {
    where.push([
      s("x", "i"), t(" is the share of strategy "), s("i"), t("; "), s("f", "i"), t(" = (A "), s("x"), t(")"), s("", "i"),
      t(" is its payoff against the population, with A the payoff table above."),
    ]);
  }
  const phi: Formula = [s("φ"), t(" = "), t("Σ"), s("", "j"), t(" "), s("x", "j"), t(" "), s("f", "j")];
  const phiWhere: Formula = [s("φ"), t(" is the population's mean payoff.")];
  const xi = s("x", "i");
  const dxi = s("x", "i", { dot: true });
  switch (d.kind) {
    case "replicator":
      where.push(phiWhere);
      return {
        kind: d.kind,
        name: DYNAMICS_NAMES[d.kind] ?? d.kind,
        equations: [[dxi, t(" = "), xi, t(" ("), s("f", "i"), t(" − "), s("φ"), t(")")], phi],
        where,
        constants: [],
      };
    case "replicator-mutator":
      where.push(phiWhere, [s("q", "ji"), t(" is the probability that an offspring of a "), s("j"), t("-strategist plays "), s("i"), t(".")]);
      return {
        kind: d.kind,
        name: DYNAMICS_NAMES[d.kind] ?? d.kind,
        equations: [
          [dxi, t(" = "), t("Σ"), s("", "j"), t(" "), s("x", "j"), t(" "), s("f", "j"), t(" "), s("q", "ji"), t(" − "), xi, t(" "), s("φ")],
          phi,
          [s("q", "ii"), t(" = 1 − "), s("μ"), t(",  "), s("q", "ji"), t(" = "), s("μ"), t(" / (n − 1) for j ≠ i")],
        ],
        where,
        constants: [{ name: "mutation rate", symbol: "μ", value: d.mutationRate }],
      };
    case "logit":
      return {
        kind: d.kind,
        name: DYNAMICS_NAMES[d.kind] ?? d.kind,
        equations: [
          [dxi, t(" = exp("), s("f", "i"), t(" / "), s("η"), t(") / "), t("Σ"), s("", "j"), t(" exp("), s("f", "j"), t(" / "), s("η"), t(") − "), xi],
        ],
        where,
        constants: [{ name: "noise", symbol: "η", value: d.noise }],
      };
    case "brown-von-neumann-nash":
      where.push(phiWhere, [s("k", "i"), t(" is strategy "), s("i"), t("'s excess payoff over the mean, where positive.")]);
      return {
        kind: d.kind,
        name: DYNAMICS_NAMES[d.kind] ?? d.kind,
        equations: [
          [dxi, t(" = "), s("k", "i"), t(" − "), xi, t(" "), t("Σ"), s("", "j"), t(" "), s("k", "j")],
          [s("k", "i"), t(" = max("), s("f", "i"), t(" − "), s("φ"), t(", 0)")],
          phi,
        ],
        where,
        constants: [],
      };
    case "smith":
      where.push([t("["), s("z"), t("]"), s("", "+"), t(" = max("), s("z"), t(", 0).")]);
      return {
        kind: d.kind,
        name: DYNAMICS_NAMES[d.kind] ?? d.kind,
        equations: [
          [
            dxi,
            t(" = "),
            t("Σ"),
            s("", "j"),
            t(" "),
            s("x", "j"),
            t(" ["),
            s("f", "i"),
            t(" − "),
            s("f", "j"),
            t("]"),
            s("", "+"),
            t(" − "),
            xi,
            t(" "),
            t("Σ"),
            s("", "j"),
            t(" ["),
            s("f", "j"),
            t(" − "),
            s("f", "i"),
            t("]"),
            s("", "+"),
          ],
        ],
        where,
        constants: [],
      };
  }
}

// ---------------------------------------------------------------------------
// Payoff table
// ---------------------------------------------------------------------------

export interface PayoffCell {
  /** The entry as the author wrote it when it is an expression; null for a plain number. */
  expression: string | null;
  /** The evaluated payoff; null when it cannot be evaluated (then `error` says why). */
  value: number | null;
  error?: string;
}

export interface PayoffTableView {
  kind: "symmetric" | "bimatrix";
  /** Whose strategies label the rows and the columns. */
  rowTitle: string;
  columnTitle: string;
  rows: string[];
  columns: string[];
  /**
   * cells[i][j]: symmetric: one payoff, to row strategy i against column strategy j;
   * bimatrix: two payoffs, to the row population's i and to the column population's j.
   */
  cells: PayoffCell[][][];
  /** The parameter values used, sorted by name. */
  parameters: { name: string; value: number }[];
  /** A sentence on how to read the table. */
  reading: string;
}

function cell(entry: PayoffEntry | undefined, path: string, params: Parameters, known: ReadonlySet<string>): PayoffCell {
  if (entry === undefined) return { expression: null, value: null, error: "Missing payoff entry." };
  const expression = typeof entry === "string" ? entry : null;
  try {
    return { expression, value: evaluateEntry(entry, path, params, known) };
  } catch (e) {
    return { expression, value: null, error: e instanceof PayoffError ? e.message : "This entry could not be evaluated." };
  }
}

/**
 * The payoff table with each entry evaluated at the spec's parameters overlaid with
 * `overrides`. Entries that cannot be evaluated are kept with their error, so a reader sees
 * what the author wrote even then.
 */
export function payoffTable(spec: { parameters?: Parameters; game: GameSpec }, overrides?: Parameters): PayoffTableView {
  const params: Parameters = { ...(spec.parameters ?? {}), ...(overrides ?? {}) };
  const known = new Set(Object.keys(params));
  const parameters = [...known].sort().map((name) => ({ name, value: params[name] ?? Number.NaN }));
  const game = spec.game;
  if (game.kind === "symmetric") {
    const n = game.strategies.length;
    return {
      kind: "symmetric",
      rowTitle: "Strategy",
      columnTitle: "Against",
      rows: [...game.strategies],
      columns: [...game.strategies],
      cells: Array.from({ length: n }, (_, i) =>
        Array.from({ length: n }, (_, j) => [cell(game.payoffs[i]?.[j], `/game/payoffs/${i}/${j}`, params, known)]),
      ),
      parameters,
      reading: "Each entry is the payoff to the row's strategy when it meets the column's strategy.",
    };
  }
  const [p1, p2] = game.populations;
  const [P1, P2] = game.payoffs;
  return {
    kind: "bimatrix",
    rowTitle: p1.name,
    columnTitle: p2.name,
    rows: [...p1.strategies],
    columns: [...p2.strategies],
    cells: p1.strategies.map((_, i) =>
      p2.strategies.map((_, j) => [
        cell(P1[i]?.[j], `/game/payoffs/0/${i}/${j}`, params, known),
        cell(P2[j]?.[i], `/game/payoffs/1/${j}/${i}`, params, known),
      ]),
    ),
    parameters,
    reading: `Each entry gives the payoff to ${p1.name} (first) and to ${p2.name} (second) when ${p1.name} plays the row's strategy and ${p2.name} the column's.`,
  };
}

// ---------------------------------------------------------------------------
// Reading a stored spec for display
// ---------------------------------------------------------------------------

const isStringArray = (v: unknown): v is string[] => Array.isArray(v) && v.every((s) => typeof s === "string");
const isMatrix = (v: unknown): v is PayoffEntry[][] =>
  Array.isArray(v) && v.every((row) => Array.isArray(row) && row.every((e) => typeof e === "number" || typeof e === "string"));

/**
 * The parts of a stored spec the public views draw on, when its game has a drawable shape
 * (an invalid version may have none); null otherwise. Not a validation: the engine's report says
 * whether the spec is valid.
 */
export function readableSpec(text: string): { spec: ModelSpec; game: GameSpec } | null {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return null;
  }
  if (typeof value !== "object" || value === null) return null;
  const spec = value as ModelSpec;
  const game: unknown = spec.game;
  if (typeof game !== "object" || game === null) return null;
  const g = game as Record<string, unknown>;
  if (g.kind === "symmetric") {
    if (!isStringArray(g.strategies) || !isMatrix(g.payoffs)) return null;
    return { spec, game: spec.game };
  }
  if (g.kind === "bimatrix") {
    const pops = g.populations;
    const payoffs = g.payoffs;
    if (!Array.isArray(pops) || pops.length !== 2 || !Array.isArray(payoffs) || payoffs.length !== 2) return null;
    const okPops = pops.every(
      (p: unknown) => typeof p === "object" && p !== null && typeof (p as { name?: unknown }).name === "string" && isStringArray((p as { strategies?: unknown }).strategies),
    );
    if (!okPops || !payoffs.every(isMatrix)) return null;
    return { spec, game: spec.game };
  }
  return null;
}
