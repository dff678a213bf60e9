/**
 * Personal API tokens an author creates (for scripts and their own CI), lists and revokes in
 * their settings. The secret is shown once, at creation; only its SHA-256 is stored
 * (lib/token-hash.ts, shared with lib/authz.ts, which resolves bearer tokens).
 */
import "server-only";
import { and, count, desc, eq, isNull } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { apiToken } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { Conflict, NotFound, ValidationError } from "@/lib/errors";
import { zodDetails } from "@/lib/http";
import { newApiToken } from "@/lib/token-hash";

/** Live tokens one account may hold at a time (a leaked-token clean-up stays manageable). */
export const MAX_ACTIVE_TOKENS = 20;

export const apiTokenInputSchema = z.object({
  name: z.string().trim().min(1, "Give the token a name (what will use it).").max(100, "At most 100 characters."),
});

export interface ApiTokenInfo {
  id: string;
  name: string;
  /** The first characters of the token, to tell tokens apart. */
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

type Row = typeof apiToken.$inferSelect;

function toInfo(row: Row): ApiTokenInfo {
  return {
    id: row.id,
    name: row.name,
    prefix: row.prefix,
    createdAt: row.createdAt.toISOString(),
    lastUsedAt: row.lastUsedAt?.toISOString() ?? null,
    revokedAt: row.revokedAt?.toISOString() ?? null,
  };
}

/** Creates a token; the returned `token` is the only time the secret is available. */
export async function createApiToken(userId: string, input: { name: string }): Promise<{ token: string; info: ApiTokenInfo }> {
  const parsed = apiTokenInputSchema.safeParse(input);
  if (!parsed.success) throw new ValidationError("The token has invalid fields.", zodDetails(parsed.error));
  const [active] = await db
    .select({ n: count() })
    .from(apiToken)
    .where(and(eq(apiToken.userId, userId), isNull(apiToken.revokedAt)));
  if ((active?.n ?? 0) >= MAX_ACTIVE_TOKENS) {
    throw new Conflict(`You already have ${MAX_ACTIVE_TOKENS} active tokens; revoke one you no longer use first.`);
  }
  const { token, tokenHash, prefix } = newApiToken();
  const row = await db.transaction(async (tx) => {
    const rows = await tx.insert(apiToken).values({ userId, name: parsed.data.name, prefix, tokenHash }).returning();
    const inserted = rows[0];
    if (inserted === undefined) throw new Error("createApiToken: the insert returned no row");
    await recordAudit({ actorId: userId, action: "token.created", detail: { tokenId: inserted.id, name: inserted.name, prefix } }, tx);
    return inserted;
  });
  return { token, info: toInfo(row) };
}

/** The account's tokens, newest first, revoked ones included (marked). */
export async function listApiTokens(userId: string): Promise<ApiTokenInfo[]> {
  const rows = await db.select().from(apiToken).where(eq(apiToken.userId, userId)).orderBy(desc(apiToken.createdAt), desc(apiToken.id));
  return rows.map(toInfo);
}

/** Revokes one of the account's own tokens (another account's token is NotFound). Revoking twice is harmless. */
export async function revokeApiToken(userId: string, tokenId: string): Promise<ApiTokenInfo> {
  const rows = await db.select().from(apiToken).where(and(eq(apiToken.id, tokenId), eq(apiToken.userId, userId)));
  const row = rows[0];
  if (row === undefined) throw new NotFound("token");
  if (row.revokedAt !== null) return toInfo(row);
  const updated = await db.transaction(async (tx) => {
    const out = await tx.update(apiToken).set({ revokedAt: new Date() }).where(eq(apiToken.id, tokenId)).returning();
    await recordAudit({ actorId: userId, action: "token.revoked", detail: { tokenId, name: row.name, prefix: row.prefix } }, tx);
    return out[0] ?? row;
  });
  return toInfo(updated);
}
