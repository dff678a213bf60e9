"use client";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { fieldErrors, PASSWORD_MIN, signUpSchema } from "@/lib/account-rules";
import { authClient, authErrorMessage, VERIFIED_CALLBACK } from "@/lib/auth-client";

type Errors = Partial<Record<"name" | "email" | "password" | "form", string>>;

/** Which field a server-side refusal belongs to, so the message appears beside it. */
function fieldOf(code: string | undefined): keyof Errors {
  if (code === "INVALID_EMAIL" || code === "EMAIL_TAKEN" || code === "USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL") return "email";
  if (code === "WEAK_PASSWORD" || code === "PASSWORD_TOO_SHORT" || code === "PASSWORD_TOO_LONG") return "password";
  if (code === "INVALID_NAME") return "name";
  return "form";
}

export function SignUpForm({ capturedMail }: { capturedMail: boolean }) {
  const [values, setValues] = useState({ name: "", email: "", password: "" });
  const [errors, setErrors] = useState<Errors>({});
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const parsed = signUpSchema.safeParse(values);
    if (!parsed.success) {
      setErrors(fieldErrors(parsed.error));
      return;
    }
    setErrors({});
    setBusy(true);
    const { error } = await authClient.signUp.email({ ...parsed.data, callbackURL: VERIFIED_CALLBACK });
    setBusy(false);
    if (error !== null) {
      setErrors({ [fieldOf(error.code)]: authErrorMessage(error) });
      return;
    }
    setSentTo(parsed.data.email);
  }

  if (sentTo !== null) {
    return (
      <div className="flex flex-col gap-4" data-testid="sign-up-done">
        <Notice tone="success" title="Check your inbox">
          We sent a link to <strong className="text-ink">{sentTo}</strong>. Open it to confirm the address, then sign in. The link expires in one hour.
        </Notice>
        {capturedMail ? (
          <p className="text-sm text-ink-soft">
            This server keeps outgoing mail instead of sending it.{" "}
            <Link href="/dev/mail" className="rp-link font-semibold">
              Open the captured mail
            </Link>{" "}
            to find your link.
          </p>
        ) : null}
      </div>
    );
  }

  const set = (k: keyof typeof values) => (e: React.ChangeEvent<HTMLInputElement>) => setValues((v) => ({ ...v, [k]: e.target.value }));
  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      {errors.form === undefined ? null : <Notice tone="error" title={errors.form} />}
      <Field label="Name" name="name" autoComplete="name" required value={values.name} onChange={set("name")} error={errors.name} hint="Shown as the depositor of your models." />
      <Field label="E-mail address" name="email" type="email" autoComplete="email" required value={values.email} onChange={set("email")} error={errors.email} />
      <Field
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        value={values.password}
        onChange={set("password")}
        error={errors.password}
        hint={`At least ${PASSWORD_MIN} characters. A few unrelated words work well.`}
      />
      <Button type="submit" disabled={busy}>
        {busy ? "Creating your account…" : "Create account"}
      </Button>
    </form>
  );
}
