/** A verification job's state, for whoever may see its version (404 for anyone else). */
import { actorFromRequest } from "@/lib/authz";
import { NotFound } from "@/lib/errors";
import { json, route } from "@/lib/http";
import { getJob, toJobStatus } from "@/lib/jobs";
import { loadVisibleVersion } from "@/lib/models";
import { viewerOf, type IdContext } from "../../_support/actor";

export const GET = route(async (req, ctx: IdContext) => {
  const { id } = await ctx.params;
  const viewer = viewerOf(await actorFromRequest(req));
  const row = await getJob(id);
  if (row === null) throw new NotFound("job");
  try {
    await loadVisibleVersion(row.versionId, viewer);
  } catch (e) {
    if (e instanceof NotFound) throw new NotFound("job");
    throw e;
  }
  return json({ job: toJobStatus(row) }, { headers: { "Cache-Control": "no-store" } });
});
