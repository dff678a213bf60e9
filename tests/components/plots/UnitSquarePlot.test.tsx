import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { UnitSquarePlot } from "@/components/plots/UnitSquarePlot";
import { count, headers, polylineSizes, squareRestPoints, squareRun } from "./fixtures";

const populations: [{ name: string; strategies: string[] }, { name: string; strategies: string[] }] = [
  { name: "Buyers", strategies: ["Inspect", "Trust"] },
  { name: "Sellers & co", strategies: ["Honest", "Cheat"] },
];

describe("UnitSquarePlot", () => {
  const html = renderToStaticMarkup(
    <UnitSquarePlot
      populations={populations}
      experiments={[squareRun("loop", 801, 0.9, 0.2), squareRun("inner", 801, 0.6, 0.4)]}
      restPoints={squareRestPoints}
    />,
  );

  it("labels the axes with population and strategy names", () => {
    expect(html).toContain(">Share of Inspect in Buyers</text>");
    expect(html).toContain(">Share of Honest in Sellers &amp; co</text>");
    expect(html).toMatch(/aria-label="Unit square with the share of Inspect in Buyers across and the share of Honest in Sellers &amp; co up, with 2 runs/);
  });

  it("draws each run and each rest point by stability, with ticks from 0 to 1", () => {
    expect(polylineSizes(html)).toHaveLength(2);
    expect(count(html, /data-symbol="non-hyperbolic"/)).toBe(2);
    expect(count(html, /data-symbol="unstable"/)).toBe(2);
    expect(count(html, /data-symbol="asymptotically-stable"/)).toBe(0);
    for (const t of ["0.0", "0.2", "1.0"]) expect(html).toContain(`>${t}</text>`);
    expect(html).toContain("non-hyperbolic rest point at Inspect 0.500 in Buyers, Honest 0.500 in Sellers &amp; co");
  });

  it("has a table with a run column and one header per population's strategy", () => {
    expect(headers(html)).toEqual(["Run", "Time", "Buyers: Inspect", "Buyers: Trust", "Sellers &amp; co: Honest", "Sellers &amp; co: Cheat"]);
    expect(html).toContain("Data table (1602 rows)");
  });

  it("notes states that are not two pairs of shares", () => {
    const out = renderToStaticMarkup(
      <UnitSquarePlot populations={populations} experiments={[{ id: "bad", times: [0], states: [[0.5, 0.5]] }]} />,
    );
    expect(out).toContain("<li>Run “bad”: 1 state could not be placed in the plot.</li>");
  });
});
