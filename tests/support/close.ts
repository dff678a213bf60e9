/**
 * Relative-tolerance comparison for numerical tests: |a - b| <= rtol * max(|a|, |b|) + atol.
 * Fails with both values and the allowed difference in the message.
 */
import { expect } from "vitest";

export function expectClose(actual: number, expected: number, rtol = 1e-9, atol = 1e-12, label = ""): void {
  const allowed = rtol * Math.max(Math.abs(actual), Math.abs(expected)) + atol;
  const diff = Math.abs(actual - expected);
  if (!(diff <= allowed)) {
    expect.fail(`${label ? `${label}: ` : ""}${actual} differs from ${expected} by ${diff} (allowed ${allowed})`);
  }
}

/** Element-wise expectClose for arrays of equal length. */
export function expectAllClose(actual: ArrayLike<number>, expected: ArrayLike<number>, rtol = 1e-9, atol = 1e-12, label = ""): void {
  expect(actual.length, `${label} length`).toBe(expected.length);
  for (let i = 0; i < expected.length; i++) expectClose(actual[i] ?? Number.NaN, expected[i] ?? Number.NaN, rtol, atol, `${label}[${i}]`);
}

/** Deterministic uniform [0, 1) generator (mulberry32), for reproducible random tests. */
export function seededRandom(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
