import "./deposit-env";
import { beforeAll, describe, expect, it } from "vitest";
import { TOKEN_FROM_TOKEN_MESSAGE } from "@/app/api/v1/_support/params";
import { accountWithToken, ctx, jsonRequest, request, sessionCookie } from "./api-support";
import { migrated } from "./deposit-support";

type Tokens = typeof import("@/app/api/v1/tokens/route");
type OneToken = typeof import("@/app/api/v1/tokens/[id]/route");
type Models = typeof import("@/app/api/v1/models/route");
let tokens: Tokens;
let oneToken: OneToken;
let models: Models;

beforeAll(async () => {
  await migrated();
  tokens = await import("@/app/api/v1/tokens/route");
  oneToken = await import("@/app/api/v1/tokens/[id]/route");
  models = await import("@/app/api/v1/models/route");
});

interface Created {
  token: string;
  info: { id: string; name: string; prefix: string; revokedAt: string | null };
}

describe("/api/v1/tokens", () => {
  it("creates a token from a session, shows the secret once, and the token then works", async () => {
    const { cookie } = await sessionCookie("Erin");
    const res = await tokens.POST(jsonRequest("POST", "/api/v1/tokens", { cookie }, { name: "lab CI" }));
    expect(res.status).toBe(201);
    expect(res.headers.get("cache-control")).toBe("no-store");
    const created = (await res.json()) as Created;
    expect(created.token).toMatch(/^rp_[A-Za-z0-9_-]{43}$/);
    expect(created.token.startsWith(created.info.prefix)).toBe(true);

    const listed = (await (await tokens.GET(request("GET", "/api/v1/tokens", { cookie }))).json()) as { tokens: Record<string, unknown>[] };
    expect(listed.tokens.map((t) => t.name)).toEqual(["lab CI"]);
    // The list never carries the secret or its hash.
    expect(JSON.stringify(listed)).not.toContain(created.token);
    expect(Object.keys(listed.tokens[0] ?? {}).sort()).toEqual(["createdAt", "id", "lastUsedAt", "name", "prefix", "revokedAt"]);

    const withToken = await models.POST(jsonRequest("POST", "/api/v1/models", { token: created.token }, { title: "Made by a script" }));
    expect(withToken.status).toBe(201);
    const used = (await (await tokens.GET(request("GET", "/api/v1/tokens", { cookie }))).json()) as { tokens: { lastUsedAt: string | null }[] };
    expect(used.tokens[0]?.lastUsedAt).not.toBeNull();

    // Revoked: the same token is refused from then on.
    const del = await oneToken.DELETE(request("DELETE", `/api/v1/tokens/${created.info.id}`, { cookie }), ctx({ id: created.info.id }));
    expect(del.status).toBe(200);
    expect(((await del.json()) as { token: { revokedAt: string | null } }).token.revokedAt).not.toBeNull();
    const after = await models.GET(request("GET", "/api/v1/models", { token: created.token }));
    expect(after.status).toBe(401);
    expect(await after.json()).toEqual({ error: { code: "not_signed_in", message: "The API token is not valid or has been revoked." } });
  });

  it("does not let a token create further tokens", async () => {
    const a = await accountWithToken("Finn");
    const res = await tokens.POST(jsonRequest("POST", "/api/v1/tokens", { token: a.token }, { name: "second" }));
    expect(res.status).toBe(403);
    expect(await res.json()).toEqual({ error: { code: "forbidden", message: TOKEN_FROM_TOKEN_MESSAGE } });
  });

  it("asks for a name", async () => {
    const { cookie } = await sessionCookie("Gwen");
    const res = await tokens.POST(jsonRequest("POST", "/api/v1/tokens", { cookie }, { name: "  " }));
    expect(res.status).toBe(422);
    expect(await res.json()).toEqual({
      error: { code: "validation_failed", message: "The request has invalid fields.", details: [{ path: "/name", message: "Give the token a name (what will use it)." }] },
    });
  });

  it("answers 404 to revoking another account's token, and 401 without sign-in", async () => {
    const owner = await accountWithToken("Hana");
    const other = await accountWithToken("Ivo");
    const res = await oneToken.DELETE(request("DELETE", `/api/v1/tokens/${owner.tokenId}`, { token: other.token }), ctx({ id: owner.tokenId }));
    expect(res.status).toBe(404);
    expect(await res.json()).toEqual({ error: { code: "not_found", message: "No such token." } });
    expect((await models.GET(request("GET", "/api/v1/models", { token: owner.token }))).status).toBe(200);
    expect((await tokens.GET(request("GET", "/api/v1/tokens"))).status).toBe(401);
  });
});
