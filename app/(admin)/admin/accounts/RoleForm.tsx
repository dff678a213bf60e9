"use client";
import { useActionState } from "react";
import { IDLE } from "@/lib/action-state";
import { changeRole } from "./actions";

export function RoleForm({ userId, email, role }: { userId: string; email: string; role: string }) {
  const [state, action, pending] = useActionState(changeRole, IDLE);
  return (
    <form action={action} className="flex flex-wrap items-center gap-2" data-testid={`role-form-${email}`}>
      <input type="hidden" name="userId" value={userId} />
      <label className="sr-only" htmlFor={`role-${userId}`}>
        Role of {email}
      </label>
      <select id={`role-${userId}`} name="role" defaultValue={role} className="rp-input w-auto py-1 text-sm">
        <option value="author">Author</option>
        <option value="editor">Editor</option>
        <option value="admin">Administrator</option>
      </select>
      <button type="submit" disabled={pending} className="rounded-[var(--radius-control)] border border-line-strong px-2.5 py-1 text-sm font-semibold text-ink hover:border-tide hover:text-tide disabled:opacity-60">
        {pending ? "Saving…" : "Save"}
      </button>
      {state.status === "idle" ? null : (
        <span role={state.status === "error" ? "alert" : "status"} className={`text-xs ${state.status === "error" ? "text-danger" : "text-confirmed"}`}>
          {state.status === "error" ? "Not changed: " : "Saved: "}
          {state.message}
        </span>
      )}
    </form>
  );
}
