"use server";
import { revalidatePath } from "next/cache";
import type { FormState } from "@/components/editor/VenueForms";
import { requireRole } from "@/lib/authz";
import { isAppError, ValidationError } from "@/lib/errors";
import { assignEditor, createVenue, unassignEditor } from "@/lib/venues";

function failure(e: unknown, values: Record<string, string>): FormState {
  if (e instanceof ValidationError) {
    const fieldErrors: Record<string, string> = {};
    for (const p of e.problems) fieldErrors[p.path.replace(/^\//, "")] = p.message;
    return { status: "error", message: e.message, fieldErrors, values };
  }
  if (isAppError(e)) return { status: "error", message: e.message, values };
  throw e;
}

const text = (form: FormData, key: string): string => {
  const v = form.get(key);
  return typeof v === "string" ? v : "";
};

export async function createVenueAction(_prev: FormState, form: FormData): Promise<FormState> {
  const values = { slug: text(form, "slug"), name: text(form, "name"), description: text(form, "description") };
  try {
    const me = await requireRole("admin");
    const v = await createVenue({ id: me.userId, role: me.role }, values);
    revalidatePath("/admin/venues");
    return { status: "ok", message: `Created ${v.name}.` };
  } catch (e) {
    return failure(e, values);
  }
}

export async function assignEditorAction(venueSlug: string, _prev: FormState, form: FormData): Promise<FormState> {
  const values = { email: text(form, "email") };
  try {
    const me = await requireRole("admin");
    const ed = await assignEditor({ id: me.userId, role: me.role }, venueSlug, values.email);
    revalidatePath("/admin/venues");
    return { status: "ok", message: `${ed.name} edits this venue.` };
  } catch (e) {
    return failure(e, values);
  }
}

export async function removeEditorAction(venueSlug: string, userId: string, _prev: FormState, _form: FormData): Promise<FormState> {
  try {
    const me = await requireRole("admin");
    await unassignEditor({ id: me.userId, role: me.role }, venueSlug, userId);
    revalidatePath("/admin/venues");
    return { status: "ok", message: "Removed." };
  } catch (e) {
    return failure(e, {});
  }
}
