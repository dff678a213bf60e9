/** The signed-in author's models: list them, or create a model entry. */
import { requireActor } from "@/lib/authz";
import { json, readJson, route } from "@/lib/http";
import { createModel, listModelsForOwner } from "@/lib/models";
import { modelInputSchema } from "@/lib/types/deposit";

export const GET = route(async (req) => {
  const actor = await requireActor(req);
  const models = await listModelsForOwner({ id: actor.userId, role: actor.role });
  return json({ models });
});

export const POST = route(async (req) => {
  const actor = await requireActor(req);
  const input = await readJson(req, modelInputSchema);
  const created = await createModel({ id: actor.userId, role: actor.role }, input);
  return json({ model: created }, { status: 201, headers: { Location: `/api/v1/models/${created.slug}` } });
});
