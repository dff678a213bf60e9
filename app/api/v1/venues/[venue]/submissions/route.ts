/** POST {model, version}: the model's owner puts one of its versions before this venue. */
import { z } from "zod";
import { requireActor } from "@/lib/authz";
import { json, readJson, route } from "@/lib/http";
import { submitVersion } from "@/lib/venues";

const bodySchema = z.object({
  model: z.string({ message: "Name the model by its short name (rp-...)." }).trim().min(1, "Name the model by its short name (rp-...)."),
  version: z.number({ message: "Give the version number." }).int("A whole number.").min(1, "Versions start at 1."),
});

export const POST = route(async (req, ctx: { params: Promise<{ venue: string }> }) => {
  const actor = await requireActor(req);
  const { venue } = await ctx.params;
  const input = await readJson(req, bodySchema);
  const result = await submitVersion({ id: actor.userId, role: actor.role }, { model: input.model, number: input.version, venueSlug: venue });
  return json(result, { status: result.status === "created" ? 201 : 200 });
});
