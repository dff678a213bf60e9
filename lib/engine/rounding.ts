/**
 * Rounding of reported numbers. Twelve significant digits sit far above the rounding noise of
 * the computations and far below any tolerance a claim can state, so machines that differ
 * in the last bits still print the same report; negative zero is printed as 0.
 */
import type { Eigenvalue } from "./types";

/** v rounded to 12 significant digits, with -0 written as 0. */
export function round12(v: number): number {
  if (!Number.isFinite(v)) return v;
  const r = Number(v.toPrecision(12));
  return r === 0 ? 0 : r;
}

/** Eigenvalue parts below 1e-12 of the matrix scale are rounding noise of an exact zero. */
export function roundEigenvalues(ev: Eigenvalue[], scale: number): Eigenvalue[] {
  const snap = (v: number): number => (Math.abs(v) <= 1e-12 * scale ? 0 : round12(v));
  return ev.map(([re, im]) => [snap(re), snap(im)]);
}
