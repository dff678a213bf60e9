import { describe, expect, it } from "vitest";
import { formatTick, linearScale, niceStep, niceTicks, stepDecimals } from "@/lib/plots/scale";

describe("linearScale", () => {
  it("maps the domain ends onto the range ends, inverted ranges included (SVG y grows down)", () => {
    const y = linearScale([0, 1], [200, 20]);
    expect(y(0)).toBe(200);
    expect(y(1)).toBe(20);
    expect(y(0.5)).toBe(110);
  });
  it("maps a degenerate domain to the middle of the range instead of NaN", () => {
    const x = linearScale([3, 3], [0, 100]);
    expect(x(3)).toBe(50);
    expect(x(7)).toBe(50);
  });
});

describe("niceTicks (1-2-5 steps, Heckbert 1990)", () => {
  it("splits the share axis into fifths", () => {
    expect(niceTicks(0, 1, 5)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
  });
  it("rounds away float noise such as 0.30000000000000004", () => {
    expect(niceTicks(0, 1, 10)).toEqual([0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1]);
  });
  it("stays inside an interval that does not start at a tick", () => {
    expect(niceTicks(0, 37.5, 6)).toEqual([0, 5, 10, 15, 20, 25, 30, 35]);
    expect(niceTicks(1.3, 9.1, 4)).toEqual([2, 4, 6, 8]);
  });
  it("handles reversed, equal and non-finite bounds", () => {
    expect(niceTicks(1, 0, 5)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(niceTicks(2, 2)).toEqual([2]);
    expect(niceTicks(0, Infinity)).toEqual([]);
  });
  it("uses steps of 1, 2 or 5 times a power of ten", () => {
    expect(niceStep(10000, 5)).toBe(2000);
    expect(niceStep(0.07, 5)).toBeCloseTo(0.01, 15);
    expect(niceStep(100, 6)).toBe(20);
    expect(niceStep(40, 6)).toBe(5);
    expect(niceStep(0, 5)).toBe(1);
  });
});

describe("formatTick", () => {
  it("prints the decimals of the step and never -0", () => {
    expect(stepDecimals(0.2)).toBe(1);
    expect(stepDecimals(0.05)).toBe(2);
    expect(stepDecimals(50)).toBe(0);
    expect(formatTick(0.4, 0.2)).toBe("0.4");
    expect(formatTick(1, 0.2)).toBe("1.0");
    expect(formatTick(-0.00001, 0.2)).toBe("0.0");
    expect(formatTick(20, 5)).toBe("20");
  });
});
