/** Download one stored file (a spec or a supplement): its model's access rule decides, 404 otherwise. */
import { actorFromRequest } from "@/lib/authz";
import { openFile } from "@/lib/files";
import { route } from "@/lib/http";
import { viewerOf, type IdContext } from "../../_support/actor";
import { downloadHeaders } from "../../_support/download";

export const GET = route(async (req, ctx: IdContext) => {
  const { id } = await ctx.params;
  const viewer = viewerOf(await actorFromRequest(req));
  const { info, stream } = await openFile(id, viewer);
  // Anonymous access succeeded, so the model is public; anything else stays out of shared caches.
  return new Response(stream, { status: 200, headers: downloadHeaders(info, viewer === null) });
});
