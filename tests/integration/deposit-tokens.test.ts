import "./deposit-env";
import { createHash } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { apiToken, auditEvent } from "@/db/schema";
import { createApiToken, listApiTokens, MAX_ACTIVE_TOKENS, revokeApiToken } from "@/lib/api-tokens";
import { Conflict, NotFound, ValidationError } from "@/lib/errors";
import { makeUser, migrated } from "./deposit-support";

beforeAll(async () => {
  await migrated();
});

async function caught(p: Promise<unknown>): Promise<unknown> {
  try {
    await p;
  } catch (e) {
    return e;
  }
  throw new Error("expected a rejection");
}

describe("personal API tokens", () => {
  it("shows the secret once, stores only its SHA-256, lists and revokes", async () => {
    const alice = await makeUser("Alice");
    const bob = await makeUser("Bob");
    const { token, info } = await createApiToken(alice.id, { name: "  CI on my laptop " });
    expect(token).toMatch(/^rp_[A-Za-z0-9_-]{43}$/);
    expect(info.name).toBe("CI on my laptop");
    expect(token.startsWith(info.prefix)).toBe(true);
    const [row] = await db.select().from(apiToken).where(eq(apiToken.id, info.id));
    expect(row?.tokenHash).toBe(createHash("sha256").update(token).digest("hex"));
    expect(JSON.stringify(await listApiTokens(alice.id))).not.toContain(token);
    expect(JSON.stringify(await listApiTokens(alice.id))).not.toContain(row?.tokenHash ?? "-");
    expect((await listApiTokens(alice.id)).map((t) => t.id)).toEqual([info.id]);
    expect(await listApiTokens(bob.id)).toEqual([]);

    const e = await caught(revokeApiToken(bob.id, info.id));
    expect(e).toBeInstanceOf(NotFound);
    expect((e as NotFound).message).toBe("No such token.");
    const revoked = await revokeApiToken(alice.id, info.id);
    expect(revoked.revokedAt).not.toBeNull();
    expect((await revokeApiToken(alice.id, info.id)).revokedAt).toBe(revoked.revokedAt);

    const audit = await db.select().from(auditEvent).where(eq(auditEvent.actorId, alice.id));
    expect(audit.map((a) => a.action)).toEqual(["token.created", "token.revoked"]);
    expect(JSON.stringify(audit)).not.toContain(token);
  });

  it("refuses a token without a name and more than the allowed number of live tokens", async () => {
    const carol = await makeUser("Carol");
    const e = await caught(createApiToken(carol.id, { name: "   " }));
    expect(e).toBeInstanceOf(ValidationError);
    expect((e as ValidationError).problems).toEqual([{ path: "/name", message: "Give the token a name (what will use it)." }]);
    for (let i = 0; i < MAX_ACTIVE_TOKENS; i++) await createApiToken(carol.id, { name: `t${i}` });
    const full = await caught(createApiToken(carol.id, { name: "one more" }));
    expect(full).toBeInstanceOf(Conflict);
    expect((full as Conflict).message).toBe("You already have 20 active tokens; revoke one you no longer use first.");
    const [first] = await listApiTokens(carol.id);
    await revokeApiToken(carol.id, first?.id ?? "");
    expect((await createApiToken(carol.id, { name: "one more" })).info.name).toBe("one more");
  });
});
