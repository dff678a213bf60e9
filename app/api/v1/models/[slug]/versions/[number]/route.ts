/** One version: its summary, verification job state, spec text and files. */
import { actorFromRequest } from "@/lib/authz";
import { json, route } from "@/lib/http";
import { getVersion } from "@/lib/versions";
import { viewerOf, type VersionContext } from "../../../../_support/actor";
import { versionNumber } from "../../../../_support/params";

export const GET = route(async (req, ctx: VersionContext) => {
  const { slug, number } = await ctx.params;
  const viewer = viewerOf(await actorFromRequest(req));
  return json({ version: await getVersion(slug, versionNumber(number), viewer) });
});
