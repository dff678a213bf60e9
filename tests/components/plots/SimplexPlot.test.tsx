import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { SimplexPlot } from "@/components/plots/SimplexPlot";
import { count, headers, HOSTILE, polylineSizes, simplexRestPoints, spiralRun } from "./fixtures";

describe("SimplexPlot", () => {
  const runs = [spiralRun("near-centre", 2001, 0, 0.3), { ...spiralRun("cut-short", 300, 2, 0.25), error: "the run left the state space at t = 12" }];
  const html = renderToStaticMarkup(
    <SimplexPlot strategies={["Forager", "Hoarder", HOSTILE]} experiments={runs} restPoints={simplexRestPoints} />,
  );

  it("is a captioned figure whose image summary names the corners and the rest points", () => {
    expect(html.startsWith("<figure")).toBe(true);
    expect(html).toContain("Runs on the simplex of Forager, Hoarder and &lt;script&gt;");
    expect(html).toMatch(/role="img" aria-label="Triangle of the states of Forager, Hoarder and &lt;script&gt;alert\(&quot;x&quot;\)&lt;\/script&gt;, each corner/);
    expect(html).toContain("asymptotically stable rest point at Forager 0.333, Hoarder 0.333, ");
  });

  it("labels the three vertices, truncating long names inside the drawing only", () => {
    expect(html).toContain('text-anchor="start">Forager</text>');
    expect(html).toContain('text-anchor="end">Hoarder</text>');
    expect(html).toContain('text-anchor="middle">&lt;script&gt;alert(&quot;x&quot;)&lt;/scr…</text>');
    expect(html).not.toContain("<script>");
  });

  it("draws one thinned path per run with a start marker and marks each rest point by its stability", () => {
    const sizes = polylineSizes(html);
    expect(sizes).toHaveLength(2);
    for (const s of sizes) {
      expect(s).toBeGreaterThan(10);
      expect(s).toBeLessThan(2001);
    }
    expect(count(html, /data-symbol="start"/)).toBe(2 + 1); // two runs + the legend swatch
    // Each kind once in the drawing and once in the legend.
    expect(count(html, /data-symbol="asymptotically-stable"/)).toBe(2);
    expect(count(html, /data-symbol="unstable"/)).toBe(2);
    expect(count(html, /data-symbol="non-hyperbolic"/)).toBe(2);
  });

  it("explains the symbols in words in the legend", () => {
    for (const words of ["start of a run", "asymptotically stable rest point", "unstable rest point", "non-hyperbolic rest point"]) {
      expect(html).toContain(`<span class="break-words">${words}</span>`);
    }
    expect(html).toContain("<span class=\"break-words\">Run “near-centre”</span>");
  });

  it("lists the runs' data with a run column and says when a run stopped early", () => {
    expect(headers(html)).toEqual(["Run", "Time", "Forager", "Hoarder", "&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;"]);
    expect(html).toContain("Data table (2301 rows)");
    expect(html).toContain("<li>Run “cut-short” stopped early: the run left the state space at t = 12</li>");
  });

  it("leaves out rest points of a stability that does not occur and notes states it cannot place", () => {
    const out = renderToStaticMarkup(
      <SimplexPlot
        strategies={["A", "B", "C"]}
        experiments={[{ id: "odd", times: [0, 1], states: [[0.5, 0.5, 0], [0.5, 0.5]] }]}
        restPoints={[{ ...simplexRestPoints[0], state: [0.5, 0.5] } as (typeof simplexRestPoints)[number]]}
      />,
    );
    expect(out).toContain("<li>Run “odd”: 1 state could not be placed in the plot.</li>");
    expect(out).toContain(
      "<li>A asymptotically stable rest point at a state that is not three shares could not be placed in the plot.</li>",
    );
    expect(out).not.toContain('data-symbol="asymptotically-stable"');
  });
});
