/** GET: the model's audit trail, oldest first (owner, editors of its venue, admins). */
import { requireActor } from "@/lib/authz";
import { auditTrailForModel } from "@/lib/decisions";
import { json, route } from "@/lib/http";
import { loadModelForReview } from "@/lib/venues";

export const GET = route(async (req, ctx: { params: Promise<{ slug: string }> }) => {
  const actor = await requireActor(req);
  const { slug } = await ctx.params;
  const m = await loadModelForReview({ id: actor.userId, role: actor.role }, slug);
  return json({ model: { slug: m.slug, title: m.title }, events: await auditTrailForModel(m.id) }, { headers: { "cache-control": "private, no-store" } });
});
