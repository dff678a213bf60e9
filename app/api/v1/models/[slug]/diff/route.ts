/** GET ?from=1&to=2: spec line diff and verdict diff (owner, editors of its venue, admins). */
import { z } from "zod";
import { requireActor } from "@/lib/authz";
import { compareVersions } from "@/lib/decisions";
import { json, parseWith, route } from "@/lib/http";
import { loadModelForReview } from "@/lib/venues";

const querySchema = z.object({
  from: z.coerce.number({ message: "Give from=N." }).int("A whole number.").min(1, "Versions start at 1."),
  to: z.coerce.number({ message: "Give to=N." }).int("A whole number.").min(1, "Versions start at 1."),
});

export const GET = route(async (req, ctx: { params: Promise<{ slug: string }> }) => {
  const actor = await requireActor(req);
  const { slug } = await ctx.params;
  const m = await loadModelForReview({ id: actor.userId, role: actor.role }, slug);
  const params = new URL(req.url).searchParams;
  const q = parseWith(querySchema, { from: params.get("from") ?? undefined, to: params.get("to") ?? undefined }, "The comparison needs two version numbers.");
  return json({ model: { slug: m.slug, title: m.title }, ...(await compareVersions(m.id, q.from, q.to)) });
});
