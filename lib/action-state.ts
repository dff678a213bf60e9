/** What a server action returns to its form (client-safe; the runner is lib/actions.ts). */
export interface ActionState {
  status: "idle" | "ok" | "error";
  message: string;
  /** Field name -> message, from a ValidationError's details. */
  fieldErrors?: Record<string, string>;
  /** The error code (lib/errors.ts), for tests and for forms that react to one case. */
  code?: string;
}

/** The initial state for useActionState. */
export const IDLE: ActionState = { status: "idle", message: "" };
