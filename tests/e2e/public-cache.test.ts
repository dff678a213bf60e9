/**
 * The public pages are cached (ISR) and finished public reports are served from memory with an
 * ETag; a model made private must answer 404 on the very next request, for pages and the API.
 */
import { readFileSync } from "node:fs";
import { beforeAll, describe, expect, it } from "vitest";
import { app, sessionCookie } from "./support/harness";

const spec = readFileSync("schemas/examples/fog-dune-beetles.json", "utf8").replace("Fog basking", "Cache-check basking");
let cookie = "";
let slug = "";

function call(path: string, init: RequestInit & { asOwner?: boolean } = {}): Promise<Response> {
  const { baseUrl } = app();
  const headers = new Headers(init.headers);
  if (init.asOwner === true) {
    headers.set("cookie", cookie);
    headers.set("origin", baseUrl);
  }
  return fetch(`${baseUrl}${path}`, { ...init, headers, redirect: "manual" });
}

async function setVisibility(visibility: "public" | "private"): Promise<void> {
  const res = await call(`/api/v1/models/${slug}`, {
    method: "PATCH",
    asOwner: true,
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ visibility }),
  });
  expect(res.status).toBe(200);
}

beforeAll(async () => {
  cookie = await sessionCookie("author");
  const created = await call("/api/v1/models", {
    method: "POST",
    asOwner: true,
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ title: "Cache check beetles", visibility: "public" }),
  });
  expect(created.status).toBe(201);
  slug = ((await created.json()) as { model: { slug: string } }).model.slug;
  const uploaded = await call(`/api/v1/models/${slug}/versions`, {
    method: "POST",
    asOwner: true,
    headers: { "content-type": "application/json" },
    body: spec,
  });
  expect(uploaded.status).toBe(201);
  // The app's own worker re-runs it; wait for the report.
  const deadline = Date.now() + 120_000;
  for (;;) {
    const res = await call(`/api/v1/models/${slug}/versions/1/report`, { asOwner: true });
    if (res.status === 200) break;
    if (Date.now() > deadline) throw new Error(`no report for ${slug} after two minutes (last status ${res.status})`);
    await new Promise((r) => setTimeout(r, 500));
  }
}, 180_000);

describe("public caching", () => {
  it("serves the model page from the cache, and a private model 404s at once", async () => {
    const first = await call(`/models/${slug}`);
    expect(first.status).toBe(200);
    expect(await first.text()).toContain(`data-slug="${slug}"`);
    const second = await call(`/models/${slug}`);
    expect(second.status).toBe(200);
    // Next's own header on incremental static pages.
    expect(second.headers.get("x-nextjs-cache")).toBe("HIT");
    expect((await call(`/models/${slug}/v/1`)).status).toBe(200);

    await setVisibility("private");
    expect((await call(`/models/${slug}`)).status).toBe(404);
    expect((await call(`/models/${slug}/v/1`)).status).toBe(404);
    // The owner still reaches it in the workspace.
    expect((await call(`/workspace/models/${slug}`, { asOwner: true })).status).toBe(200);

    await setVisibility("public");
    const back = await call(`/models/${slug}`);
    expect(back.status).toBe(200);
    expect(await back.text()).toContain(`data-slug="${slug}"`);
  });

  it("sends a public report with an ETag, answers 304 to it, and stops at once when the model goes private", async () => {
    const path = `/api/v1/models/${slug}/versions/1/report`;
    const first = await call(path);
    expect(first.status).toBe(200);
    const etag = first.headers.get("etag");
    expect(etag).toMatch(/^"[A-Za-z0-9_-]{32}"$/);
    expect(first.headers.get("cache-control")).toBe("public, max-age=0, must-revalidate");
    const body = (await first.json()) as { state: string; verdict: string };
    expect(body.state).toBe("finished");
    // From the in-process cache: the same bytes and validator.
    const second = await call(path);
    expect(second.headers.get("etag")).toBe(etag);
    expect(await second.json()).toEqual(body);
    const revalidated = await call(path, { headers: { "if-none-match": etag ?? "" } });
    expect(revalidated.status).toBe(304);

    await setVisibility("private");
    expect((await call(path)).status).toBe(404);
    expect((await call(path, { headers: { "if-none-match": etag ?? "" } })).status).toBe(404);
    const owner = await call(path, { asOwner: true });
    expect(owner.status).toBe(200);
    expect(owner.headers.get("cache-control")).toBe("no-store");
    expect(owner.headers.get("etag")).toBeNull();
    await setVisibility("public");
    expect((await call(path)).status).toBe(200);
  });
});
