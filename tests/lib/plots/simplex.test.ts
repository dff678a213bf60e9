import { describe, expect, it } from "vitest";
import { barycentricToPoint, fitTriangle, simplexGrid } from "@/lib/plots/simplex";

describe("fitTriangle", () => {
  it("is equilateral, fits the box and is centred in it", () => {
    const t = fitTriangle(10, 20, 400, 400);
    const [a, b, c] = t.vertices;
    const ab = Math.hypot(b[0] - a[0], b[1] - a[1]);
    const bc = Math.hypot(c[0] - b[0], c[1] - b[1]);
    const ca = Math.hypot(a[0] - c[0], a[1] - c[1]);
    expect(ab).toBeCloseTo(400, 9);
    expect(bc).toBeCloseTo(ab, 9);
    expect(ca).toBeCloseTo(ab, 9);
    expect(a[1]).toBe(b[1]);
    expect(c[0]).toBeCloseTo(210, 9);
    expect(a[1] - c[1]).toBeLessThanOrEqual(400);
    expect(c[1]).toBeGreaterThanOrEqual(20);
  });
  it("is limited by the height in a wide box", () => {
    const t = fitTriangle(0, 0, 1000, 100);
    const [a, , c] = t.vertices;
    expect(a[1] - c[1]).toBeCloseTo(100, 9);
  });
});

describe("barycentricToPoint", () => {
  const t = fitTriangle(0, 0, 300, 300);
  const [v1, v2, v3] = t.vertices;
  it("puts pure states on the vertices and the barycentre on the centroid", () => {
    expect(barycentricToPoint([1, 0, 0], t)).toEqual(v1);
    expect(barycentricToPoint([0, 1, 0], t)).toEqual(v2);
    expect(barycentricToPoint([0, 0, 1], t)).toEqual(v3);
    const centre = barycentricToPoint([1 / 3, 1 / 3, 1 / 3], t);
    expect(centre?.[0]).toBeCloseTo((v1[0] + v2[0] + v3[0]) / 3, 9);
    expect(centre?.[1]).toBeCloseTo((v1[1] + v2[1] + v3[1]) / 3, 9);
  });
  it("puts an edge state on the edge, in proportion", () => {
    const p = barycentricToPoint([0.25, 0.75, 0], t);
    expect(p?.[0]).toBeCloseTo(v1[0] + 0.75 * (v2[0] - v1[0]), 9);
    expect(p?.[1]).toBeCloseTo(v1[1], 9);
  });
  it("normalises, clamps tiny negatives and refuses states it cannot place", () => {
    expect(barycentricToPoint([2, 0, 0], t)).toEqual(v1);
    expect(barycentricToPoint([1, -1e-12, 0], t)).toEqual(v1);
    expect(barycentricToPoint([0.5, 0.5], t)).toBeNull();
    expect(barycentricToPoint([0, 0, 0], t)).toBeNull();
    expect(barycentricToPoint([NaN, 0.5, 0.5], t)).toBeNull();
  });
});

describe("simplexGrid", () => {
  it("has four lines per strategy at steps of 0.2, each joining two edges", () => {
    const t = fitTriangle(0, 0, 300, 300);
    const lines = simplexGrid(t, 0.2);
    expect(lines).toHaveLength(12);
    for (const [a, b] of lines) expect(Math.hypot(b[0] - a[0], b[1] - a[1])).toBeGreaterThan(0);
  });
});
