/**
 * Venues. GET: every signed-in account may list them (authors pick one in the model entry);
 * admins also get each venue's editors and queue sizes. POST: admins create one.
 */
import { requireActor } from "@/lib/authz";
import { json, readJson, route } from "@/lib/http";
import { createVenue, listVenues, summarizeVenues, venueInputSchema } from "@/lib/venues";

export const GET = route(async (req) => {
  const actor = await requireActor(req);
  const venues = await listVenues();
  if (actor.role === "admin") return json({ venues: await summarizeVenues(venues) });
  return json({ venues });
});

export const POST = route(async (req) => {
  const actor = await requireActor(req, "admin");
  const input = await readJson(req, venueInputSchema);
  const venue = await createVenue({ id: actor.userId, role: actor.role }, input);
  return json({ venue }, { status: 201 });
});
