import { describe, expect, it } from "vitest";
import { DASH_PATTERNS, MARKERS, seriesStyle } from "@/lib/plots/style";
import { markerPath, pointSymbol } from "@/lib/plots/symbols";

describe("seriesStyle", () => {
  it("gives each of 24 series its own dash-and-marker pair, so colour is never the only cue", () => {
    const pairs = new Set(Array.from({ length: 24 }, (_, i) => `${seriesStyle(i).dash}|${seriesStyle(i).marker}`));
    expect(pairs.size).toBe(24);
    expect(new Set(DASH_PATTERNS).size).toBe(DASH_PATTERNS.length);
    expect(new Set(MARKERS).size).toBe(MARKERS.length);
  });
  it("reads the app's palette variable with a light/dark fallback", () => {
    expect(seriesStyle(0).color).toBe("var(--color-series-1, light-dark(#2166ac, #6ea8e8))");
    expect(seriesStyle(12).color.startsWith("var(--color-series-1,")).toBe(true);
    expect(seriesStyle(0).lightColor).toBe("#2166ac");
  });
});

describe("symbols", () => {
  it("draws closed paths for every marker and rest-point symbol", () => {
    for (const m of MARKERS) expect(markerPath(m, 10, 10, 8)).toMatch(/^M.*Z$/);
    expect(pointSymbol("asymptotically-stable", 0, 0, 10).filled).toBe(true);
    expect(pointSymbol("unstable", 0, 0, 10).filled).toBe(false);
    expect(pointSymbol("non-hyperbolic", 0, 0, 10).fillPart).not.toBe("");
    // Distinct shapes, not only distinct fills.
    const shapes = new Set(
      (["asymptotically-stable", "unstable", "non-hyperbolic", "start"] as const).map((k) => pointSymbol(k, 0, 0, 10).d),
    );
    expect(shapes.size).toBe(4);
  });
});
