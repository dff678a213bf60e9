import { describe, expect, it } from "vitest";
import {
  canonicalPretty,
  diffSpecs,
  diffText,
  diffVerdicts,
  deviationChanged,
  sameDeviation,
  shownDeviation,
  wordParts,
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
      { kind: "removed", text: "b", oldLine: 2, parts: [{ text: "b", changed: true }] },
      { kind: "added", text: "B", newLine: 2, parts: [{ text: "B", changed: true }] },
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
      {
        kind: "removed",
        text: '      "state": [0.5, 0.5]',
        oldLine: 6,
        parts: [
          { text: '      "state": [0.', changed: false },
          { text: "5", changed: true },
          { text: ", 0.", changed: false },
          { text: "5", changed: true },
          { text: "]", changed: false },
        ],
      },
      {
        kind: "added",
        text: '      "state": [0.4, 0.6]',
        newLine: 6,
        parts: [
          { text: '      "state": [0.', changed: false },
          { text: "4", changed: true },
          { text: ", 0.", changed: false },
          { text: "6", changed: true },
          { text: "]", changed: false },
        ],
      },
    ]);
  });

  it("marks the changed words of a long replaced line, and the parts spell each line exactly", () => {
    const v1 = { ...finchesV1, title: "Patch choice in island finches when the open patch is watched by a kestrel each morning" };
    const v2 = { ...finchesV1, title: "Patch choice in island finches when the open patch is watched by a kestrel each evening" };
    const d = diffSpecs(v1, v2);
    const changed = d.rows.filter((r) => r.kind === "added" || r.kind === "removed");
    expect(changed).toHaveLength(2);
    for (const r of changed) {
      if (r.kind === "skipped") continue;
      expect(r.parts?.map((p) => p.text).join("")).toBe(r.text);
      expect(r.parts?.filter((p) => p.changed).map((p) => p.text)).toEqual([r.kind === "removed" ? "morning" : "evening"]);
    }
  });

  it("leaves unpaired added or removed lines without word parts", () => {
    const d = diffText("a\n", "a\nb\n");
    expect(d.rows).toEqual([
      { kind: "same", text: "a", oldLine: 1, newLine: 1 },
      { kind: "added", text: "b", newLine: 2 },
    ]);
  });
});

describe("wordParts", () => {
  it("keeps every space of both lines", () => {
    const w = wordParts("x  = 1", "x  = 2");
    expect(w.old).toEqual([{ text: "x  = ", changed: false }, { text: "1", changed: true }]);
    expect(w.new).toEqual([{ text: "x  = ", changed: false }, { text: "2", changed: true }]);
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

  it("compares at the precision the compare view shows (two significant digits)", () => {
    expect(shownDeviation(3.3141e-7)).toBe("3.3e-7");
    // Both print as 3.3 × 10⁻⁷: not a change a reader could see.
    expect(sameDeviation(3.3141e-7, 3.2987e-7)).toBe(true);
    expect(sameDeviation(3.3e-7, 3.4e-7)).toBe(false);
    expect(sameDeviation(Number.POSITIVE_INFINITY, Number.POSITIVE_INFINITY)).toBe(true);
  });
});

describe("deviationChanged", () => {
  it("is false when both print alike and stand on the same side of the tolerance", () => {
    expect(deviationChanged({ deviation: 3.3141e-7, tolerance: 1e-6 }, { deviation: 3.2987e-7, tolerance: 1e-6 })).toBe(false);
    expect(deviationChanged({ deviation: 3.3141e-7 }, { deviation: 3.2987e-7 })).toBe(false);
  });

  it("is true when the printed value differs", () => {
    expect(deviationChanged({ deviation: 3.3e-7, tolerance: 1e-6 }, { deviation: 5.1e-7, tolerance: 1e-6 })).toBe(true);
    expect(deviationChanged({}, { deviation: 0 })).toBe(true);
  });

  it("is true when the deviation crosses the tolerance, even if it prints alike", () => {
    // 9.96e-7 and 1.004e-6 both print as 1.0 × 10⁻⁶, but only the first is within 1e-6.
    expect(shownDeviation(9.96e-7)).toBe(shownDeviation(1.004e-6));
    expect(deviationChanged({ deviation: 9.96e-7, tolerance: 1e-6 }, { deviation: 1.004e-6, tolerance: 1e-6 })).toBe(true);
    // A tolerance tightened between versions counts too.
    expect(deviationChanged({ deviation: 3.3e-7, tolerance: 1e-6 }, { deviation: 3.3e-7, tolerance: 1e-7 })).toBe(true);
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

  it("does not call a deviation changed when both columns would read 3.3 × 10⁻⁷", () => {
    const a: ReportLike = { verdict: "confirmed", claims: [{ id: "x", kind: "rest-point", status: "confirmed", deviation: 3.312e-7, tolerance: 1e-6, message: "" }] };
    const b: ReportLike = { verdict: "confirmed", claims: [{ id: "x", kind: "rest-point", status: "confirmed", deviation: 3.287e-7, tolerance: 1e-6, message: "" }] };
    const d = diffVerdicts(a, b);
    expect(d.claims[0]?.change).toBe("unchanged");
    expect(d.counts.changed).toBe(0);
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
