import { describe, expect, it } from "vitest";
import {
  claimKindLabel,
  formatEigenvalues,
  formatNumber,
  formatState,
  pointerText,
  scientificText,
  stateLabels,
  toScientific,
} from "@/components/report/format";

describe("toScientific / scientificText", () => {
  it("splits a number into mantissa and power of ten", () => {
    expect(toScientific(0.000032)).toEqual({ mantissa: "3.2", exponent: -5 });
    expect(toScientific(1e-6, 1)).toEqual({ mantissa: "1", exponent: -6 });
    expect(toScientific(12345, 3)).toEqual({ mantissa: "1.23", exponent: 4 });
  });
  it("writes negative mantissas with a real minus sign and zero as 0", () => {
    expect(toScientific(-0.0025)).toEqual({ mantissa: "-2.5", exponent: -3 });
    expect(toScientific(0)).toEqual({ mantissa: "0", exponent: 0 });
  });
  it("gives plain text for titles", () => {
    expect(scientificText(3.2e-9)).toBe("3.2e-9");
    expect(scientificText(5)).toBe("5");
    expect(scientificText(Number.NaN)).toBe("NaN");
  });
});

describe("formatNumber", () => {
  it("keeps four significant digits and drops trailing zeros", () => {
    expect(formatNumber(1 / 3)).toBe("0.3333");
    expect(formatNumber(0.5)).toBe("0.5");
    expect(formatNumber(2)).toBe("2");
  });
  it("writes roundoff next to zero as 0, and very small or large values in scientific notation", () => {
    expect(formatNumber(3e-16)).toBe("0");
    expect(formatNumber(2.5e-7, 4, 1e-12)).toBe("2.5e-7");
    expect(formatNumber(-4.2e7)).toBe("-4.2e7");
  });
});

describe("formatEigenvalues", () => {
  it("writes a complex-conjugate pair once as a ± b i", () => {
    expect(formatEigenvalues([[-0.5, 0.8660254], [-0.5, -0.8660254]])).toEqual(["-0.5 ± 0.866i"]);
  });
  it("keeps real eigenvalues apart and in order", () => {
    expect(formatEigenvalues([[-1, 0], [0.25, 0]])).toEqual(["-1", "0.25"]);
  });
  it("writes an unpaired complex eigenvalue with its own sign", () => {
    expect(formatEigenvalues([[0, -2]])).toEqual(["0 - 2i"]);
    expect(formatEigenvalues([[1, 2]])).toEqual(["1 + 2i"]);
  });
  it("pairs with a conjugate that is not adjacent", () => {
    expect(formatEigenvalues([[0, 1], [-3, 0], [0, -1]])).toEqual(["0 ± 1i", "-3"]);
  });
});

describe("formatState and stateLabels", () => {
  it("writes symmetric and two-population states", () => {
    expect(formatState([0.5, 0.25, 0.25])).toBe("(0.5, 0.25, 0.25)");
    expect(formatState([[1, 0], [0.4, 0.6]])).toBe("x = (1, 0), y = (0.4, 0.6)");
  });
  it("names coordinates from the game, or numbers them without one", () => {
    expect(stateLabels({ kind: "symmetric", strategies: ["Lurk", "Dash"], payoffs: [[0, 1], [1, 0]] }, [0.5, 0.5])).toEqual([
      ["Lurk", "Dash"],
    ]);
    expect(stateLabels(undefined, [[1, 0], [0, 1, 0]])).toEqual([
      ["s1", "s2"],
      ["s1", "s2", "s3"],
    ]);
    expect(stateLabels(undefined, [0.2, 0.8])).toEqual([["s1", "s2"]]);
  });
});

describe("labels", () => {
  it("names claim kinds, keeps unknown kinds as written, and names the root pointer", () => {
    expect(claimKindLabel("rest-point-count")).toBe("Number of rest points");
    expect(claimKindLabel("custom-kind")).toBe("custom-kind");
    expect(pointerText("")).toBe("(whole document)");
    expect(pointerText("/claims/0/state")).toBe("/claims/0/state");
  });
});
