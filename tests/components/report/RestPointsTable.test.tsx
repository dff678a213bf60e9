import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { RestPointsTable } from "@/components/report";
import { pickRestPoints } from "@/components/report/RestPointsTable";
import type { RestPointReport } from "@/lib/engine/types";

// Display fixtures (not engine results): many rest points of a made-up 3-strategy game.
/** Body rows only (the header row is a <tr> too). */
const bodyRows = (html: string) => (html.split("<tbody")[1] ?? "").match(/<tr /g)?.length ?? 0;

function point(i: number, over: Partial<RestPointReport> = {}): RestPointReport {
  return { state: [i / 1000, 1 - i / 1000, 0], support: ["A", "B"], stability: "unstable", eigenvalues: [[1, 0]], nash: false, ess: false, ...over };
}

describe("RestPointsTable with many rest points", () => {
  const many = Array.from({ length: 500 }, (_, i) => point(i));
  many[400] = point(400, { nash: true, ess: true, stability: "asymptotically-stable" });
  many[450] = point(450, { nash: true });
  many[470] = point(470, { stability: "asymptotically-stable" });

  it("keeps ESSs, Nash equilibria and stable points when it must leave rows out, in report order", () => {
    const shown = pickRestPoints(many, 5);
    expect(shown).toHaveLength(5);
    expect(shown.map((rp) => rp.state[0])).toEqual([0, 0.001, 0.4, 0.45, 0.47]);
  });

  it("draws at most the limit and says how many it left out", () => {
    const html = renderToStaticMarkup(<RestPointsTable restPoints={many} limit={60} />);
    expect(bodyRows(html)).toBe(60);
    expect(html).toContain("Showing 60 of 500 rest points");
    expect(html).toContain("the report&#x27;s JSON lists every one");
  });

  it("draws every row, with no note, below the limit", () => {
    const html = renderToStaticMarkup(<RestPointsTable restPoints={many.slice(0, 10)} />);
    expect(bodyRows(html)).toBe(10);
    expect(html).not.toContain("Showing");
  });
});
