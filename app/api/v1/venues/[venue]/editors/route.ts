/** A venue's editors (admin only): GET the list, POST {email} to assign, DELETE {userId} to remove. */
import { z } from "zod";
import { requireActor } from "@/lib/authz";
import { NotFound } from "@/lib/errors";
import { json, readJson, route } from "@/lib/http";
import { assignEditor, getVenueBySlug, listEditors, unassignEditor } from "@/lib/venues";

interface VenueContext {
  params: Promise<{ venue: string }>;
}

export const GET = route(async (req, ctx: VenueContext) => {
  await requireActor(req, "admin");
  const { venue } = await ctx.params;
  const v = await getVenueBySlug(venue);
  if (v === null) throw new NotFound("venue");
  return json({ editors: await listEditors(v.id) });
});

const addSchema = z.object({ email: z.string({ message: "Give the editor's e-mail address." }).trim().min(3, "Give the editor's e-mail address.") });

export const POST = route(async (req, ctx: VenueContext) => {
  const actor = await requireActor(req, "admin");
  const { venue } = await ctx.params;
  const { email } = await readJson(req, addSchema);
  const editor = await assignEditor({ id: actor.userId, role: actor.role }, venue, email);
  return json({ editor }, { status: 201 });
});

const removeSchema = z.object({ userId: z.string({ message: "Give the editor's account id." }).trim().min(1, "Give the editor's account id.") });

export const DELETE = route(async (req, ctx: VenueContext) => {
  const actor = await requireActor(req, "admin");
  const { venue } = await ctx.params;
  const { userId } = await readJson(req, removeSchema);
  await unassignEditor({ id: actor.userId, role: actor.role }, venue, userId);
  return new Response(null, { status: 204 });
});
