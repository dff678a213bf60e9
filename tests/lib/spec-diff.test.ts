import { describe, expect, it } from "vitest";
import {
  canonicalPretty,
  diffSpecs,
  diffText,
  diffVerdicts,
  sameDeviation,
  type ReportLike,
} from "@/lib/spec-diff";

// A fictional scenario of our own: foraging finches choosing between two seed patches.
const finchesV1 = {
  format: "restpoint/model@1",
  title: "Patch choice in island finches",
  parameters: { b: 3, c: 1 },
  game: {
    kind: "symmetric",
    strategies: ["Stay", "Roam"],
    payoffs: [
      ["b - c", "b"],
      [0, "b / 2"],
    ],
  },
  claims: [{ id: "mixed", kind: "rest-point", state: [0.5, 0.5] }],
};

describe("canonicalPretty", () => {
  it("sorts keys by code unit, whatever the order of the input", () => {
    const a = canonicalPretty({ b: 1, a: { z: 1, y: 2 }, B: 0 });
    const b = canonicalPretty({ a: { y: 2, z: 1 }, B: 0, b: 1 });
    expect(a).toBe(b);
    // Upper case sorts before lower case in UTF-16 order (RFC 8785 section 3.2.3).
    expect(a).toBe('{\n  "B": 0,\n  "a": {\n    "y": 2,\n    "z": 1\n  },\n  "b": 1\n}\n');
  });

  it("keeps short arrays of plain values on one line and breaks long or nested ones", () => {
    const text = canonicalPretty({ s: [0.25, 0.75], rows: [[1, 2], [3, 4]], long: Array.from({ length: 40 }, (_, i) => i) });
    expect(text).toContain('"s": [0.25, 0.75]');
    expect(text).toContain('"rows": [\n    [1, 2],\n    [3, 4]\n  ]');
    expect(text).toContain('"long": [\n    0,\n    1,');
  });

  it("prints numbers as ECMAScript does and empty containers compactly", () => {
    expect(canonicalPretty({ x: 1e-7, y: 1.5e21, e: [], o: {} })).toBe(
      '{\n  "e": [],\n  "o": {},\n  "x": 1e-7,\n  "y": 1.5e+21\n}\n',
    );
  });

  it("escapes strings as JSON does", () => {
    expect(canonicalPretty({ t: 'a "quoted"\nline' })).toBe('{\n  "t": "a \\"quoted\\"\\nline"\n}\n');
  });
});

describe("diffText", () => {
  it("numbers lines on both sides and counts additions and removals", () => {
    const d = diffText("a\nb\nc\n", "a\nB\nc\nd\n");
    expect(d.identical).toBe(false);
    expect(d.added).toBe(2);
    expect(d.removed).toBe(1);
    expect(d.rows).toEqual([
      { kind: "same", text: "a", oldLine: 1, newLine: 1 },
      { kind: "removed", text: "b", oldLine: 2 },
      { kind: "added", text: "B", newLine: 2 },
      { kind: "same", text: "c", oldLine: 3, newLine: 3 },
      { kind: "added", text: "d", newLine: 4 },
    ]);
  });

  it("folds long unchanged runs into a skipped row, keeping context around the change", () => {
    const old = Array.from({ length: 20 }, (_, i) => `line ${i + 1}`).join("\n") + "\n";
    const neu = old.replace("line 10\n", "line ten\n");
    const d = diffText(old, neu, 2);
    const kinds = d.rows.map((r) => r.kind);
    expect(kinds).toEqual(["skipped", "same", "same", "removed", "added", "same", "same", "skipped"]);
    expect(d.rows[0]).toEqual({ kind: "skipped", count: 7, oldLine: 1, newLine: 1 });
    expect(d.rows[7]).toEqual({ kind: "skipped", count: 8, oldLine: 13, newLine: 13 });
  });

  it("says when two texts are identical", () => {
    const d = diffText("x\ny\n", "x\ny\n");
    expect(d.identical).toBe(true);
    expect(d.added + d.removed).toBe(0);
  });
});

describe("diffSpecs", () => {
  it("shows a changed share as one removed and one added line, ignoring key order", () => {
    const v2 = structuredClone(finchesV1);
    v2.claims = [{ id: "mixed", kind: "rest-point", state: [0.4, 0.6] }];
    // Same content as v1 with keys in another order: no difference at all.
    const reordered = { claims: finchesV1.claims, game: finchesV1.game, title: finchesV1.title, parameters: { c: 1, b: 3 }, format: finchesV1.format };
    expect(diffSpecs(finchesV1, reordered).identical).toBe(true);

    const d = diffSpecs(finchesV1, v2);
    const changed = d.rows.filter((r) => r.kind === "added" || r.kind === "removed");
    expect(changed).toEqual([
      { kind: "removed", text: '      "state": [0.5, 0.5]', oldLine: 6 },
      { kind: "added", text: '      "state": [0.4, 0.6]', newLine: 6 },
    ]);
  });
});

describe("sameDeviation", () => {
  it("treats last-digit noise as equal and real changes as different", () => {
    expect(sameDeviation(1e-9, 1e-9 + 1e-24)).toBe(true);
    expect(sameDeviation(1e-9, 2e-9)).toBe(false);
    expect(sameDeviation(1234.5, 1234.5 * (1 + 1e-14))).toBe(true);
    expect(sameDeviation(undefined, undefined)).toBe(true);
    expect(sameDeviation(undefined, 0)).toBe(false);
    expect(sameDeviation(Number.NaN, Number.NaN)).toBe(true);
  });
});

describe("diffVerdicts", () => {
  const before: ReportLike = {
    verdict: "contradicted",
    claims: [
      { id: "mixed", kind: "rest-point", status: "contradicted", deviation: 0.1, message: "no rest point near" },
      { id: "stay-ess", kind: "ess", status: "confirmed", message: "is an ESS" },
      { id: "count", kind: "rest-point-count", status: "confirmed", message: "3 rest points" },
    ],
  };
  const after: ReportLike = {
    verdict: "confirmed",
    claims: [
      { id: "mixed", kind: "rest-point", status: "confirmed", deviation: 2e-12, message: "rest point found" },
      { id: "stay-ess", kind: "ess", status: "confirmed", message: "is an ESS" },
      { id: "roam-final", kind: "final-state", status: "confirmed", deviation: 1e-6, message: "within tolerance" },
    ],
  };

  it("lists added, removed, changed and unchanged claims by id", () => {
    const d = diffVerdicts(before, after);
    expect(d.from).toBe("contradicted");
    expect(d.to).toBe("confirmed");
    expect(d.verdictChanged).toBe(true);
    expect(d.counts).toEqual({ added: 1, removed: 1, changed: 1, unchanged: 1 });
    expect(d.claims.map((c) => [c.id, c.change])).toEqual([
      ["mixed", "changed"],
      ["stay-ess", "unchanged"],
      ["roam-final", "added"],
      ["count", "removed"],
    ]);
    const mixed = d.claims[0];
    expect(mixed?.change === "changed" && mixed.statusChanged && mixed.deviationChanged && !mixed.kindChanged).toBe(true);
  });

  it("flags a deviation change even when the status stays", () => {
    const a: ReportLike = { verdict: "confirmed", claims: [{ id: "x", kind: "final-state", status: "confirmed", deviation: 1e-6, message: "" }] };
    const b: ReportLike = { verdict: "confirmed", claims: [{ id: "x", kind: "final-state", status: "confirmed", deviation: 3e-5, message: "" }] };
    const d = diffVerdicts(a, b);
    expect(d.verdictChanged).toBe(false);
    const x = d.claims[0];
    expect(x?.change).toBe("changed");
    expect(x?.change === "changed" && !x.statusChanged && x.deviationChanged).toBe(true);
  });

  it("treats a version without a report as one without claims", () => {
    const d = diffVerdicts(null, after);
    expect(d.from).toBeNull();
    expect(d.counts.added).toBe(3);
    const e = diffVerdicts(before, null);
    expect(e.to).toBeNull();
    expect(e.counts.removed).toBe(3);
  });
});
