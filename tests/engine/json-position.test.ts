import { describe, expect, it } from "vitest";
import { jsonErrorOffset, lineAndColumn } from "@/lib/engine/json-position";
import { verifySpecText } from "@/lib/engine/verify";

describe("jsonErrorOffset", () => {
  it("accepts exactly what JSON.parse accepts on a corpus of valid and broken texts", () => {
    const corpus = [
      '{"a": [1, 2.5e-3, -0, true, false, null, "x\\u00e9\\n"]}',
      "[]",
      "{}",
      ' \n 3 ',
      '"s"',
      "[1,]",
      '{"a" 1}',
      '{"a": 1,}',
      "[01]",
      "[1.]",
      "[.5]",
      '["\\x"]',
      '["\t"]',
      "[1] [2]",
      "tru",
      "{'a': 1}",
      "[1, 2",
      '{"a": NaN}',
      "[-]",
      '["\\u12"]',
    ];
    for (const t of corpus) {
      let valid = true;
      try {
        JSON.parse(t);
      } catch {
        valid = false;
      }
      expect(jsonErrorOffset(t) === -1, t).toBe(valid);
    }
  });

  it("points at the first offending character", () => {
    expect(jsonErrorOffset('{"a": 1,}')).toBe(8);
    expect(jsonErrorOffset("[1] [2]")).toBe(4);
    expect(jsonErrorOffset("[1, 2")).toBe(5);
    expect(lineAndColumn('{\n  "a": x', 9)).toEqual({ line: 2, column: 8 });
  });

  it("handles deep nesting without recursion", () => {
    expect(jsonErrorOffset("[".repeat(200_000) + "]".repeat(200_000))).toBe(-1);
  });

  it("gives the report a sentence for text that ends too early", () => {
    const r = verifySpecText('{"format": "restpoint/model@1"');
    expect(r.errors).toEqual([{ path: "", message: "The file is not valid JSON (the text ends too early).", line: 1 }]);
  });
});
