import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { ExperimentFigures, phasePlotKind } from "@/components/plots/ExperimentFigures";
import { count, simplexRestPoints, spiralRun, squareRestPoints, squareRun, wideRun } from "./fixtures";

const pair = (a: string[], b: string[]) => ({
  kind: "bimatrix" as const,
  populations: [
    { name: "Buyers", strategies: a },
    { name: "Sellers", strategies: b },
  ] as [{ name: string; strategies: string[] }, { name: string; strategies: string[] }],
});

describe("phasePlotKind", () => {
  it("picks the simplex for three strategies and the unit square for 2x2 two-population games", () => {
    expect(phasePlotKind({ kind: "symmetric", strategies: ["A", "B", "C"] })).toBe("simplex");
    expect(phasePlotKind({ kind: "symmetric", strategies: ["A", "B"] })).toBeNull();
    expect(phasePlotKind({ kind: "symmetric", strategies: ["A", "B", "C", "D"] })).toBeNull();
    expect(phasePlotKind(pair(["a", "b"], ["c", "d"]))).toBe("unit-square");
    expect(phasePlotKind(pair(["a", "b"], ["c", "d", "e"]))).toBeNull();
  });
});

describe("ExperimentFigures", () => {
  it("shows the simplex and a time series per run for a 3-strategy game", () => {
    const html = renderToStaticMarkup(
      <ExperimentFigures
        game={{ kind: "symmetric", strategies: ["A", "B", "C"] }}
        experiments={[spiralRun("one", 101), spiralRun("two", 101, 1)]}
        restPoints={simplexRestPoints}
      />,
    );
    expect(count(html, /<figure/)).toBe(3);
    expect(html).toContain("Runs on the simplex of A, B and C</figcaption>");
    expect(html).toContain("Run “one”: shares over time</figcaption>");
    expect(html).toContain("Run “two”: shares over time</figcaption>");
  });

  it("shows only time series for other symmetric games", () => {
    const html = renderToStaticMarkup(
      <ExperimentFigures game={{ kind: "symmetric", strategies: ["A", "B", "C", "D"] }} experiments={[wideRun("w", 50, 4)]} />,
    );
    expect(count(html, /<figure/)).toBe(1);
    expect(html).not.toContain("simplex");
  });

  it("shows the unit square for a 2x2 two-population game and not for a larger one", () => {
    const square = renderToStaticMarkup(
      <ExperimentFigures game={pair(["a", "b"], ["c", "d"])} experiments={[squareRun("s", 50, 0.8, 0.3)]} restPoints={squareRestPoints} />,
    );
    expect(count(square, /<figure/)).toBe(2);
    expect(square).toContain("Runs in the unit square of Buyers and Sellers</figcaption>");
    const wide = renderToStaticMarkup(
      <ExperimentFigures
        game={pair(["a", "b"], ["c", "d", "e"])}
        experiments={[{ id: "w", times: [0, 1], states: [[[1, 0], [0.2, 0.3, 0.5]], [[0.5, 0.5], [0.3, 0.3, 0.4]]] }]}
      />,
    );
    expect(count(wide, /<figure/)).toBe(1);
    expect(wide).not.toContain("unit square");
  });

  it("says in words which runs produced nothing, and why", () => {
    const html = renderToStaticMarkup(
      <ExperimentFigures
        game={{ kind: "symmetric", strategies: ["A", "B"] }}
        experiments={[
          { id: "empty", times: [], states: [], error: "the run exceeded its budget of 2 seconds" },
          { id: "blank", times: [], states: [] },
          { ...wideRun("ok", 20, 2), error: "stopped at t = 50" },
        ]}
      />,
    );
    expect(html).toContain("<li>Run “empty” produced no samples: the run exceeded its budget of 2 seconds</li>");
    expect(html).toContain("<li>Run “blank” produced no samples.</li>");
    expect(html).toContain("<li>This run stopped early: stopped at t = 50</li>");
    expect(count(html, /<figure/)).toBe(1);
  });

  it("says so when there is nothing to plot", () => {
    const html = renderToStaticMarkup(<ExperimentFigures game={{ kind: "symmetric", strategies: ["A", "B"] }} experiments={[]} />);
    expect(html).toBe('<p class="text-sm">This model defines no runs, so there is nothing to plot.</p>');
  });
});
