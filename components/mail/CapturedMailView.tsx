/**
 * Captured mail as a list and one open message. Only the text part is shown (an HTML body
 * from the outside is never rendered); links in it are clickable.
 */
import Link from "next/link";
import { MailIcon } from "@/components/status/icons";
import { EmptyState } from "@/components/ui/EmptyState";
import type { CapturedMail } from "@/lib/captured-mail";

const when = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "medium", timeZone: "UTC" });

function Linked({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s<>"')]+)/g);
  return (
    <pre className="whitespace-pre-wrap break-words font-sans text-sm leading-relaxed text-ink">
      {parts.map((p, i) =>
        /^https?:\/\//.test(p) ? (
          <a key={i} href={p} className="rp-link break-all" data-testid="mail-link">
            {p}
          </a>
        ) : (
          <span key={i}>{p}</span>
        ),
      )}
    </pre>
  );
}

export function CapturedMailView({ mails, selected, basePath, emptyText }: { mails: CapturedMail[]; selected: CapturedMail | null; basePath: string; emptyText: string }) {
  if (mails.length === 0) {
    return <EmptyState title="No mail captured yet.">{emptyText}</EmptyState>;
  }
  const open = selected ?? mails[0] ?? null;
  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(16rem,22rem)_minmax(0,1fr)]">
      <ul className="flex min-w-0 flex-col gap-1" aria-label="Messages, newest first" data-testid="mail-list">
        {mails.map((m) => {
          const active = open?.id === m.id;
          return (
            <li key={m.id}>
              <Link
                href={`${basePath}?id=${encodeURIComponent(m.id)}`}
                aria-current={active ? "true" : undefined}
                className={`flex flex-col gap-0.5 rounded-[var(--radius-control)] border px-3 py-2 ${active ? "border-tide bg-tide-wash" : "border-transparent hover:border-line hover:bg-surface"}`}
              >
                <span className="truncate text-sm font-semibold text-ink">{m.subject === "" ? "(no subject)" : m.subject}</span>
                <span className="truncate text-xs text-ink-soft">To {m.to}</span>
                <span className="text-2xs text-ink-faint">{when.format(m.receivedAt)} UTC</span>
              </Link>
            </li>
          );
        })}
      </ul>
      {open === null ? null : (
        <article className="rp-card flex min-w-0 flex-col gap-4 p-6" data-testid="mail-message">
          <header className="flex flex-col gap-1 border-b border-line pb-4">
            <h2 className="flex items-center gap-2 text-lg font-semibold">
              <MailIcon className="size-4 text-tide" />
              {open.subject === "" ? "(no subject)" : open.subject}
            </h2>
            <p className="text-xs text-ink-soft">
              From {open.from} · To {open.to} · {when.format(open.receivedAt)} UTC
            </p>
          </header>
          <Linked text={open.text === "" ? "(This message has no text part.)" : open.text} />
        </article>
      )}
    </div>
  );
}
