import { describe, expect, it } from "vitest";
import { lineAndColumnAt, lineOfPointer, pointerLines } from "@/lib/json-lines";

const text = `{
  "format": "restpoint/model@1",
  "title": "Two \\"quoted\\" words",
  "a/b": { "c~d": 1 },
  "game": {
    "strategies": ["x",
      "y"],
    "payoffs": [[1, 2], [3,
      4]]
  },
  "claims": [
    {
      "id": "c1",
      "state": [0.5, 0.5]
    },
    { "id": "c2" }
  ],
  "empty": {},
  "none": []
}`;

describe("JSON pointer to line", () => {
  const lines = pointerLines(text);

  it("gives the line of each member's key and each array element", () => {
    expect(lines.get("")).toBe(1);
    expect(lines.get("/format")).toBe(2);
    expect(lines.get("/title")).toBe(3);
    expect(lines.get("/game")).toBe(5);
    expect(lines.get("/game/strategies/0")).toBe(6);
    expect(lines.get("/game/strategies/1")).toBe(7);
    expect(lines.get("/game/payoffs/1/0")).toBe(8);
    expect(lines.get("/game/payoffs/1/1")).toBe(9);
    expect(lines.get("/claims/0")).toBe(12);
    expect(lines.get("/claims/0/state/1")).toBe(14);
    expect(lines.get("/claims/1/id")).toBe(16);
    expect(lines.get("/empty")).toBe(18);
    expect(lines.get("/none")).toBe(19);
  });

  it("escapes ~ and / in keys as RFC 6901 says", () => {
    expect(lines.get("/a~1b")).toBe(4);
    expect(lines.get("/a~1b/c~0d")).toBe(4);
  });

  it("falls back to the nearest ancestor for a member that is missing", () => {
    expect(lineOfPointer(lines, "/claims/1/state")).toBe(16);
    expect(lineOfPointer(lines, "/claims/7/x")).toBe(11);
    expect(lineOfPointer(lines, "/nothing")).toBe(1);
    expect(lineOfPointer(new Map(), "/x")).toBeUndefined();
  });

  it("keeps the last of duplicate keys, like JSON.parse", () => {
    expect(pointerLines('{"a": 1,\n"a": 2}').get("/a")).toBe(2);
  });

  it("stops walking past 200 levels instead of recursing without end", () => {
    const deep = "[".repeat(5000) + "]".repeat(5000);
    const m = pointerLines(deep);
    expect(m.size).toBe(201);
  });

  it("turns a character offset into line and column", () => {
    expect(lineAndColumnAt("ab\ncd\nef", 0)).toEqual({ line: 1, column: 1 });
    expect(lineAndColumnAt("ab\ncd\nef", 4)).toEqual({ line: 2, column: 2 });
    expect(lineAndColumnAt("ab\ncd\nef", 6)).toEqual({ line: 3, column: 1 });
  });
});
