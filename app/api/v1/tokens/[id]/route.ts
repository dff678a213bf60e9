/** Revoke one of the caller's own tokens; another account's token is 404. */
import { requireActor } from "@/lib/authz";
import { revokeApiToken } from "@/lib/api-tokens";
import { json, route } from "@/lib/http";
import type { IdContext } from "../../_support/actor";

export const DELETE = route(async (req, ctx: IdContext) => {
  const { id } = await ctx.params;
  const actor = await requireActor(req);
  return json({ token: await revokeApiToken(actor.userId, id) });
});
