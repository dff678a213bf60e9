/** The caller's personal API tokens: list them, or create one (from a browser session only). */
import { requireActor } from "@/lib/authz";
import { apiTokenInputSchema, createApiToken, listApiTokens } from "@/lib/api-tokens";
import { Forbidden } from "@/lib/errors";
import { json, readJson, route } from "@/lib/http";
import { TOKEN_FROM_TOKEN_MESSAGE } from "../_support/params";

export const GET = route(async (req) => {
  const actor = await requireActor(req);
  return json({ tokens: await listApiTokens(actor.userId) });
});

export const POST = route(async (req) => {
  const actor = await requireActor(req);
  // A leaked token must not be able to mint replacements that outlive its revocation.
  if (actor.via === "token") throw new Forbidden(TOKEN_FROM_TOKEN_MESSAGE);
  const input = await readJson(req, apiTokenInputSchema);
  const created = await createApiToken(actor.userId, input);
  return json(created, { status: 201, headers: { "Cache-Control": "no-store" } });
});
