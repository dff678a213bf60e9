"use server";
/** Server actions of the model entry form: create a model, change one. (A "use server" file exports async functions only.) */
import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import type { ModelFormResult } from "@/components/deposit/ModelForm";
import type { SubmitResult } from "@/components/deposit/SubmitVersionButton";
import { isModelFormValues, toModelInput, UNEXPECTED_FORM_MESSAGE } from "@/components/deposit/model-form";
import { requireUser } from "@/lib/authz";
import { isAppError, ValidationError } from "@/lib/errors";
import { GENERIC_500_MESSAGE } from "@/lib/http";
import { createModel, updateModel } from "@/lib/models";
import { submitVersion } from "@/lib/venues";

function failure(e: unknown): ModelFormResult {
  if (e instanceof ValidationError) return { ok: false, message: e.message, problems: e.problems };
  if (isAppError(e)) return { ok: false, message: e.message, problems: [] };
  console.error("[restpoint] model form action failed:", e);
  return { ok: false, message: GENERIC_500_MESSAGE, problems: [] };
}

export async function createModelAction(values: unknown): Promise<ModelFormResult> {
  const me = await requireUser();
  if (!isModelFormValues(values)) return { ok: false, message: UNEXPECTED_FORM_MESSAGE, problems: [] };
  let slug: string;
  try {
    slug = (await createModel({ id: me.userId, role: me.role }, toModelInput(values))).slug;
  } catch (e) {
    return failure(e);
  }
  // Outside the try: redirect() works by throwing.
  redirect(`/workspace/models/${slug}?created=1`);
}

export async function updateModelAction(slug: string, values: unknown): Promise<ModelFormResult> {
  const me = await requireUser();
  if (!isModelFormValues(values)) return { ok: false, message: UNEXPECTED_FORM_MESSAGE, problems: [] };
  try {
    await updateModel(slug, { id: me.userId, role: me.role }, toModelInput(values));
  } catch (e) {
    return failure(e);
  }
  revalidatePath(`/workspace/models/${slug}`);
  return { ok: true, message: "The model entry was saved." };
}

/** Puts version `number` before the venue the model entry names (lib/venues.ts checks who may). */
export async function submitVersionAction(slug: string, number: number): Promise<SubmitResult> {
  const me = await requireUser();
  try {
    const { status, submission } = await submitVersion({ id: me.userId, role: me.role }, { model: slug, number });
    revalidatePath(`/workspace/models/${slug}`);
    return {
      ok: true,
      message:
        status === "created"
          ? `v${submission.versionNumber} was submitted to ${submission.venue.name}; its editors now see it in their queue.`
          : `v${submission.versionNumber} was submitted to ${submission.venue.name} already.`,
    };
  } catch (e) {
    if (isAppError(e)) return { ok: false, message: e.message };
    console.error("[restpoint] submit action failed:", e);
    return { ok: false, message: GENERIC_500_MESSAGE };
  }
}
