"use client";
/** Create (shown once), list and revoke personal API tokens. */
import { useRouter } from "next/navigation";
import { useEffect, useState, useTransition } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import type { ApiTokenInfo } from "@/lib/api-tokens";

export type TokenActionResult = { ok: true; token: string | null; info: ApiTokenInfo } | { ok: false; message: string };

export interface TokenManagerProps {
  tokens: ApiTokenInfo[];
  /** The site's address, for the usage example. */
  origin: string;
  create: (name: string) => Promise<TokenActionResult>;
  revoke: (id: string) => Promise<TokenActionResult>;
}

function when(iso: string | null): string {
  return iso === null ? "never" : `${new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" })} UTC`;
}

export function TokenManager({ tokens, origin, create, revoke }: TokenManagerProps) {
  const router = useRouter();
  const [name, setName] = useState("");
  const [error, setError] = useState<string | undefined>(undefined);
  const [fresh, setFresh] = useState<{ token: string; name: string } | null>(null);
  const [copied, setCopied] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();
  // Shown at once from the action's answer; the server's list replaces it after the refresh.
  const [list, setList] = useState(tokens);
  useEffect(() => setList(tokens), [tokens]);

  function submit(e: React.FormEvent) {
    e.preventDefault();
    if (name.trim() === "") {
      setError("Give the token a name (what will use it).");
      return;
    }
    setError(undefined);
    startTransition(async () => {
      const r = await create(name);
      if (!r.ok) {
        setError(r.message);
        return;
      }
      setFresh(r.token === null ? null : { token: r.token, name: r.info.name });
      setList((prev) => [r.info, ...prev.filter((t) => t.id !== r.info.id)]);
      setCopied(false);
      setNotice(null);
      setName("");
      router.refresh();
    });
  }

  function onRevoke(t: ApiTokenInfo) {
    startTransition(async () => {
      const r = await revoke(t.id);
      if (r.ok) setList((prev) => prev.map((x) => (x.id === r.info.id ? r.info : x)));
      setNotice(r.ok ? `The token “${r.info.name}” was revoked; requests with it are now refused.` : r.message);
      router.refresh();
    });
  }

  async function copy(text: string) {
    try {
      await navigator.clipboard.writeText(text);
      setCopied(true);
    } catch {
      setCopied(false);
    }
  }

  const active = list.filter((t) => t.revokedAt === null);
  const revoked = list.filter((t) => t.revokedAt !== null);
  return (
    <div className="flex flex-col gap-8">
      {fresh !== null && (
        <div className="flex flex-col gap-3 rounded-[var(--radius-card)] border border-confirmed/40 bg-confirmed-wash p-5" data-testid="new-token">
          <p className="font-semibold">Your new token “{fresh.name}”. Copy it now: it is shown only this once.</p>
          <div className="flex flex-wrap items-center gap-2">
            <code className="rounded bg-surface px-2 py-1 font-mono text-sm break-all" data-testid="new-token-value">
              {fresh.token}
            </code>
            <Button type="button" kind="secondary" onClick={() => void copy(fresh.token)}>
              {copied ? "Copied" : "Copy"}
            </Button>
          </div>
          <p className="text-sm text-ink-soft">Use it as a bearer token, for example:</p>
          <pre role="region" aria-label="Example request with the token" tabIndex={0} className="overflow-x-auto rounded bg-surface p-3 font-mono text-xs">
            {`curl -H "Authorization: Bearer ${fresh.token}" \\\n     -H "Content-Type: application/json" \\\n     --data-binary @model.json \\\n     ${origin}/api/v1/models/<slug>/versions`}
          </pre>
        </div>
      )}
      {notice !== null && <Notice tone="info" title={notice} />}

      <form onSubmit={submit} noValidate className="rp-card flex flex-col gap-4 p-5 sm:flex-row sm:items-start">
        <div className="flex-1">
          <Field
            label="Name of a new token"
            name="token-name"
            value={name}
            onChange={(e) => setName(e.target.value)}
            error={error}
            hint="What will use it, e.g. “lab CI” or “upload script on my laptop”."
            maxLength={100}
          />
        </div>
        <Button type="submit" disabled={pending} className="sm:mt-7">
          Create token
        </Button>
      </form>

      <section aria-labelledby="active-tokens" className="flex flex-col gap-3">
        <h2 id="active-tokens" className="text-xl font-semibold">
          Active tokens
        </h2>
        {active.length === 0 ? (
          <p className="text-sm text-ink-soft">You have no active token.</p>
        ) : (
          <ul className="divide-y divide-line rounded-[var(--radius-card)] border border-line" data-testid="active-tokens">
            {active.map((t) => (
              <li key={t.id} className="flex flex-wrap items-center justify-between gap-3 px-4 py-3">
                <div className="min-w-0">
                  <p className="font-medium">{t.name}</p>
                  <p className="text-xs text-ink-faint">
                    <span className="font-mono">{t.prefix}…</span> · created {when(t.createdAt)} · last used {when(t.lastUsedAt)}
                  </p>
                </div>
                <Button type="button" kind="danger" disabled={pending} onClick={() => onRevoke(t)} aria-label={`Revoke the token ${t.name}`}>
                  Revoke
                </Button>
              </li>
            ))}
          </ul>
        )}
      </section>

      {revoked.length > 0 && (
        <section aria-labelledby="revoked-tokens" className="flex flex-col gap-3">
          <h2 id="revoked-tokens" className="text-base font-semibold text-ink-soft">
            Revoked
          </h2>
          <ul className="flex flex-col gap-1 text-sm text-ink-faint" data-testid="revoked-tokens">
            {revoked.map((t) => (
              <li key={t.id}>
                <span className="line-through">{t.name}</span> <span className="font-mono">{t.prefix}…</span> · revoked {when(t.revokedAt)}
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}
