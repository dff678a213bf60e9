import { describe, expect, it } from "vitest";
import { claimChanges, tryLede } from "@/components/public/claim-changes";
import type { ClaimResult } from "@/lib/engine/types";

const registered: ClaimResult[] = [
  { id: "interior", kind: "rest-point", status: "confirmed", message: "rest point found" },
  { id: "ess", kind: "ess", status: "confirmed", message: "is an ESS" },
  { id: "count", kind: "rest-point-count", status: "inconclusive", message: "budget exceeded" },
];

describe("claimChanges", () => {
  it("lists only the claims whose status differs from the registered report, with the new sentence", () => {
    const mine: ClaimResult[] = [
      { id: "interior", kind: "rest-point", status: "confirmed", message: "rest point found" },
      { id: "ess", kind: "ess", status: "contradicted", message: "not an ESS: Lurker is an alternative best reply" },
      { id: "count", kind: "rest-point-count", status: "confirmed", message: "3 rest points" },
    ];
    expect(claimChanges(registered, mine)).toEqual([
      { id: "ess", from: "confirmed", to: "contradicted", message: "not an ESS: Lurker is an alternative best reply" },
      { id: "count", from: "inconclusive", to: "confirmed", message: "3 rest points" },
    ]);
  });
  it("is empty when every status is the same, and marks a claim the registered report lacks", () => {
    expect(claimChanges(registered, registered)).toEqual([]);
    expect(claimChanges([], [registered[0] as ClaimResult])).toEqual([{ id: "interior", from: null, to: "confirmed", message: "rest point found" }]);
  });
});

describe("tryLede", () => {
  it("offers parameters only when the model has some", () => {
    expect(tryLede({ parameters: { c: 1 } })).toMatch(/^Change the parameters, the starting shares or the durations/);
    expect(tryLede({})).toMatch(/^This model has no parameters; change the starting shares or the durations of its runs/);
    expect(tryLede({ parameters: {} })).not.toContain("Change the parameters");
  });
});
