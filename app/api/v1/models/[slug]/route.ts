/**
 * One model entry. GET for anyone who may read it (a private model of someone else is 404);
 * PATCH changes the fields it names and keeps the others (the owner only).
 */
import { z } from "zod";
import { actorFromRequest, requireActor } from "@/lib/authz";
import { ValidationError } from "@/lib/errors";
import { json, parseWith, readJson, route } from "@/lib/http";
import { getModel, updateModel } from "@/lib/models";
import { modelInputSchema, type ModelView } from "@/lib/types/deposit";
import { viewerOf, type SlugContext } from "../../_support/actor";

export const GET = route(async (req, ctx: SlugContext) => {
  const { slug } = await ctx.params;
  const viewer = viewerOf(await actorFromRequest(req));
  return json({ model: await getModel(slug, viewer) });
});

const FIELDS = Object.keys(modelInputSchema.shape);
const bodySchema = z.record(z.string(), z.unknown());

function currentInput(m: ModelView): Record<string, unknown> {
  return {
    title: m.title,
    summary: m.summary,
    manuscriptTitle: m.manuscriptTitle,
    doi: m.doi,
    url: m.url,
    year: m.year,
    authors: m.authors,
    venueId: m.venue?.id ?? null,
    visibility: m.visibility,
  };
}

export const PATCH = route(async (req, ctx: SlugContext) => {
  const { slug } = await ctx.params;
  const viewer = viewerOf(await requireActor(req));
  const changes = await readJson(req, bodySchema);
  const unknown = Object.keys(changes).filter((k) => !FIELDS.includes(k));
  if (unknown.length > 0) {
    throw new ValidationError(
      "The request has fields a model entry does not have.",
      unknown.map((k) => ({ path: `/${k}`, message: `Unknown field; known fields: ${FIELDS.join(", ")}.` })),
    );
  }
  const current = await getModel(slug, viewer);
  // Only the fields sent change; the schema's defaults must not reset the others.
  const merged = parseWith(modelInputSchema, { ...currentInput(current), ...changes }, "The model entry has invalid fields.");
  return json({ model: await updateModel(current.id, viewer, merged) });
});
