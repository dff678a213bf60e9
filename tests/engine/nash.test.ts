import { describe, expect, it } from "vitest";
import { BEST_REPLY_TOLERANCE, bimatrixNash, payoffScale, symmetricNash } from "@/lib/engine/nash";

describe("Nash checks", () => {
  it("hawk-dove: the mixture at V/C is a symmetric Nash equilibrium, pure Dove is not (Maynard Smith 1982)", () => {
    const A = Float64Array.from([-0.5, 2, 0, 1]); // V = 2, C = 3
    expect(symmetricNash(A, 2, [2 / 3, 1 / 3]).nash).toBe(true);
    const dove = symmetricNash(A, 2, [0, 1]);
    expect(dove.nash).toBe(false);
    expect(dove.bestDeviation).toBe(0);
    expect(dove.maxGain).toBe(1);
  });

  it("a rest point need not be Nash: pure Dove is a rest point of the replicator dynamics but Hawk invades", () => {
    // every vertex is a rest point of x_i' = x_i (f_i - phi) (Hofbauer & Sigmund 1998)
    expect(symmetricNash(Float64Array.from([-0.5, 2, 0, 1]), 2, [0, 1]).nash).toBe(false);
  });

  it("two populations: both must best-reply", () => {
    // an inspection game of our own: interior equilibrium x = (2/3, 1/3), y = (1/2, 1/2)
    const A = Float64Array.from([1, 0, 2, -1]);
    const B = Float64Array.from([1, 1, 0, 3]);
    expect(bimatrixNash(A, B, 2, 2, [2 / 3, 1 / 3, 0.5, 0.5]).nash).toBe(true);
    const off = bimatrixNash(A, B, 2, 2, [1, 0, 0.5, 0.5]);
    expect(off.nash).toBe(false);
    // every buyer inspects: honest sellers earn 1, cheats 0, against the sellers' mean 1/2
    expect(off.bestDeviation).toBe(2);
    expect(off.maxGain).toBe(0.5);
  });

  it("uses a tolerance relative to the payoff scale", () => {
    expect(BEST_REPLY_TOLERANCE).toBe(1e-9);
    expect(payoffScale(Float64Array.from([0.1, -0.2]))).toBe(1);
    expect(payoffScale(Float64Array.from([1000, -2000]))).toBe(2000);
    // a gain of 1e-7 on payoffs near 1000 is inside the band (1e-9 * 1000 = 1e-6)
    const A = Float64Array.from([1000, 1000, 1000 + 1e-7, 1000]);
    expect(symmetricNash(A, 2, [1, 0]).nash).toBe(true);
    expect(symmetricNash(Float64Array.from([1, 1, 1 + 1e-7, 1]), 2, [1, 0]).nash).toBe(false);
  });
});
