/** lib/authz.ts: who is asking (session cookie or API token) and the role checks. */
import "./app-env";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { apiToken } from "@/db/schema";
import { actorFromRequest, hasRole, INVALID_TOKEN_MESSAGE, requireActor } from "@/lib/authz";
import { Forbidden, NotSignedIn } from "@/lib/errors";
import { stopFakeSmtp } from "@/lib/fake-smtp";
import { errorResponse } from "@/lib/http";
import { newApiToken } from "@/lib/token-hash";
import { accountIn, ORIGIN, ready } from "./app-support";

beforeAll(ready);
afterAll(stopFakeSmtp);

function req(headers: Record<string, string> = {}): Request {
  return new Request(`${ORIGIN}/api/v1/anything`, { headers });
}

async function tokenFor(userId: string): Promise<{ token: string; id: string }> {
  const t = newApiToken();
  const id = crypto.randomUUID();
  await db.insert(apiToken).values({ id, userId, name: "test", prefix: t.prefix, tokenHash: t.tokenHash });
  return { token: t.token, id };
}

describe("actorFromRequest", () => {
  it("is null for an anonymous request", async () => {
    expect(await actorFromRequest(req())).toBeNull();
  });

  it("reads the session cookie", async () => {
    const a = await accountIn("editor", "Cookie Editor");
    const actor = await actorFromRequest(req({ cookie: a.cookie }));
    expect(actor).toMatchObject({ userId: a.id, email: a.email, role: "editor", via: "session", tokenId: null });
  });

  it("accepts a live personal API token and records its use", async () => {
    const a = await accountIn("author", "Token Author");
    const t = await tokenFor(a.id);
    const actor = await actorFromRequest(req({ authorization: `Bearer ${t.token}` }));
    expect(actor).toMatchObject({ userId: a.id, role: "author", via: "token", tokenId: t.id });
    const [row] = await db.select().from(apiToken).where(eq(apiToken.id, t.id));
    expect(row?.lastUsedAt).toBeInstanceOf(Date);
  });

  it("refuses a revoked token with 401 instead of treating the caller as anonymous", async () => {
    const a = await accountIn("author");
    const t = await tokenFor(a.id);
    await db.update(apiToken).set({ revokedAt: new Date() }).where(eq(apiToken.id, t.id));
    await expect(actorFromRequest(req({ authorization: `Bearer ${t.token}` }))).rejects.toThrow(INVALID_TOKEN_MESSAGE);
  });

  it("refuses an unknown token and a malformed header", async () => {
    await expect(actorFromRequest(req({ authorization: `Bearer ${newApiToken().token}` }))).rejects.toThrow(INVALID_TOKEN_MESSAGE);
    await expect(actorFromRequest(req({ authorization: "Bearer not-ours" }))).rejects.toThrow(INVALID_TOKEN_MESSAGE);
    await expect(actorFromRequest(req({ authorization: "Basic abc" }))).rejects.toThrow("Send the API token as: Authorization: Bearer rp_...");
  });
});

describe("requireActor", () => {
  it("answers 401 for anonymous and 403 naming the roles for others", async () => {
    const anonymous = await requireActor(req(), "admin").catch((e: unknown) => e);
    expect(anonymous).toBeInstanceOf(NotSignedIn);
    const res401 = errorResponse(anonymous);
    expect(res401.status).toBe(401);
    expect(await res401.json()).toEqual({ error: { code: "not_signed_in", message: "Sign in to continue." } });

    const a = await accountIn("author");
    const refused = await requireActor(req({ cookie: a.cookie }), "editor", "admin").catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(Forbidden);
    const res403 = errorResponse(refused);
    expect(res403.status).toBe(403);
    expect(await res403.json()).toEqual({ error: { code: "forbidden", message: "This needs the editor or admin role." } });
  });

  it("lets a listed role through", async () => {
    const a = await accountIn("admin");
    const actor = await requireActor(req({ cookie: a.cookie }), "editor", "admin");
    expect(hasRole(actor, "admin")).toBe(true);
    expect(hasRole(actor, "author")).toBe(false);
    expect(hasRole(null, "author")).toBe(false);
  });
});
