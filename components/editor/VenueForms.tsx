"use client";
/** The admin's venue forms: create a venue, assign an editor by address, remove an editor. */
import { useActionState } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";

export interface FormState {
  status: "idle" | "ok" | "error";
  message?: string;
  fieldErrors?: Record<string, string>;
  values?: Record<string, string>;
}

type Action = (prev: FormState, form: FormData) => Promise<FormState>;

function Outcome({ state }: { state: FormState }) {
  if (state.status === "idle" || state.message === undefined) return null;
  return (
    <p role={state.status === "error" ? "alert" : "status"} className={`text-sm ${state.status === "error" ? "text-danger" : "text-confirmed"}`}>
      {state.message}
    </p>
  );
}

export function CreateVenueForm({ action }: { action: Action }) {
  const [state, formAction, pending] = useActionState(action, { status: "idle" });
  const v = state.status === "error" ? (state.values ?? {}) : {};
  const err = state.fieldErrors ?? {};
  return (
    <form action={formAction} className="grid gap-4 sm:grid-cols-2" data-testid="create-venue" key={state.status === "ok" ? state.message : "form"}>
      <Field label="Name" name="name" defaultValue={v.name} error={err.name} hint="As readers and authors see it, e.g. Tidewater Letters." required />
      <Field label="Short name" name="slug" defaultValue={v.slug} error={err.slug} hint="Lower-case, for addresses: tidewater-letters." required />
      <div className="flex flex-col gap-1.5 sm:col-span-2">
        <label htmlFor="venue-description" className="text-sm font-semibold">
          Description
        </label>
        <textarea id="venue-description" name="description" rows={2} className="rp-input" defaultValue={v.description} aria-invalid={err.description === undefined ? undefined : true} />
        {err.description === undefined ? null : <p className="text-sm text-danger">{err.description}</p>}
      </div>
      <div className="flex items-center gap-4 sm:col-span-2">
        <Button type="submit" disabled={pending}>
          {pending ? "Creating…" : "Create venue"}
        </Button>
        <Outcome state={state} />
      </div>
    </form>
  );
}

export function AssignEditorForm({ action, venueName }: { action: Action; venueName: string }) {
  const [state, formAction, pending] = useActionState(action, { status: "idle" });
  const err = state.fieldErrors ?? {};
  return (
    <form action={formAction} className="flex flex-col gap-2" aria-label={`Assign an editor to ${venueName}`}>
      <div className="flex flex-wrap items-end gap-2">
        <div className="min-w-[16rem] flex-1">
          <Field label="Editor's e-mail address" name="email" type="email" defaultValue={state.status === "error" ? state.values?.email : undefined} error={err.email} />
        </div>
        <Button type="submit" kind="secondary" disabled={pending}>
          {pending ? "Assigning…" : "Assign editor"}
        </Button>
      </div>
      {err.email === undefined ? <Outcome state={state} /> : null}
    </form>
  );
}

export function RemoveEditorButton({ action, name }: { action: Action; name: string }) {
  const [state, formAction, pending] = useActionState(action, { status: "idle" });
  return (
    <form action={formAction} className="inline">
      <Button type="submit" kind="quiet" className="px-2 py-0.5 text-xs" disabled={pending} aria-label={`Remove ${name}`}>
        Remove
      </Button>
      {state.status === "error" ? <span className="text-xs text-danger"> {state.message}</span> : null}
    </form>
  );
}
