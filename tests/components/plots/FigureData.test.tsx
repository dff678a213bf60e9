import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { FigureData, TABLE_PAGE_SIZE } from "@/components/plots/FigureData";
import { count, headers } from "./fixtures";

describe("FigureData", () => {
  const blocks = [
    { run: "first", times: Array.from({ length: 150 }, (_, i) => i / 10), rows: Array.from({ length: 150 }, () => [0.25, 0.75]) },
    { run: "second", times: [0, 0.5], rows: [[1 / 3, 2 / 3], [0.5, 0.5]] },
  ];

  it("shows the first page of all runs with a run column and page navigation", () => {
    const html = renderToStaticMarkup(
      <FigureData title="Runs" fileStem="runs" legend={[]} columns={["Hawk", "Dove"]} blocks={blocks} withRun={true} />,
    );
    expect(headers(html)).toEqual(["Run", "Time", "Hawk", "Dove"]);
    expect(count(html, /<tr class="border-b border-current\/10">/)).toBe(TABLE_PAGE_SIZE);
    expect(html).toContain("Runs: rows 1–100 of 152. Shares rounded to 6 decimals; the CSV file has full precision.");
    expect(html).toContain("Page 1 of 2");
    expect(html).toMatch(/disabled="">First<\/button>/);
    expect(html).toMatch(/disabled="">Previous<\/button>/);
    expect(html).not.toMatch(/disabled="">Next<\/button>/);
    expect(html).toContain('<td class="px-2 py-0.5">0.250000</td>');
  });

  it("disables the CSV download and says so when there are no rows", () => {
    const html = renderToStaticMarkup(
      <FigureData title="Empty" fileStem="empty" legend={[]} columns={["A"]} blocks={[]} withRun={false} />,
    );
    expect(html).toMatch(/disabled="">Download CSV<\/button>/);
    expect(html).toContain("Empty: no rows.");
    expect(html).toContain("Data table (0 rows)");
    expect(html).not.toContain("Page 1");
    expect(headers(html)).toEqual(["Time", "A"]);
  });
});
