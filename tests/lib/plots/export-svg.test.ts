import { describe, expect, it } from "vitest";
import { legendMarkup, resolveCssFunctions, standaloneSvg, wrapText, xmlEscape } from "@/lib/plots/export-svg";

describe("wrapText", () => {
  it("breaks at spaces within the limit and keeps over-long words whole", () => {
    expect(wrapText("Runs on the simplex of A, B and C", 12)).toEqual(["Runs on the", "simplex of", "A, B and C"]);
    expect(wrapText("short", 12)).toEqual(["short"]);
    expect(wrapText("averyveryverylongword x", 5)).toEqual(["averyveryverylongword", "x"]);
    expect(wrapText("", 5)).toEqual([""]);
  });
});

describe("resolveCssFunctions", () => {
  it("replaces var() by its fallback and light-dark() by its light value, nested", () => {
    expect(resolveCssFunctions("stroke:var(--color-series-1, light-dark(#2166ac, #6ea8e8))")).toBe("stroke:#2166ac");
    expect(resolveCssFunctions("fill: var(--a, var(--b, rgb(1, 2, 3)))")).toBe("fill: rgb(1, 2, 3)");
    expect(resolveCssFunctions("stroke:var(--plain)")).toBe("stroke:currentColor");
    expect(resolveCssFunctions("no functions here")).toBe("no functions here");
  });
  it("leaves unbalanced text as it is rather than looping", () => {
    expect(resolveCssFunctions("var(--x, #fff")).toBe("var(--x, #fff");
  });
});

describe("xmlEscape", () => {
  it("escapes the five XML special characters", () => {
    expect(xmlEscape(`<script>&"'`)).toBe("&lt;script&gt;&amp;&quot;&apos;");
  });
});

describe("standaloneSvg", () => {
  const plot =
    '<svg xmlns="http://www.w3.org/2000/svg" width="100" height="50" viewBox="0 0 100 50">' +
    '<polyline points="0,0 10,10" style="stroke:var(--color-series-2, light-dark(#c8571b, #f0925a))"/></svg>';
  const file = standaloneSvg({
    plotSvg: plot,
    width: 400,
    height: 50,
    title: "Run <x> & co",
    legend: [
      { kind: "series", index: 0, label: "<script>alert(1)</script>" },
      { kind: "symbol", symbol: "unstable", label: "unstable rest point" },
    ],
  });
  it("is a standalone document with namespace, title, background and no CSS functions", () => {
    expect(file.startsWith('<?xml version="1.0" encoding="UTF-8"?>\n<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    expect(file).toContain("<title>Run &lt;x&gt; &amp; co</title>");
    expect(file).toContain('<rect width="100%" height="100%" fill="#ffffff"/>');
    expect(file).toContain("stroke:#c8571b");
    expect(file).not.toContain("var(");
    expect(file).not.toContain("light-dark(");
    expect(file.trimEnd().endsWith("</svg>")).toBe(true);
  });
  it("wraps a long title onto more lines and moves the plot down", () => {
    const long = standaloneSvg({ plotSvg: plot, width: 100, height: 50, title: "Runs on the simplex of Forager, Hoarder and Scrounger", legend: [] });
    expect(long.match(/<tspan /g)?.length ?? 0).toBeGreaterThan(2);
    expect(long).not.toContain('<svg x="0" y="29"');
  });
  it("places the plot below the title and escapes legend text", () => {
    expect(file).toContain('<svg x="0" y="29" xmlns="http://www.w3.org/2000/svg" width="100" height="50"');
    expect(file).toContain("&lt;script&gt;alert(1)&lt;/script&gt;");
    expect(file).not.toContain("<script>");
  });
});

describe("legendMarkup", () => {
  it("lays entries out in rows and reports the height it needs", () => {
    const entries = Array.from({ length: 8 }, (_, i) => ({ kind: "series" as const, index: i, label: `S${i}` }));
    const wide = legendMarkup(entries, 560, 0);
    const narrow = legendMarkup(entries, 120, 0);
    expect(narrow.height).toBeGreaterThan(wide.height);
    expect(wide.markup.match(/<text /g)).toHaveLength(8);
    expect(legendMarkup([], 560, 0)).toEqual({ markup: "", height: 0 });
  });
  it("starts a new row for a heading", () => {
    const m = legendMarkup(
      [
        { kind: "heading", label: "Buyers" },
        { kind: "series", index: 0, label: "Inspect" },
      ],
      560,
      0,
    );
    expect(m.markup).toContain('font-weight="600">Buyers</text>');
    expect(m.height).toBe(2 * 20 + 12);
  });
});
