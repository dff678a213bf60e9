import "./deposit-env";
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { accountWithToken, ctx, jsonRequest, request, sessionCookie, type TestAccount } from "./api-support";
import { migrated } from "./deposit-support";

type ListRoute = typeof import("@/app/api/v1/models/route");
type OneRoute = typeof import("@/app/api/v1/models/[slug]/route");
let list: ListRoute;
let one: OneRoute;
let alice: TestAccount;
let bob: TestAccount;

beforeAll(async () => {
  await migrated();
  list = await import("@/app/api/v1/models/route");
  one = await import("@/app/api/v1/models/[slug]/route");
  alice = await accountWithToken("Alice");
  bob = await accountWithToken("Bob");
});

const entry = {
  title: "Nest-site contests of a fictional petrel",
  summary: "Residents and intruders.",
  doi: "https://doi.org/10.5555/petrel.2025",
  year: 2025,
  authors: [{ name: "I. Tern", orcid: "0000-0002-1825-0097" }],
};

async function create(account: TestAccount, input: unknown = entry): Promise<{ slug: string }> {
  const res = await list.POST(jsonRequest("POST", "/api/v1/models", { token: account.token }, input));
  expect(res.status).toBe(201);
  const b = (await res.json()) as { model: { slug: string } };
  return b.model;
}

describe("authentication on /api/v1/models", () => {
  it("answers 401 with a JSON error to an anonymous request", async () => {
    const res = await list.GET(request("GET", "/api/v1/models"));
    expect(res.status).toBe(401);
    expect(await res.json()).toEqual({ error: { code: "not_signed_in", message: "Sign in to continue." } });
  });

  it("answers 401 to an unknown token and to a malformed authorization header", async () => {
    const res = await list.GET(request("GET", "/api/v1/models", { token: "rp_notarealtokenatallnotreal00" }));
    expect(res.status).toBe(401);
    expect(await res.json()).toEqual({ error: { code: "not_signed_in", message: "The API token is not valid or has been revoked." } });
    const res2 = await list.GET(request("GET", "/api/v1/models", {}, { headers: { authorization: "Token abc" } }));
    expect(res2.status).toBe(401);
    expect(((await res2.json()) as { error: { message: string } }).error.message).toBe(
      "Send the API token as: Authorization: Bearer rp_...",
    );
  });

  it("answers 401 to a revoked token", async () => {
    const carol = await accountWithToken("Carol");
    const { db } = await import("@/db/client");
    const { apiToken } = await import("@/db/schema");
    expect((await list.GET(request("GET", "/api/v1/models", { token: carol.token }))).status).toBe(200);
    await db.update(apiToken).set({ revokedAt: new Date() }).where(eq(apiToken.id, carol.tokenId));
    const res = await list.GET(request("GET", "/api/v1/models", { token: carol.token }));
    expect(res.status).toBe(401);
  });

  it("accepts a browser session cookie", async () => {
    const { cookie } = await sessionCookie("Dana");
    const res = await list.POST(jsonRequest("POST", "/api/v1/models", { cookie }, { title: "Session-made model" }));
    expect(res.status).toBe(201);
    const listed = (await (await list.GET(request("GET", "/api/v1/models", { cookie }))).json()) as { models: { title: string }[] };
    expect(listed.models.map((m) => m.title)).toEqual(["Session-made model"]);
  });
});

describe("POST /api/v1/models", () => {
  it("creates a private model entry with normalised DOI and the author's ORCID iD", async () => {
    const res = await list.POST(jsonRequest("POST", "/api/v1/models", { token: alice.token }, entry));
    expect(res.status).toBe(201);
    const { model } = (await res.json()) as { model: Record<string, unknown> };
    expect(model.title).toBe(entry.title);
    expect(model.doi).toBe("10.5555/petrel.2025");
    expect(model.visibility).toBe("private");
    expect(model.authors).toEqual([{ name: "I. Tern", orcid: "0000-0002-1825-0097", affiliation: null }]);
    expect(res.headers.get("location")).toBe(`/api/v1/models/${String(model.slug)}`);
  });

  it("refuses an ORCID iD whose check character is wrong, with the field's JSON pointer", async () => {
    const res = await list.POST(
      jsonRequest("POST", "/api/v1/models", { token: alice.token }, { title: "x", authors: [{ name: "I. Tern", orcid: "0000-0002-1825-0098" }] }),
    );
    expect(res.status).toBe(422);
    expect(await res.json()).toEqual({
      error: {
        code: "validation_failed",
        message: "The request has invalid fields.",
        details: [{ path: "/authors/0/orcid", message: "Not a valid ORCID iD (0000-0000-0000-000X with a correct check character)." }],
      },
    });
  });

  it("answers 400 to a body that is not JSON", async () => {
    const res = await list.POST(request("POST", "/api/v1/models", { token: alice.token }, { body: "title=x", headers: { "content-type": "application/json" } }));
    expect(res.status).toBe(400);
    expect(await res.json()).toEqual({ error: { code: "validation_failed", message: "The request body is not valid JSON." } });
  });
});

describe("/api/v1/models/[slug]", () => {
  it("lets the owner read the model and hides another author's private model (404)", async () => {
    const { slug } = await create(alice);
    const mine = await one.GET(request("GET", `/api/v1/models/${slug}`, { token: alice.token }), ctx({ slug }));
    expect(mine.status).toBe(200);
    for (const auth of [{ token: bob.token }, {}]) {
      const res = await one.GET(request("GET", `/api/v1/models/${slug}`, auth), ctx({ slug }));
      expect(res.status).toBe(404);
      expect(await res.json()).toEqual({ error: { code: "not_found", message: "No such model." } });
    }
    const patch = await one.PATCH(jsonRequest("PATCH", `/api/v1/models/${slug}`, { token: bob.token }, { title: "taken" }), ctx({ slug }));
    expect(patch.status).toBe(404);
  });

  it("changes only the fields a PATCH names", async () => {
    const { slug } = await create(alice);
    const res = await one.PATCH(jsonRequest("PATCH", `/api/v1/models/${slug}`, { token: alice.token }, { visibility: "public" }), ctx({ slug }));
    expect(res.status).toBe(200);
    const { model } = (await res.json()) as { model: Record<string, unknown> };
    expect(model.visibility).toBe("public");
    expect(model.title).toBe(entry.title);
    expect(model.summary).toBe(entry.summary);
    expect(model.authors).toEqual([{ name: "I. Tern", orcid: "0000-0002-1825-0097", affiliation: null }]);
    // Public now: anyone reads it, but only the owner changes it.
    expect((await one.GET(request("GET", `/api/v1/models/${slug}`), ctx({ slug }))).status).toBe(200);
    const other = await one.PATCH(jsonRequest("PATCH", `/api/v1/models/${slug}`, { token: bob.token }, { title: "mine now" }), ctx({ slug }));
    expect(other.status).toBe(403);
    expect(await other.json()).toEqual({ error: { code: "forbidden", message: "Only the model's owner may change it or upload to it." } });
  });

  it("refuses unknown fields and invalid values in a PATCH", async () => {
    const { slug } = await create(alice);
    const res = await one.PATCH(jsonRequest("PATCH", `/api/v1/models/${slug}`, { token: alice.token }, { colour: "blue" }), ctx({ slug }));
    expect(res.status).toBe(422);
    const b = (await res.json()) as { error: { message: string; details: { path: string }[] } };
    expect(b.error.message).toBe("The request has fields a model entry does not have.");
    expect(b.error.details.map((d) => d.path)).toEqual(["/colour"]);
    const bad = await one.PATCH(jsonRequest("PATCH", `/api/v1/models/${slug}`, { token: alice.token }, { year: 1700 }), ctx({ slug }));
    expect(bad.status).toBe(422);
    expect(await bad.json()).toEqual({
      error: { code: "validation_failed", message: "The model entry has invalid fields.", details: [{ path: "/year", message: "A year from 1900 on." }] },
    });
  });

  it("lists only the caller's own models", async () => {
    const res = await list.GET(request("GET", "/api/v1/models", { token: bob.token }));
    expect(res.status).toBe(200);
    expect(((await res.json()) as { models: unknown[] }).models).toEqual([]);
  });
});

describe("GET /schemas/model-spec.v1.json", () => {
  it("serves the JSON Schema with its media type, caching headers and an ETag", async () => {
    const { GET } = await import("@/app/schemas/model-spec.v1.json/route");
    const res = GET(request("GET", "/schemas/model-spec.v1.json"));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/schema+json; charset=utf-8");
    expect(res.headers.get("cache-control")).toBe("public, max-age=86400, stale-while-revalidate=604800");
    const text = await res.text();
    const schema = JSON.parse(text) as { $schema: string; $id: string; title: string };
    expect(schema.$schema).toBe("https://json-schema.org/draft/2020-12/schema");
    // Served under this deployment's own public address, not the file's neutral URN.
    const { env } = await import("@/lib/env");
    expect(schema.$id).toBe(`${env.authUrl.replace(/\/$/, "")}/schemas/model-spec.v1.json`);
    const file = JSON.parse(readFileSync(path.resolve("schemas/model-spec.v1.schema.json"), "utf8")) as { $id: string };
    expect(file.$id).toBe("urn:restpoint:schema:model-spec:v1");
    expect({ ...schema, $id: file.$id }).toEqual(file);
    const etag = res.headers.get("etag");
    expect(etag).toMatch(/^"[0-9a-f]{32}"$/);
    // The ETag is the hash of the bytes sent.
    expect(etag).toBe(`"${createHash("sha256").update(text).digest("hex").slice(0, 32)}"`);
    const again = GET(request("GET", "/schemas/model-spec.v1.json", {}, { headers: { "if-none-match": etag ?? "" } }));
    expect(again.status).toBe(304);
    expect(await again.text()).toBe("");
  });
});
