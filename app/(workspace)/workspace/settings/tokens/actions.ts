"use server";
/** Server actions of the token settings: create (the secret is returned once), revoke. */
import { revalidatePath } from "next/cache";
import type { TokenActionResult } from "@/components/deposit/TokenManager";
import { createApiToken, revokeApiToken } from "@/lib/api-tokens";
import { requireUser } from "@/lib/authz";
import { isAppError, ValidationError } from "@/lib/errors";
import { GENERIC_500_MESSAGE } from "@/lib/http";

function failure(e: unknown): TokenActionResult {
  if (e instanceof ValidationError) return { ok: false, message: e.problems[0]?.message ?? e.message };
  if (isAppError(e)) return { ok: false, message: e.message };
  console.error("[restpoint] token action failed:", e);
  return { ok: false, message: GENERIC_500_MESSAGE };
}

export async function createTokenAction(name: unknown): Promise<TokenActionResult> {
  const me = await requireUser();
  try {
    const { token, info } = await createApiToken(me.userId, { name: typeof name === "string" ? name : "" });
    revalidatePath("/workspace/settings/tokens");
    return { ok: true, token, info };
  } catch (e) {
    return failure(e);
  }
}

export async function revokeTokenAction(id: unknown): Promise<TokenActionResult> {
  const me = await requireUser();
  try {
    const info = await revokeApiToken(me.userId, typeof id === "string" ? id : "");
    revalidatePath("/workspace/settings/tokens");
    return { ok: true, token: null, info };
  } catch (e) {
    return failure(e);
  }
}
