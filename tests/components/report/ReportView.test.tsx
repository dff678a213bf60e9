import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { ClaimsTable, NOT_A_REVIEW, ReportView, RestPointsTable, SpecErrors } from "@/components/report";
import { invalidReport, marshGame, marshReport } from "./fixtures";

/** Visible text of rendered markup, tags stripped and whitespace collapsed. */
function text(html: string): string {
  return html.replace(/<[^>]+>/g, " ").replace(/&#x27;|&#39;/g, "'").replace(/\s+/g, " ").trim();
}

describe("ReportView", () => {
  const html = renderToStaticMarkup(<ReportView report={marshReport} game={marshGame} />);
  const t = text(html);

  it("opens with the verdict as word and icon, and counts the claims", () => {
    expect(html).toMatch(/data-testid="verdict-banner" data-verdict="contradicted"/);
    // The banner's word comes with the shared tag's icon (an svg beside it).
    expect(html).toMatch(/data-verdict="contradicted".*?<svg/s);
    expect(t).toContain("Contradicted At least one claim does not hold when the model is re-run.");
    expect(t).toContain("3 claims: 1 confirmed, 1 contradicted, 1 inconclusive.");
  });

  it("lists each claim with its status word, kind label, deviation and tolerance", () => {
    // The kind under the claim's id, then status and deviation, then the engine's sentence.
    expect(t).toContain("centre Rest point Confirmed 3.1 × 10 -12 tolerance 1 × 10 -6 rest point found");
    expect(t).toContain("centre-ess ESS Contradicted");
    expect(t).toContain("Forager is an alternative best reply");
    // No deviation: a dash drawn by CSS (components/ui/Glyph.tsx), named for screen readers.
    expect(t).toContain("three-rest-points Number of rest points Inconclusive budget exceeded");
    expect(html).toContain('<span class="rp-glyph" style="--rp-glyph:&quot;\\2014&quot;" role="img" aria-label="no deviation"></span>');
    expect(html).toContain('title="3.1e-12"');
  });

  it("shows rest points with strategy order, support, stability and eigenvalues as a ± b i", () => {
    expect(t).toContain("(Sentinel, Forager, Lurker)");
    expect(t).toContain("( 0.3333 , 0.3333 , 0.3333 )");
    expect(t).toContain("non-hyperbolic");
    expect(t).toContain("0 ± 0.5774i");
    // Roundoff in a zero coordinate is written as 0.
    expect(t).toContain("( 1 , 0 , 0 )");
    expect(t).toContain("unstable");
  });

  it("keeps the engine's notes and does not repeat the peer-review sentence when the engine gave one", () => {
    expect(t).toContain("What was checked and how");
    expect(t).toContain("Rest points were found on every face");
    expect(t).not.toContain(NOT_A_REVIEW);
  });

  it("names the engine version and the spec hash", () => {
    expect(t).toContain("Engine 1.0.0");
    expect(t).toContain(marshReport.specSha256);
  });

  it("draws the experiments with the plotting components when the game is known", () => {
    const experiments = html.slice(html.indexOf('id="report-experiments"'));
    // Three strategies: a simplex portrait and the run's time series, each an svg with a data-table alternative.
    expect(experiments.match(/<svg/g)?.length ?? 0).toBeGreaterThanOrEqual(2);
    expect(text(experiments)).toContain("loop");
    expect(experiments).toContain("<table");
  });

  it("renders the figures the caller passes under the experiments heading", () => {
    const withFigures = renderToStaticMarkup(
      <ReportView report={marshReport} game={marshGame} figures={<figure id="fig-loop">loop</figure>} />,
    );
    expect(withFigures).toMatch(/Experiments<\/h2>.*<figure id="fig-loop">loop<\/figure>/s);
  });

  it("says why an experiment stopped early", () => {
    const stopped = {
      ...marshReport,
      experiments: [{ id: "loop", times: [0], states: [[0.5, 0.25, 0.25]], error: "left the state space at t = 3.2" }],
    };
    expect(text(renderToStaticMarkup(<ReportView report={stopped} game={marshGame} />))).toContain(
      "loop stopped early: left the state space at t = 3.2",
    );
  });
});

describe("ReportView of an invalid spec", () => {
  const html = renderToStaticMarkup(<ReportView report={invalidReport} />);
  const t = text(html);
  it("shows the invalid verdict and every problem with pointer and line, and no claim table", () => {
    expect(html).toContain('data-verdict="invalid"');
    expect(t).toContain("Invalid The specification could not be read as a model, so nothing was run.");
    expect(t).toContain("Problems in the specification (2)");
    expect(t).toContain("/claims/0/state line 14 shares must sum to 1 (they sum to 0.9)");
    expect(t).toContain("(whole document) must have required property 'game'");
    expect(html).not.toContain("claims-table");
    expect(html).not.toContain("rest-points-table");
  });
  it("adds the peer-review sentence when the report has no notes", () => {
    expect(t).toContain(NOT_A_REVIEW);
  });
});

describe("ClaimsTable", () => {
  it("says so when there is no claim", () => {
    expect(text(renderToStaticMarkup(<ClaimsTable claims={[]} />))).toBe("No claim was checked.");
  });
  it("shows a dash where a claim has no deviation, and the author's note", () => {
    const t = text(
      renderToStaticMarkup(
        <ClaimsTable
          claims={[{ id: "c1", kind: "ess", status: "confirmed", message: "is an ESS" }]}
          specClaims={[{ id: "c1", kind: "ess", state: [1, 0], note: "Figure 2 of the paper" }]}
        />,
      ),
    );
    const html = renderToStaticMarkup(
      <ClaimsTable claims={[{ id: "c1", kind: "ess", status: "confirmed", message: "is an ESS" }]} />,
    );
    expect(html).toContain('role="img" aria-label="no deviation"');
    expect(t).toBe("Claims Claim Status Deviation What the engine found c1 ESS Confirmed is an ESS Author's note: Figure 2 of the paper");
  });
  it("is a focusable named region, and each cell names its column for the stacked phone layout", () => {
    const html = renderToStaticMarkup(
      <ClaimsTable claims={[{ id: "c1", kind: "ess", status: "contradicted", deviation: 0.2, message: "not an ESS" }]} />,
    );
    expect(html).toMatch(/<div role="region" aria-label="Claims" tabindex="0"/);
    for (const label of ["Claim", "Status", "Deviation", "What the engine found"]) {
      expect(html).toContain(`data-label="${label}"`);
    }
    // On a phone the status opens the card.
    expect(html).toMatch(/max-sm:order-1[^"]*" data-label="Status"/);
  });
});

describe("RestPointsTable", () => {
  it("is a focusable named region whose cells name their columns", () => {
    const html = renderToStaticMarkup(<RestPointsTable restPoints={marshReport.restPoints ?? []} game={marshGame} />);
    expect(html).toMatch(/<div role="region" aria-label="Rest points" tabindex="0"/);
    expect(html).toContain("States list the shares of Sentinel, Forager, Lurker.");
    expect(html).toContain('data-label="State"');
    for (const label of ["Support", "Stability", "Eigenvalues", "Nash", "ESS"]) {
      expect(html).toContain(`data-label="${label}"`);
    }
  });
});

describe("RestPointsTable", () => {
  it("says so when there is no rest point", () => {
    expect(text(renderToStaticMarkup(<RestPointsTable restPoints={[]} />))).toBe(
      "The engine found no isolated rest point.",
    );
  });
  it("names populations of a two-population game and writes n/a for ESS", () => {
    const t = text(
      renderToStaticMarkup(
        <RestPointsTable
          game={{
            kind: "bimatrix",
            populations: [
              { name: "Buyers", strategies: ["Haggle", "Accept"] },
              { name: "Sellers", strategies: ["Firm", "Flexible"] },
            ],
            payoffs: [
              [[1, 2], [3, 4]],
              [[1, 2], [3, 4]],
            ],
          }}
          restPoints={[
            { state: [[0.5, 0.5], [0.25, 0.75]], support: ["Haggle", "Accept", "Firm", "Flexible"], stability: "non-hyperbolic", eigenvalues: [[0, 1], [0, -1]], nash: true, ess: null },
          ]}
        />,
      ),
    );
    expect(t).toContain("(Buyers: Haggle, Accept; Sellers: Firm, Flexible)");
    expect(t).toContain("Buyers: ( 0.5 , 0.5 ) Sellers: ( 0.25 , 0.75 )");
    expect(t).toContain("yes n/a");
  });
});

describe("SpecErrors", () => {
  it("renders nothing without errors", () => {
    expect(renderToStaticMarkup(<SpecErrors errors={[]} />)).toBe("");
  });
});
