/**
 * Personal API tokens: "rp_" followed by 32 random bytes in base64url. Only the SHA-256 hex of
 * the whole token string is stored (api_token.token_hash); the first characters are kept as
 * `prefix` so a user can tell tokens apart. Shared by lib/authz.ts (look-up) and
 * lib/api-tokens.ts (creation).
 */
import { createHash, randomBytes } from "node:crypto";

export const API_TOKEN_PREFIX = "rp_";

/** SHA-256 of the full token string, lower-case hex. */
export function hashApiToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

/** A fresh token, its hash for storage and the short prefix shown in lists. */
export function newApiToken(): { token: string; tokenHash: string; prefix: string } {
  const token = API_TOKEN_PREFIX + randomBytes(32).toString("base64url");
  return { token, tokenHash: hashApiToken(token), prefix: token.slice(0, API_TOKEN_PREFIX.length + 6) };
}

/** Cheap shape check before any database look-up. */
export function looksLikeApiToken(value: string): boolean {
  return /^rp_[A-Za-z0-9_-]{20,}$/.test(value);
}
