"use client";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { emailSchema } from "@/lib/account-rules";
import { authClient, authErrorMessage } from "@/lib/auth-client";

export function ForgotPasswordForm() {
  const [email, setEmail] = useState("");
  const [error, setError] = useState<string | undefined>(undefined);
  const [sent, setSent] = useState(false);
  const [busy, setBusy] = useState(false);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const parsed = emailSchema.safeParse(email);
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message);
      return;
    }
    setBusy(true);
    const { error: failure } = await authClient.requestPasswordReset({ email: parsed.data, redirectTo: "/reset-password" });
    setBusy(false);
    if (failure !== null) {
      setError(authErrorMessage(failure));
      return;
    }
    setError(undefined);
    setSent(true);
  }

  if (sent) {
    return (
      <Notice tone="success" title="Check your inbox">
        If an account uses that address, a link for choosing a new password is on its way. It expires in one hour.
      </Notice>
    );
  }
  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      <Field label="E-mail address" name="email" type="email" autoComplete="email" value={email} onChange={(e) => setEmail(e.target.value)} error={error} />
      <Button type="submit" disabled={busy}>
        {busy ? "Sending…" : "Send the link"}
      </Button>
    </form>
  );
}
