import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { AuditTrail } from "@/components/editor/AuditTrail";
import { FindingsList } from "@/components/editor/FindingsList";
import type { AuditLine } from "@/lib/decisions";

const text = (html: string) => html.replace(/<[^>]+>/g, " ").replace(/&#x27;|&#39;/g, "'").replace(/\s+/g, " ").trim();

const events: AuditLine[] = [
  { id: 1, at: "2026-12-02T09:05:00.000Z", action: "version.submitted", actor: { id: "a", name: "Noor" }, versionNumber: 2, venue: { slug: "tide", name: "Tide Letters" }, detail: {} },
  {
    id: 2,
    at: "2026-12-02T10:30:00.000Z",
    action: "decision.recorded",
    actor: { id: "e", name: "Tomas" },
    versionNumber: 2,
    venue: { slug: "tide", name: "Tide Letters" },
    detail: { outcome: "verified", comment: "Re-run matches.", madePublic: true },
  },
  { id: 3, at: "2026-12-02T11:00:00.000Z", action: "something.new", actor: null, versionNumber: null, venue: null, detail: {} },
];

describe("AuditTrail", () => {
  it("names each step, its version, who and when (in UTC)", () => {
    const t = text(renderToStaticMarkup(<AuditTrail events={events} />));
    expect(t).toContain("Version submitted to the venue · v2 · to Tide Letters 2 Dec 2026, 09:05 UTC · Noor");
    expect(t).toContain("Decision recorded · v2 · Verified — “Re-run matches.” (model made public) 2 Dec 2026, 10:30 UTC · Tomas");
    // An action without a label of its own shows its code; no actor is the system.
    expect(t).toContain("something.new 2 Dec 2026, 11:00 UTC · the system");
  });

  it("says when nothing is recorded", () => {
    expect(text(renderToStaticMarkup(<AuditTrail events={[]} />))).toBe("Nothing recorded yet.");
  });
});

describe("FindingsList", () => {
  it("writes states with strategy names, and says when there is nothing to add", () => {
    const game = { kind: "symmetric" as const, strategies: ["Keep", "Swap"], payoffs: [[1, 3], [2, 1]] };
    const t = text(
      renderToStaticMarkup(
        <FindingsList
          game={game}
          findings={[{ kind: "unclaimed-rest-point", text: "No claim mentions this rest point (unstable on Keep).", restPoint: { state: [1, 0], support: ["Keep"], stability: "unstable", eigenvalues: [[1, 0]], nash: false, ess: false } }]}
        />,
      ),
    );
    expect(t).toBe("No claim mentions this rest point (unstable on Keep). Keep 1, Swap 0");
    expect(text(renderToStaticMarkup(<FindingsList findings={[]} />))).toBe("Every rest point the engine found is covered by a claim, and every experiment is used.");
  });
});
