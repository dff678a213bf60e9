/**
 * Server-action plumbing for the app's own forms. An action returns an ActionState that the
 * form shows (with useActionState); lib/errors.ts classes become their messages, anything
 * else a generic sentence and a log line.
 *
 *   export async function saveThing(_prev: ActionState, form: FormData): Promise<ActionState> {
 *     return runAction(async () => {
 *       const me = await requireRole("author");
 *       ...
 *       return "Saved.";                      // the success message
 *     });
 *   }
 */
import "server-only";
import { unstable_rethrow } from "next/navigation";
import { isAppError, ValidationError } from "@/lib/errors";
import { GENERIC_500_MESSAGE } from "@/lib/http";
import type { ActionState } from "@/lib/action-state";

export type { ActionState } from "@/lib/action-state";

export async function runAction(fn: () => Promise<string>): Promise<ActionState> {
  try {
    return { status: "ok", message: await fn() };
  } catch (e) {
    if (isAppError(e)) {
      const state: ActionState = { status: "error", message: e.message, code: e.code };
      if (e instanceof ValidationError && e.problems.length > 0) {
        state.fieldErrors = Object.fromEntries(e.problems.map((p) => [p.path.replace(/^\//, ""), p.message]));
      }
      return state;
    }
    // redirect() / notFound() inside an action are control flow, not failures.
    unstable_rethrow(e);
    console.error("[restpoint] server action failed:", e);
    return { status: "error", message: GENERIC_500_MESSAGE, code: "internal_error" };
  }
}
