/** GET /api/v1/registry: public search over the registry (same query as the /models page). */
import { json, route } from "@/lib/http";
import { parseRegistryQuery, searchRegistry } from "@/lib/registry";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = route(async (req) => {
  const page = await searchRegistry(parseRegistryQuery(new URL(req.url).searchParams));
  return json(page, { headers: { "Cache-Control": "public, max-age=0, must-revalidate" } });
});
