"use server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import type { DecisionFormState } from "@/components/editor/DecisionForm";
import { requireRole } from "@/lib/authz";
import { recordDecision } from "@/lib/decisions";
import { isAppError, ValidationError } from "@/lib/errors";

/** Bound in the review page to the version on screen. */
export async function decideAction(
  target: { venue: string; slug: string; number: number },
  _prev: DecisionFormState,
  form: FormData,
): Promise<DecisionFormState> {
  const outcome = form.get("outcome");
  const comment = form.get("comment");
  const values = { outcome: typeof outcome === "string" ? outcome : undefined, comment: typeof comment === "string" ? comment : undefined };
  try {
    const me = await requireRole("editor", "admin");
    await recordDecision(
      { id: me.userId, role: me.role },
      { model: target.slug, number: target.number },
      { outcome: values.outcome, comment: values.comment ?? "", venue: target.venue },
    );
  } catch (e) {
    if (e instanceof ValidationError) {
      const fieldErrors: DecisionFormState["fieldErrors"] = {};
      for (const p of e.problems) {
        if (p.path === "/outcome") fieldErrors.outcome = p.message;
        if (p.path === "/comment") fieldErrors.comment = p.message;
      }
      return { status: "error", message: e.message, fieldErrors, values };
    }
    if (isAppError(e)) return { status: "error", message: e.message, values };
    throw e;
  }
  const path = `/workspace/venues/${target.venue}/review/${target.slug}/v/${target.number}`;
  revalidatePath(path);
  redirect(`${path}?decided=1`);
}
