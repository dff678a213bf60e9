/**
 * The model specification's JSON Schema at a stable address, for editors' and CI tools'
 * validation. The body is fixed per deployment, so clients may cache it and revalidate by ETag.
 *
 * The file in schemas/ names itself with a URN (it is the same schema wherever it is served);
 * here `$id` becomes the address it is served from, this deployment's public origin, so a
 * validator that follows `$id` comes back to this route. The ETag is taken over those bytes.
 */
import { createHash } from "node:crypto";
import { env } from "@/lib/env";
import schema from "@/schemas/model-spec.v1.schema.json";

const SCHEMA_PATH = "/schemas/model-spec.v1.json";

/** The schema as served by a deployment whose public origin is `origin`. */
function servedSchema(origin: string): Record<string, unknown> {
  return { ...schema, $id: new URL(SCHEMA_PATH, origin).toString() };
}

const body = JSON.stringify(servedSchema(env.authUrl), null, 2);
const etag = `"${createHash("sha256").update(body).digest("hex").slice(0, 32)}"`;

const headers = {
  "Content-Type": "application/schema+json; charset=utf-8",
  // A day fresh, a week stale-while-revalidate: a new schema version gets a new URL (v2), not new bytes here.
  "Cache-Control": "public, max-age=86400, stale-while-revalidate=604800",
  ETag: etag,
  "Access-Control-Allow-Origin": "*",
};

export function GET(req: Request): Response {
  const ifNoneMatch = req.headers.get("if-none-match");
  if (ifNoneMatch !== null && ifNoneMatch.split(",").some((t) => t.trim() === etag || t.trim() === `W/${etag}`)) {
    return new Response(null, { status: 304, headers });
  }
  return new Response(body, { status: 200, headers });
}
