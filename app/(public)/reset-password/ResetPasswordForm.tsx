"use client";
import { useState } from "react";
import { Button, ButtonLink } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { PASSWORD_MIN, passwordProblem } from "@/lib/account-rules";
import { authClient, authErrorMessage } from "@/lib/auth-client";

export function ResetPasswordForm({ token }: { token: string }) {
  const [password, setPassword] = useState("");
  const [repeat, setRepeat] = useState("");
  const [errors, setErrors] = useState<{ password?: string; repeat?: string; form?: string }>({});
  const [done, setDone] = useState(false);
  const [busy, setBusy] = useState(false);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const problem = passwordProblem(password);
    if (problem !== null) return setErrors({ password: problem });
    if (password !== repeat) return setErrors({ repeat: "The two passwords differ." });
    setBusy(true);
    const { error } = await authClient.resetPassword({ newPassword: password, token });
    setBusy(false);
    if (error !== null) return setErrors(error.code === "WEAK_PASSWORD" ? { password: authErrorMessage(error) } : { form: authErrorMessage(error) });
    setDone(true);
  }

  if (done) {
    return (
      <div className="flex flex-col gap-4">
        <Notice tone="success" title="Your password has been changed." />
        <ButtonLink href="/sign-in">Sign in</ButtonLink>
      </div>
    );
  }
  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      {errors.form === undefined ? null : <Notice tone="error" title={errors.form} />}
      <Field label="New password" name="password" type="password" autoComplete="new-password" value={password} onChange={(e) => setPassword(e.target.value)} error={errors.password} hint={`At least ${PASSWORD_MIN} characters.`} />
      <Field label="The same password again" name="repeat" type="password" autoComplete="new-password" value={repeat} onChange={(e) => setRepeat(e.target.value)} error={errors.repeat} />
      <Button type="submit" disabled={busy}>
        {busy ? "Saving…" : "Save the new password"}
      </Button>
    </form>
  );
}
