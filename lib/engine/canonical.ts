/**
 * The spec's fingerprint: SHA-256 (hex) of its RFC 8785 (JCS) canonical JSON, so that
 * whitespace, key order and number spelling do not change it. This is the engine's only
 * Node import (node:crypto); the engine runs on the server and in the worker.
 */
import { createHash } from "node:crypto";
import canonicalize from "canonicalize";

/** Inputs nested deeper than this are refused by validation; canonicalisation recurses, so it is not attempted on them. */
export const MAX_DEPTH = 64;

export function sha256Hex(data: string | Uint8Array): string {
  return createHash("sha256").update(data).digest("hex");
}

/** RFC 8785 canonical JSON text of a JSON value (throws on NaN, Infinity or values JSON cannot hold). */
export function canonicalJson(value: unknown): string {
  const text = canonicalize(value);
  if (text === undefined) throw new TypeError("the value has no JSON form");
  return text;
}

/** sha-256 hex of the canonical JSON of `value`. */
export function specSha256(value: unknown): string {
  return sha256Hex(canonicalJson(value));
}

/** Nesting depth of a JSON value, computed without recursion (so hostile depth cannot overflow the stack). */
export function jsonDepth(value: unknown, limit = Infinity): number {
  let max = 0;
  const stack: [unknown, number][] = [[value, 1]];
  while (stack.length > 0) {
    const top = stack.pop();
    if (top === undefined) break;
    const [v, d] = top;
    if (v === null || typeof v !== "object") continue;
    if (d > max) max = d;
    if (max > limit) return max;
    const children = Array.isArray(v) ? v : Object.values(v as Record<string, unknown>);
    for (const c of children) if (c !== null && typeof c === "object") stack.push([c, d + 1]);
  }
  return max;
}
