/**
 * Number and state formatting for the report view. Pure functions, shared by the server-rendered
 * report and any client component that shows the same values (so both spell them alike).
 */
import type { Eigenvalue, GameSpec, State } from "@/lib/engine/types";

// Signs are the ASCII hyphen-minus, not U+2212: numbers stay copyable as numbers, and the page
// stays Latin-1 (components/ui/Glyph.tsx says why that matters); values are set in a monospace
// face, where the hyphen is as wide as a digit.

export interface Scientific {
  mantissa: string;
  exponent: number;
}

/**
 * Splits a finite number into a mantissa with `digits` significant digits and a power of ten,
 * e.g. 0.000032 -> {mantissa: "3.2", exponent: -5}. Zero gives exponent 0.
 */
export function toScientific(value: number, digits = 2): Scientific {
  if (value === 0) return { mantissa: "0", exponent: 0 };
  const [m = "0", e = "0"] = value.toExponential(Math.max(digits - 1, 0)).split("e");
  // Trailing zeros of the mantissa carry no information here ("3.0" -> "3").
  const trimmed = m.includes(".") ? m.replace(/\.?0+$/, "") : m;
  return { mantissa: trimmed, exponent: Number(e) };
}

/** Plain-text scientific notation, e.g. "3.2e-5" (for titles, mail and CSV where markup is unavailable). */
export function scientificText(value: number, digits = 2): string {
  if (!Number.isFinite(value)) return String(value);
  const { mantissa, exponent } = toScientific(value, digits);
  return exponent === 0 ? mantissa : `${mantissa}e${exponent}`;
}

/**
 * A real number for a table cell: four significant digits, trailing zeros dropped, values too
 * small to matter beside the others written as 0 (the engine's own rest points carry roundoff
 * of order 1e-15 in coordinates that are exactly 0).
 */
export function formatNumber(value: number, digits = 4, zeroBelow = 1e-10): string {
  if (!Number.isFinite(value)) return String(value);
  if (Math.abs(value) < zeroBelow) return "0";
  const abs = Math.abs(value);
  if (abs >= 1e6 || abs < 1e-4) return scientificText(value, digits);
  return Number(value.toPrecision(digits)).toString();
}

/**
 * Eigenvalues in the form a ± b i: a complex-conjugate pair is written once, real ones alone.
 * The order of the input is kept (first occurrence of each pair).
 */
export function formatEigenvalues(eigenvalues: readonly Eigenvalue[], digits = 4): string[] {
  const used = new Array<boolean>(eigenvalues.length).fill(false);
  const out: string[] = [];
  const scale = Math.max(1, ...eigenvalues.map(([re, im]) => Math.hypot(re, im)));
  const tiny = 1e-10 * scale;
  eigenvalues.forEach(([re, im], i) => {
    if (used[i]) return;
    used[i] = true;
    if (Math.abs(im) <= tiny) {
      out.push(formatNumber(re, digits, tiny));
      return;
    }
    // Pair with the first unused conjugate, if any, so "a ± b i" stands for both.
    const j = eigenvalues.findIndex(
      ([re2, im2], k) => !used[k] && Math.abs(re2 - re) <= tiny && Math.abs(im2 + im) <= tiny,
    );
    const reText = formatNumber(re, digits, tiny);
    const imText = formatNumber(Math.abs(im), digits, tiny);
    if (j >= 0) {
      used[j] = true;
      out.push(`${reText} ± ${imText}i`);
    } else {
      out.push(`${reText} ${im < 0 ? "-" : "+"} ${imText}i`);
    }
  });
  return out;
}

/** Names of the coordinates of a state, in state order: one list per population. */
export function stateLabels(game: GameSpec | undefined, state: State): string[][] {
  if (game?.kind === "bimatrix") {
    return [game.populations[0].strategies, game.populations[1].strategies];
  }
  if (game?.kind === "symmetric") return [game.strategies];
  // Without the game, number the coordinates.
  if (isBimatrixState(state)) {
    return state.map((pop) => pop.map((_, i) => `s${i + 1}`));
  }
  return [state.map((_, i) => `s${i + 1}`)];
}

export function isBimatrixState(state: State): state is [number[], number[]] {
  return Array.isArray(state[0]);
}

/** A state as text, e.g. "(0.5, 0.25, 0.25)" or "x = (1, 0), y = (0.4, 0.6)". */
export function formatState(state: State, digits = 4): string {
  const tuple = (xs: readonly number[]) => `(${xs.map((x) => formatNumber(x, digits)).join(", ")})`;
  if (isBimatrixState(state)) return `x = ${tuple(state[0])}, y = ${tuple(state[1])}`;
  return tuple(state);
}

/** "rest-point-count" -> "Rest point count"; unknown kinds are shown as written. */
export const CLAIM_KIND_LABELS: Record<string, string> = {
  "rest-point": "Rest point",
  "nash-equilibrium": "Nash equilibrium",
  ess: "ESS",
  "rest-point-count": "Number of rest points",
  "final-state": "Final state",
  trajectory: "Trajectory",
  "fixation-probability": "Fixation probability",
};

export function claimKindLabel(kind: string): string {
  return CLAIM_KIND_LABELS[kind] ?? kind;
}

export const STABILITY_LABELS: Record<string, string> = {
  "asymptotically-stable": "asymptotically stable",
  unstable: "unstable",
  "non-hyperbolic": "non-hyperbolic",
};

/** A JSON pointer for display: the root ("") is named, not left blank. */
export function pointerText(path: string): string {
  return path === "" ? "(whole document)" : path;
}
