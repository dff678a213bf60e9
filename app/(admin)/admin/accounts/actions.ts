"use server";
import { revalidatePath } from "next/cache";
import type { ActionState } from "@/lib/action-state";
import { runAction } from "@/lib/actions";
import { requireRole } from "@/lib/authz";
import { setRole } from "@/lib/users";

const ROLE_WORD = { author: "an author", editor: "an editor", admin: "an administrator" } as const;

/** Admins only: gives the account in `userId` the role in `role`. */
export async function changeRole(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction(async () => {
    const me = await requireRole("admin");
    const account = await setRole(me.userId, String(form.get("userId") ?? ""), String(form.get("role") ?? ""));
    revalidatePath("/admin/accounts");
    return `${account.name} is now ${ROLE_WORD[account.role]}.`;
  });
}
