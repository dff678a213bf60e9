/**
 * The spec's fingerprint: SHA-256 (hex) of its RFC 8785 (JCS) canonical JSON, so that
 * whitespace, key order and number spelling do not change it. This is the engine's only
 * Node import (node:crypto); the engine runs on the server and in the worker.
 */
import { createHash } from "node:crypto";
import canonicalize from "canonicalize";

/** SHA-256 of text (as UTF-8) or bytes, as lower-case hex. */
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
