"use client";
import { useState, type ReactNode } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { emailSchema } from "@/lib/account-rules";
import { authErrorMessage } from "@/lib/auth-client";

type AuthFailure = Parameters<typeof authErrorMessage>[0];

/**
 * An e-mail address and a button that asks the server to mail a link (password reset, a new
 * confirmation link). The address is checked with the same rule as on the server; once sent,
 * `sent` replaces the form.
 */
export function EmailLinkForm({
  send,
  sent,
  submitLabel,
  kind,
}: {
  send: (email: string) => Promise<{ error: AuthFailure }>;
  sent: ReactNode;
  submitLabel: string;
  kind?: "secondary";
}) {
  const [email, setEmail] = useState("");
  const [error, setError] = useState<string | undefined>(undefined);
  const [done, setDone] = useState(false);
  const [busy, setBusy] = useState(false);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const parsed = emailSchema.safeParse(email);
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message);
      return;
    }
    setBusy(true);
    const { error: failure } = await send(parsed.data);
    setBusy(false);
    if (failure !== null) {
      setError(authErrorMessage(failure));
      return;
    }
    setError(undefined);
    setDone(true);
  }

  if (done) return <>{sent}</>;
  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      <Field label="E-mail address" name="email" type="email" autoComplete="email" value={email} onChange={(e) => setEmail(e.target.value)} error={error} />
      <Button type="submit" kind={kind} disabled={busy}>
        {busy ? "Sending…" : submitLabel}
      </Button>
    </form>
  );
}
