/**
 * The venue's queue for its editors (and admins): one row per model at its newest submitted
 * version; query string as in lib/queue.ts (status, verdict, q, author, version, min counts,
 * submittedFrom/To, sort, dir, page, pageSize).
 */
import { requireActor } from "@/lib/authz";
import { json, route } from "@/lib/http";
import { listQueue, parseQueueQuery } from "@/lib/queue";
import { requireVenueAccess } from "@/lib/venues";

export const GET = route(async (req, ctx: { params: Promise<{ venue: string }> }) => {
  const actor = await requireActor(req, "editor", "admin");
  const { venue } = await ctx.params;
  const v = await requireVenueAccess({ id: actor.userId, role: actor.role }, venue);
  const query = parseQueueQuery(new URL(req.url).searchParams);
  const page = await listQueue(v.id, query);
  return json({ venue: { slug: v.slug, name: v.name }, ...page }, { headers: { "cache-control": "private, no-store" } });
});
