/**
 * lib/public-cache.ts and the report API's use of it: finished public reports come from memory
 * with an ETag, never once the model is private (whoever made it so), and the cache stays bounded.
 */
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { removeTempDir, setUpDatabase } from "./readers-db";
import { depositPublicModel } from "./readers-seed";

type Handler = (req: Request, ctx: { params: Promise<{ slug: string; number: string }> }) => Promise<Response>;

const specText = readFileSync("schemas/examples/fog-dune-beetles.json", "utf8");
let GET: Handler;
let slug = "";
let ownerId = "";

beforeAll(async () => {
  await setUpDatabase();
  GET = (await import("@/app/api/v1/models/[slug]/versions/[number]/report/route")).GET as Handler;
  ({ slug, ownerId } = await depositPublicModel([specText], { title: "Cached dunes" }));
}, 180_000);

afterAll(removeTempDir);

function report(headers: Record<string, string> = {}, number = "1"): Promise<Response> {
  return GET(new Request(`http://localhost/api/v1/models/${slug}/versions/${number}/report`, { headers }), {
    params: Promise.resolve({ slug, number }),
  });
}

async function setVisibilityInDatabase(visibility: "public" | "private"): Promise<void> {
  const { db } = await import("@/db/client");
  const { model } = await import("@/db/schema");
  const { eq } = await import("drizzle-orm");
  await db.update(model).set({ visibility }).where(eq(model.slug, slug));
}

describe("the report API's cache", () => {
  it("sends a finished public report with an ETag and answers 304 to it", async () => {
    const { cachedReportCount } = await import("@/lib/public-cache");
    const first = await report();
    expect(first.status).toBe(200);
    const etag = first.headers.get("etag") ?? "";
    expect(etag).toMatch(/^"[A-Za-z0-9_-]{32}"$/);
    expect(first.headers.get("cache-control")).toBe("public, max-age=0, must-revalidate");
    const body = (await first.json()) as { state: string; verdict: string; report: { specSha256: string } };
    expect(body.state).toBe("finished");
    expect(cachedReportCount()).toBe(1);
    const second = await report();
    expect(second.headers.get("etag")).toBe(etag);
    expect(await second.json()).toEqual(body);
    const again = await report({ "if-none-match": `"other", ${etag}` });
    expect(again.status).toBe(304);
    expect(await again.text()).toBe("");
  });

  it("answers 404 as soon as the model is private, even when another process changed it", async () => {
    const { cachedReportCount } = await import("@/lib/public-cache");
    expect((await report()).status).toBe(200);
    await setVisibilityInDatabase("private");
    const hidden = await report();
    expect(hidden.status).toBe(404);
    expect(((await hidden.json()) as { error: { code: string } }).error.code).toBe("not_found");
    expect(cachedReportCount()).toBe(0);
    await setVisibilityInDatabase("public");
    expect((await report()).status).toBe(200);
  });

  it("drops the model's reports when its owner makes it private (outside a request the page revalidation is skipped, not an error)", async () => {
    const { cachedReportCount } = await import("@/lib/public-cache");
    const { updateModel } = await import("@/lib/models");
    expect((await report()).status).toBe(200);
    expect(cachedReportCount()).toBe(1);
    await updateModel(slug, { id: ownerId, role: "author" }, { title: "Cached dunes", visibility: "private" });
    expect(cachedReportCount()).toBe(0);
    expect((await report()).status).toBe(404);
    await updateModel(slug, { id: ownerId, role: "author" }, { title: "Cached dunes", visibility: "public" });
    expect((await report()).status).toBe(200);
  });

  it("still checks a token sent with the request, even when the report is cached", async () => {
    expect((await report()).status).toBe(200);
    const res = await report({ authorization: "Bearer rp_not-a-real-token" });
    expect(res.status).toBe(401);
    const { INVALID_TOKEN_MESSAGE } = await import("@/lib/authz");
    expect(((await res.json()) as { error: { message: string } }).error.message).toBe(INVALID_TOKEN_MESSAGE);
  });

  it("answers an unknown version 404 without caching anything", async () => {
    const { cachedReportCount } = await import("@/lib/public-cache");
    const before = cachedReportCount();
    expect((await report({}, "9")).status).toBe(404);
    expect(cachedReportCount()).toBe(before);
  });
});

describe("the cache's bounds", () => {
  it("keeps at most 256 reports, the least recently used going first, and never one over 4 MB", async () => {
    const { cachedReportCount, rememberPublicReport, publicContentChanged } = await import("@/lib/public-cache");
    const { getModel } = await import("@/lib/models");
    const modelId = (await getModel(slug, null)).id;
    for (let i = 0; i < 300; i++) rememberPublicReport(`bound-${i}`, 1, { modelId, versionId: `v-${i}`, body: `{"n":${i}}` });
    expect(cachedReportCount()).toBe(256);
    const huge = rememberPublicReport("huge", 1, { modelId, versionId: "v-huge", body: "x".repeat(4 * 1024 * 1024 + 1) });
    expect(huge.etag).toMatch(/^"/);
    expect(cachedReportCount()).toBe(256);
    // One call drops every entry of the model.
    await publicContentChanged(modelId);
    expect(cachedReportCount()).toBe(0);
  });

  it("does nothing for a model that does not exist", async () => {
    const { publicContentChanged } = await import("@/lib/public-cache");
    await expect(publicContentChanged("no-such-model")).resolves.toBeUndefined();
  });
});
