import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { TimeSeriesPlot } from "@/components/plots/TimeSeriesPlot";
import { TIME_SERIES_WIDTH } from "@/components/plots/TimeSeriesPlot";
import { count, headers, HOSTILE, polylineSizes, spiralRun, squareRun, wideRun } from "./fixtures";

const symmetric = { kind: "symmetric" as const, strategies: [HOSTILE, "Hoarder", "Scrounger"] };
const bimatrix = {
  kind: "bimatrix" as const,
  populations: [
    { name: "Buyers", strategies: ["Inspect", "Trust"] },
    { name: "Sellers", strategies: ["Honest", "Cheat"] },
  ] as [{ name: string; strategies: string[] }, { name: string; strategies: string[] }],
};

/** Like toContain, without printing a megabyte of markup on failure. */
function expectContains(markup: string, part: string): void {
  expect(markup.includes(part), `markup should contain ${part}`).toBe(true);
}

describe("TimeSeriesPlot", () => {
  const html = renderToStaticMarkup(<TimeSeriesPlot game={symmetric} experiment={spiralRun("calm-start", 201)} />);

  it("is a figure with a caption and an SVG image with a summary", () => {
    expect(html.startsWith("<figure")).toBe(true);
    expect(html).toContain("<figcaption");
    expect(html).toContain("Run “calm-start”: shares over time</figcaption>");
    expect(html).toMatch(/<svg data-plot-svg="" role="img" aria-label="Line chart of the shares of 3 strategies over time in run “calm-start”, from t = 0 to t = 40 \(201 samples\)\. Final shares: /);
    expect(count(html, /<svg data-plot-svg/)).toBe(1);
  });

  it("draws one line per strategy, with markers and a legend naming each", () => {
    expect(polylineSizes(html)).toHaveLength(3);
    expect(count(html, /data-series="/)).toBe(3);
    expect(html).toContain("<span class=\"break-words\">Hoarder</span>");
    expect(html).toContain("<span class=\"break-words\">Scrounger</span>");
  });

  it("draws axes with ticks and labels", () => {
    for (const t of ["0.0", "0.2", "0.4", "0.6", "0.8", "1.0"]) expect(html).toContain(`>${t}</text>`);
    expect(html).toContain(">Time</text>");
    expect(html).toContain(">Share</text>");
  });

  it("escapes a hostile strategy name everywhere", () => {
    expect(html).not.toContain("<script>");
    expect(html).toContain("&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;");
  });

  it("has a data table with a header per strategy and the downloads", () => {
    expect(headers(html)).toEqual(["Time", "&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;", "Hoarder", "Scrounger"]);
    expect(html).toContain("<details");
    expect(html).toContain("Data table (201 rows)");
    expect(html).toContain(">Download SVG</button>");
    expect(html).toContain(">Download CSV</button>");
    expect(count(html, /<tbody>/)).toBe(1);
    expect(count(html, /<tr class="border-b border-current\/10">/)).toBe(100);
    expect(html).toContain("Page 1 of 3");
  });

  it("draws one panel per population for a two-population game", () => {
    const two = renderToStaticMarkup(<TimeSeriesPlot game={bimatrix} experiment={squareRun("loop", 51, 0.9, 0.2)} />);
    expect(polylineSizes(two)).toHaveLength(4);
    expect(two).toContain('font-weight="600">Buyers</text>');
    expect(two).toContain('font-weight="600">Sellers</text>');
    expect(headers(two)).toEqual(["Time", "Buyers: Inspect", "Buyers: Trust", "Sellers: Honest", "Sellers: Cheat"]);
    expect(two).toContain("Final shares in Buyers: ");
    expect(two).toContain("; in Sellers: ");
    // One table page only: no page navigation.
    expect(two).not.toContain("Page 1 of");
  });

  it("says in words when the run stopped early", () => {
    const run = { ...spiralRun("short", 20), error: "the run used up its time budget at t = 7.5" };
    const out = renderToStaticMarkup(<TimeSeriesPlot game={symmetric} experiment={run} />);
    expect(out).toContain("<li>This run stopped early: the run used up its time budget at t = 7.5</li>");
  });

  it("renders a run without samples as empty axes that say so", () => {
    const out = renderToStaticMarkup(<TimeSeriesPlot game={symmetric} experiment={{ id: "none", times: [], states: [] }} />);
    expect(out).toContain("with no samples.");
    expect(polylineSizes(out)).toEqual([0, 0, 0]);
    expect(out).toContain("Data table (0 rows)");
  });

  it("thins 10001 samples x 24 strategies to a few points per pixel while the table keeps all rows", () => {
    const strategies = Array.from({ length: 24 }, (_, i) => `Morph ${i + 1}`);
    const started = performance.now();
    const big = renderToStaticMarkup(
      <TimeSeriesPlot game={{ kind: "symmetric", strategies }} experiment={wideRun("long-run", 10001, 24)} />,
    );
    const elapsed = performance.now() - started;
    const sizes = polylineSizes(big);
    expect(sizes).toHaveLength(24);
    for (const s of sizes) expect(s).toBeLessThanOrEqual(4 * TIME_SERIES_WIDTH);
    expectContains(big, "Data table (10001 rows)");
    expectContains(big, "Page 1 of 101");
    expect(headers(big)).toHaveLength(25);
    expectContains(big, "and 18 more.");
    // Generous bound: a render of this size takes about a tenth of a second here.
    expect(elapsed).toBeLessThan(5000);
  });
});
