/**
 * The verification report of one version, for scripts that poll: 202 with the job's state
 * while it is queued or running, 200 with the report once there is one, and 200 with
 * state "failed" and the error when every attempt failed.
 */
import { actorFromRequest } from "@/lib/authz";
import { json, route } from "@/lib/http";
import { getReportForVersion } from "@/lib/reports";
import { getVersion } from "@/lib/versions";
import { viewerOf, type VersionContext } from "../../../../../_support/actor";
import { versionNumber } from "../../../../../_support/params";

export const GET = route(async (req, ctx: VersionContext) => {
  const { slug, number } = await ctx.params;
  const viewer = viewerOf(await actorFromRequest(req));
  const version = await getVersion(slug, versionNumber(number), viewer);
  const stored = await getReportForVersion(version.id, viewer);
  const noStore = { "Cache-Control": "no-store" };
  if (stored !== null) {
    return json(
      {
        state: "finished",
        verdict: stored.verdict,
        counts: stored.counts,
        engineVersion: stored.engineVersion,
        createdAt: stored.createdAt,
        durationMs: stored.durationMs,
        report: stored.report,
      },
      { headers: noStore },
    );
  }
  const job = version.job;
  if (job !== null && job.state === "failed") {
    return json({ state: "failed", job, error: job.lastError, report: null }, { headers: noStore });
  }
  return json(
    { state: job?.state ?? "queued", job, report: null },
    { status: 202, headers: { ...noStore, "Retry-After": "2" } },
  );
});
