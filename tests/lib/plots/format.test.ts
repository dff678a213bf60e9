import { describe, expect, it } from "vitest";
import { fileStem, formatShare, formatTime, truncateLabel } from "@/lib/plots/format";
import { experimentRows, flattenState, panelShares, stateColumns } from "@/lib/plots/data";
import { pageOf } from "@/lib/plots/paging";

describe("format", () => {
  it("prints shares with fixed decimals and no -0", () => {
    expect(formatShare(1 / 3)).toBe("0.333333");
    expect(formatShare(-1e-12)).toBe("0.000000");
    expect(formatShare(0.5, 3)).toBe("0.500");
  });
  it("prints times without float noise", () => {
    expect(formatTime(0.1 + 0.2)).toBe("0.3");
    expect(formatTime(0)).toBe("0");
    expect(formatTime(12.5)).toBe("12.5");
    expect(formatTime(1e-7)).toBe("1.00000e-7");
  });
  it("truncates by characters, not UTF-16 units", () => {
    expect(truncateLabel("abcdef", 4)).toBe("abc…");
    expect(truncateLabel("🦊🦊🦊", 3)).toBe("🦊🦊🦊");
    expect(truncateLabel("🦊🦊🦊🦊", 3)).toBe("🦊🦊…");
  });
  it("makes safe file-name stems", () => {
    expect(fileStem("run-1")).toBe("run-1");
    expect(fileStem("../etc/passwd")).toBe("etc-passwd");
    expect(fileStem("")).toBe("figure");
  });
});

describe("data", () => {
  const bimatrix = {
    kind: "bimatrix" as const,
    populations: [
      { name: "Buyers", strategies: ["Inspect", "Trust"] },
      { name: "Sellers", strategies: ["Honest", "Cheat"] },
    ] as [{ name: string; strategies: string[] }, { name: string; strategies: string[] }],
  };
  it("names columns by strategy, with the population for two populations", () => {
    expect(stateColumns({ kind: "symmetric", strategies: ["A", "B"] })).toEqual(["A", "B"]);
    expect(stateColumns(bimatrix)).toEqual(["Buyers: Inspect", "Buyers: Trust", "Sellers: Honest", "Sellers: Cheat"]);
  });
  it("flattens bimatrix states population 1 first and tolerates wrong shapes", () => {
    expect(flattenState(bimatrix, [[0.2, 0.8], [0.6, 0.4]])).toEqual([0.2, 0.8, 0.6, 0.4]);
    expect(panelShares(bimatrix, [[0.2, 0.8], [0.6, 0.4]], 1)).toEqual([0.6, 0.4]);
    expect(panelShares({ kind: "symmetric", strategies: ["A"] }, [[1], [2]], 0)).toEqual([]);
    expect(experimentRows(bimatrix, { id: "r", times: [0], states: [[[1, 0], [0, 1]]] })).toEqual([[1, 0, 0, 1]]);
  });
});

describe("pageOf", () => {
  const blocks = [
    { run: "a", times: [0, 1, 2], rows: [[1], [2], [3]] },
    { run: "b", times: [0, 1], rows: [[4], [5]] },
  ];
  it("pages across run boundaries", () => {
    const p = pageOf(blocks, 1, 2);
    expect(p).toMatchObject({ page: 1, pages: 3, total: 5, first: 2, last: 4 });
    expect(p.rows.map((r) => `${r.run}${r.values[0]}`)).toEqual(["a3", "b4"]);
    expect(pageOf(blocks, 2, 2).rows.map((r) => r.key)).toEqual(["b:1"]);
  });
  it("clamps the page into range and handles no rows", () => {
    expect(pageOf(blocks, 99, 2).page).toBe(2);
    expect(pageOf(blocks, -1, 2).page).toBe(0);
    expect(pageOf([], 0, 100)).toMatchObject({ page: 0, pages: 1, total: 0, rows: [] });
  });
});
