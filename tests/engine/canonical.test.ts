import { describe, expect, it } from "vitest";
import { canonicalJson, sha256Hex, specSha256 } from "@/lib/engine/canonical";
import { jsonDepth } from "@/lib/engine/json-depth";

describe("canonical JSON and the spec hash (RFC 8785)", () => {
  it("sorts keys, drops whitespace and writes numbers as ECMAScript does (RFC 8785, sect. 3.2)", () => {
    expect(canonicalJson({ b: [1.0, 1e21, 0.000001, -0], a: { d: "é", c: null } })).toBe('{"a":{"c":null,"d":"é"},"b":[1,1e+21,0.000001,0]}');
  });

  it("hashes the canonical text with SHA-256", () => {
    // SHA-256 of the empty string and of "abc" (FIPS 180-2 test vectors)
    expect(sha256Hex("")).toBe("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
    expect(sha256Hex("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    expect(specSha256({ b: 2, a: 1 })).toBe(sha256Hex('{"a":1,"b":2}'));
  });

  it("measures nesting depth without recursion", () => {
    let deep: unknown = 0;
    for (let i = 0; i < 100_000; i++) deep = { x: deep };
    expect(jsonDepth(deep)).toBe(100_000);
    expect(jsonDepth(deep, 64)).toBe(65);
    expect(jsonDepth([1, [2, [3]]])).toBe(3);
    expect(jsonDepth("flat")).toBe(0);
  });

  it("refuses values JSON cannot hold", () => {
    expect(() => canonicalJson(Number.NaN)).toThrow(/NaN is not allowed/);
    expect(() => canonicalJson(undefined)).toThrow(/the value has no JSON form/);
  });
});
