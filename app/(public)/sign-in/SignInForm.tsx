"use client";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { authClient, authErrorMessage } from "@/lib/auth-client";

interface DemoAccount {
  role: string;
  name: string;
  email: string;
  password: string;
}

export function SignInForm({ next, demoAccounts }: { next: string; demoAccounts: DemoAccount[] }) {
  const router = useRouter();
  const [email, setEmail] = useState("");
  const [password, setPassword] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setError(null);
    setBusy(true);
    const { error: failure } = await authClient.signIn.email({ email: email.trim(), password });
    if (failure !== null) {
      setBusy(false);
      setError(authErrorMessage(failure));
      return;
    }
    router.push(next);
    router.refresh();
  }

  return (
    <>
      <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
        {error === null ? null : <Notice tone="error" title={error} />}
        <Field label="E-mail address" name="email" type="email" autoComplete="email" required value={email} onChange={(e) => setEmail(e.target.value)} />
        <Field label="Password" name="password" type="password" autoComplete="current-password" required value={password} onChange={(e) => setPassword(e.target.value)} />
        <Button type="submit" disabled={busy}>
          {busy ? "Signing in…" : "Sign in"}
        </Button>
        <Link href="/forgot-password" className="rp-link self-start text-sm">
          Forgot your password?
        </Link>
      </form>
      {demoAccounts.length === 0 ? null : (
        <div className="flex flex-col gap-2 border-t border-line pt-4" data-testid="demo-accounts">
          <p className="text-xs font-semibold uppercase tracking-wider text-ink-faint">Demo accounts (development only)</p>
          <ul className="flex flex-col gap-2.5">
            {demoAccounts.map((a) => (
              <li key={a.email} className="flex items-center justify-between gap-3">
                <span className="flex min-w-0 flex-col">
                  <span className="text-sm font-semibold capitalize">{a.role}</span>
                  {/* Each on its own line and wrapped, never cut: people copy them by hand. */}
                  <span className="font-mono text-xs break-all text-ink-soft">{a.email}</span>
                  <span className="font-mono text-xs break-all text-ink-soft">
                    <span className="sr-only">password </span>
                    {a.password}
                  </span>
                </span>
                <button
                  type="button"
                  aria-label={`Fill in the demo ${a.role} account`}
                  className="shrink-0 rounded-[var(--radius-control)] border border-line-strong px-2.5 py-1 text-xs font-semibold text-tide hover:border-tide hover:bg-tide-wash"
                  onClick={() => {
                    setEmail(a.email);
                    setPassword(a.password);
                  }}
                >
                  Use
                </button>
              </li>
            ))}
          </ul>
        </div>
      )}
    </>
  );
}
