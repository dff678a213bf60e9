/**
 * Decisions on one version. GET: whoever may read the model. POST {outcome, comment, venue?}:
 * an editor of the model's venue (never its owner), on the latest submitted version only.
 */
import { actorFromRequest, requireActor } from "@/lib/authz";
import { listDecisionsForModel, recordDecision, decisionInputSchema } from "@/lib/decisions";
import { NotFound } from "@/lib/errors";
import { json, readJson, route } from "@/lib/http";
import { loadVisibleModel } from "@/lib/models";

interface Ctx {
  params: Promise<{ slug: string; number: string }>;
}

function versionNumber(raw: string): number {
  if (!/^[1-9]\d{0,8}$/.test(raw)) throw new NotFound("version");
  return Number(raw);
}

export const GET = route(async (req, ctx: Ctx) => {
  const { slug, number } = await ctx.params;
  const n = versionNumber(number);
  const actor = await actorFromRequest(req);
  const m = await loadVisibleModel(slug, actor === null ? null : { id: actor.userId, role: actor.role });
  const decisions = (await listDecisionsForModel(m.id)).filter((d) => d.versionNumber === n);
  return json({ decisions });
});

export const POST = route(async (req, ctx: Ctx) => {
  const actor = await requireActor(req, "editor", "admin");
  const { slug, number } = await ctx.params;
  const n = versionNumber(number);
  const input = await readJson(req, decisionInputSchema);
  const decision = await recordDecision({ id: actor.userId, role: actor.role }, { model: slug, number: n }, input);
  return json({ decision }, { status: 201 });
});
