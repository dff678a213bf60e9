/**
 * The verification report of one version, for scripts that poll: 202 with the job's state
 * while it is queued or running, 200 with the report once there is one, and 200 with
 * state "failed" and the error when every attempt failed.
 *
 * A finished report of a public model never changes, so its serialized answer is kept in a
 * bounded in-process cache (lib/public-cache.ts) and sent with an ETag (304 on If-None-Match).
 * Private models go the whole way through the access check every time and are never cached.
 */
import { actorFromRequest } from "@/lib/authz";
import { json, route } from "@/lib/http";
import { cachedPublicReport, publicModelIdOf, rememberPublicReport, type CachedReport } from "@/lib/public-cache";
import { getReportForVersion } from "@/lib/reports";
import { getVersion } from "@/lib/versions";
import { viewerOf, type VersionContext } from "../../../../../_support/actor";
import { versionNumber } from "../../../../../_support/params";

// The model can become private again, so clients revalidate each time (a 304 costs one row read).
const PUBLIC_CACHE_CONTROL = "public, max-age=0, must-revalidate";

function publicAnswer(req: Request, entry: CachedReport): Response {
  const headers = { ETag: entry.etag, "Cache-Control": PUBLIC_CACHE_CONTROL };
  const seen = req.headers.get("if-none-match");
  if (seen !== null && seen.split(/\s*,\s*/).includes(entry.etag)) return new Response(null, { status: 304, headers });
  return new Response(entry.body, { headers: { ...headers, "Content-Type": "application/json" } });
}

export const GET = route(async (req, ctx: VersionContext) => {
  const { slug, number } = await ctx.params;
  const n = versionNumber(number);
  // A request carrying a token still has it checked (a revoked token answers 401, not the report).
  const bearer = req.headers.get("authorization") !== null;
  if (!bearer) {
    const hit = await cachedPublicReport(slug, n);
    if (hit !== null) return publicAnswer(req, hit);
  }
  const viewer = viewerOf(await actorFromRequest(req));
  const version = await getVersion(slug, n, viewer);
  const stored = await getReportForVersion(version.id, viewer);
  const noStore = { "Cache-Control": "no-store" };
  if (stored !== null) {
    const body = {
      state: "finished",
      verdict: stored.verdict,
      counts: stored.counts,
      engineVersion: stored.engineVersion,
      createdAt: stored.createdAt,
      durationMs: stored.durationMs,
      report: stored.report,
    };
    const modelId = await publicModelIdOf(slug);
    if (modelId === null) return json(body, { headers: noStore });
    return publicAnswer(req, rememberPublicReport(slug, n, { modelId, versionId: version.id, body: JSON.stringify(body) }));
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
