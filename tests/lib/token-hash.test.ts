import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { hashApiToken, looksLikeApiToken, newApiToken } from "@/lib/token-hash";

describe("API tokens", () => {
  it("are rp_ plus 43 base64url characters, stored as the SHA-256 hex of the whole string", () => {
    const t = newApiToken();
    expect(t.token).toMatch(/^rp_[A-Za-z0-9_-]{43}$/);
    expect(t.tokenHash).toBe(createHash("sha256").update(t.token).digest("hex"));
    expect(t.prefix).toBe(t.token.slice(0, 9));
    expect(looksLikeApiToken(t.token)).toBe(true);
  });
  it("hash to the published SHA-256 of a known string", () => {
    // SHA-256("abc") from FIPS 180-2, appendix B.1.
    expect(hashApiToken("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });
  it("are never equal twice, and other strings are not tokens", () => {
    expect(newApiToken().token).not.toBe(newApiToken().token);
    expect(looksLikeApiToken("rp_short")).toBe(false);
    expect(looksLikeApiToken("gh_" + "a".repeat(40))).toBe(false);
  });
});
