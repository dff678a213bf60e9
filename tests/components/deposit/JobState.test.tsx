import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { isPending, JobState } from "@/components/deposit/JobState";
import { ModelList } from "@/components/deposit/ModelList";
import type { JobStatus } from "@/lib/types/jobs";
import type { ModelView } from "@/lib/types/deposit";

const text = (html: string) => html.replace(/<[^>]+>/g, " ").replace(/\s+/g, " ").trim();

function job(over: Partial<JobStatus>): JobStatus {
  return {
    id: "j1",
    versionId: "v1",
    state: "queued",
    attempts: 0,
    maxAttempts: 3,
    lastError: null,
    createdAt: "2026-01-01T00:00:00.000Z",
    startedAt: null,
    finishedAt: null,
    runAfter: "2026-01-01T00:00:00.000Z",
    ...over,
  };
}

describe("JobState", () => {
  it("names each state in words", () => {
    expect(text(renderToStaticMarkup(<JobState job={job({})} verdict={null} />))).toBe("Queued");
    expect(text(renderToStaticMarkup(<JobState job={job({ attempts: 1 })} verdict={null} />))).toBe("Queued again (attempt 2 of 3)");
    expect(text(renderToStaticMarkup(<JobState job={job({ state: "running", attempts: 1 })} verdict={null} />))).toBe("Running");
    expect(text(renderToStaticMarkup(<JobState job={job({ state: "running", attempts: 2 })} verdict={null} />))).toBe("Running (attempt 2 of 3)");
    expect(text(renderToStaticMarkup(<JobState job={null} verdict={null} />))).toBe("Not queued");
  });
  it("shows the error of a job that failed for good", () => {
    const html = renderToStaticMarkup(<JobState job={job({ state: "failed", attempts: 3, lastError: "budget exceeded" })} verdict={null} />);
    expect(text(html)).toBe("Verification failed after 3 attempts budget exceeded");
    expect(html).toContain('data-job-state="failed"');
  });
  it("shows the verdict once there is one", () => {
    const html = renderToStaticMarkup(<JobState job={job({ state: "finished" })} verdict="contradicted" />);
    expect(html).toContain('data-verdict="contradicted"');
    expect(text(html)).toBe("Contradicted");
  });
  it("counts a version as pending only while queued or running without a verdict", () => {
    expect(isPending(job({}), null)).toBe(true);
    expect(isPending(job({ state: "running" }), null)).toBe(true);
    expect(isPending(job({ state: "failed" }), null)).toBe(false);
    expect(isPending(job({ state: "finished" }), "confirmed")).toBe(false);
    expect(isPending(null, null)).toBe(false);
  });
});

describe("ModelList", () => {
  const base: ModelView = {
    id: "m1",
    slug: "rp-abc234",
    ownerId: "u1",
    title: "Kelp grazers",
    summary: "",
    manuscriptTitle: null,
    doi: null,
    url: null,
    year: null,
    authors: [],
    venue: { id: "v", slug: "tide", name: "Tidewater Letters" },
    visibility: "private",
    createdAt: "2026-01-01T00:00:00.000Z",
    updatedAt: "2026-01-01T00:00:00.000Z",
    versions: [],
    canEdit: true,
  };
  it("links each model and shows its newest version's state", () => {
    const html = renderToStaticMarkup(
      <ModelList
        models={[
          base,
          {
            ...base,
            id: "m2",
            slug: "rp-def567",
            title: "Sand hoppers",
            venue: null,
            visibility: "public",
            versions: [
              { id: "x", modelId: "m2", number: 2, specSha256: "a", title: "t", dynamicsKind: "replicator", strategyNames: [], createdAt: base.createdAt, uploadedBy: "u1", verdict: "confirmed", counts: null, job: null },
            ],
          },
        ]}
      />,
    );
    expect(html).toContain('href="/workspace/models/rp-abc234"');
    expect(text(html)).toContain("Kelp grazers rp-abc234 · private · venue: Tidewater Letters · 0 versions No version yet");
    expect(text(html)).toContain("Sand hoppers rp-def567 · public · 1 version v2 Confirmed");
  });
});
