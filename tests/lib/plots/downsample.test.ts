import { describe, expect, it } from "vitest";
import { minMaxIndices, pointsAttribute, simplifyPath, type Point } from "@/lib/plots/downsample";

function segmentDistance(p: Point, a: Point, b: Point): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2));
  return Math.hypot(p[0] - (a[0] + t * dx), p[1] - (a[1] + t * dy));
}

describe("minMaxIndices", () => {
  const n = 10001;
  const xs = Array.from({ length: n }, (_, i) => i / 100);
  const ys = xs.map((x) => Math.sin(x * 3) + 0.1 * Math.sin(x * 97));

  it("keeps at most four samples per pixel column, in order, with both ends", () => {
    const kept = minMaxIndices(xs, ys, 500);
    expect(kept.length).toBeLessThanOrEqual(4 * 500);
    expect(kept.length).toBeGreaterThan(500);
    expect(kept[0]).toBe(0);
    expect(kept[kept.length - 1]).toBe(n - 1);
    for (let i = 1; i < kept.length; i++) expect((kept[i] ?? 0) > (kept[i - 1] ?? 0)).toBe(true);
  });

  it("keeps each column's extremes, so the drawn envelope equals the full series'", () => {
    const kept = new Set(minMaxIndices(xs, ys, 500));
    let argMax = 0;
    let argMin = 0;
    ys.forEach((y, i) => {
      if (y > (ys[argMax] ?? 0)) argMax = i;
      if (y < (ys[argMin] ?? 0)) argMin = i;
    });
    expect(kept.has(argMax)).toBe(true);
    expect(kept.has(argMin)).toBe(true);
  });

  it("keeps every finite sample of a short series and skips non-finite ones", () => {
    expect(minMaxIndices([0, 1, 2, 3], [0.1, NaN, 0.3, 0.4], 100)).toEqual([0, 2, 3]);
    expect(minMaxIndices([], [], 100)).toEqual([]);
  });
});

describe("simplifyPath (radial pass + Ramer-Douglas-Peucker)", () => {
  it("reduces a straight line to its two ends", () => {
    const line: Point[] = Array.from({ length: 1000 }, (_, i) => [i, 2 * i]);
    expect(simplifyPath(line, 0.5)).toEqual([
      [0, 0],
      [999, 1998],
    ]);
  });

  it("drops no point farther than the tolerance from the drawn path, on a 10001-point spiral", () => {
    const spiral: Point[] = Array.from({ length: 10001 }, (_, i) => {
      const t = i / 200;
      const r = 200 * Math.exp(-t / 10);
      return [250 + r * Math.cos(t), 250 + r * Math.sin(t)];
    });
    const tolerance = 0.3;
    const kept = simplifyPath(spiral, tolerance);
    expect(kept.length).toBeLessThan(spiral.length / 5);
    expect(kept[0]).toEqual(spiral[0]);
    expect(kept[kept.length - 1]).toEqual(spiral[spiral.length - 1]);
    // Each original point lies within 2x tolerance of the kept polyline (radial pass + RDP each
    // add at most one tolerance).
    let worst = 0;
    for (const p of spiral) {
      let best = Infinity;
      for (let i = 1; i < kept.length; i++) {
        const a = kept[i - 1];
        const b = kept[i];
        if (a !== undefined && b !== undefined) best = Math.min(best, segmentDistance(p, a, b));
      }
      worst = Math.max(worst, best);
    }
    expect(worst).toBeLessThanOrEqual(2 * tolerance);
  });

  it("drops non-finite points and leaves short paths alone", () => {
    expect(
      simplifyPath(
        [
          [0, 0],
          [NaN, 1],
          [1, 1],
        ],
        0.5,
      ),
    ).toEqual([
      [0, 0],
      [1, 1],
    ]);
  });
});

describe("pointsAttribute", () => {
  it("rounds to tenths and trims trailing zeros and -0", () => {
    expect(
      pointsAttribute([
        [1, 2.04],
        [3.25, -0.01],
      ]),
    ).toBe("1,2 3.3,0");
  });
});
