import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/ui/PageHeader";
import { pageRole } from "@/lib/authz";
import { listCapturedMail } from "@/lib/captured-mail";
import { env } from "@/lib/env";
import { countAccountsByRole } from "@/lib/users";
import { listVenues, summarizeVenues } from "@/lib/venues";

export const metadata: Metadata = { title: "Administration" };

/** Most captured messages the overview counts one by one; beyond it the card says "more than". */
const MAIL_COUNT_CAP = 100;

function count(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

export default async function AdminHome() {
  await pageRole("admin");
  const counts = await countAccountsByRole();
  // One row past the cap tells "exactly 100" apart from "more than 100".
  const mail = await listCapturedMail({ limit: MAIL_COUNT_CAP + 1 });
  const venues = await summarizeVenues(await listVenues());
  const total = counts.author + counts.editor + counts.admin;
  const awaiting = venues.reduce((sum, v) => sum + v.awaitingDecision, 0);
  const mailCount = mail.length > MAIL_COUNT_CAP ? `${MAIL_COUNT_CAP}+` : String(mail.length);
  return (
    <div className="flex flex-col gap-8">
      <PageHeader overline="Administration" title="This server" lede="Accounts and roles, venues and their editors, and the mail the server has sent." />
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <Link href="/admin/accounts" className="rp-card flex flex-col gap-1 p-5 hover:border-tide">
          <span className="text-sm font-semibold text-tide">Accounts</span>
          <span className="font-mono text-3xl">{total}</span>
          <span className="text-sm text-ink-soft">
            {count(counts.author, "author", "authors")} · {count(counts.editor, "editor", "editors")} · {count(counts.admin, "administrator", "administrators")}
          </span>
        </Link>
        <Link href="/admin/venues" className="rp-card flex flex-col gap-1 p-5 hover:border-tide">
          <span className="text-sm font-semibold text-tide">Venues</span>
          <span className="font-mono text-3xl">{venues.length}</span>
          <span className="text-sm text-ink-soft">
            {venues.length === 0 ? "Create a venue and assign its editors." : `${count(awaiting, "model awaits", "models await")} a decision.`}
          </span>
        </Link>
        <Link href="/admin/mail" className="rp-card flex flex-col gap-1 p-5 hover:border-tide">
          <span className="text-sm font-semibold text-tide">Captured mail</span>
          <span className="font-mono text-3xl">{mailCount}</span>
          <span className="text-sm text-ink-soft">
            {count(mail.length > MAIL_COUNT_CAP ? MAIL_COUNT_CAP : mail.length, "message", "messages")}
            {mail.length > MAIL_COUNT_CAP ? " or more" : ""}. {env.useFakeSmtp ? "Mail is kept by the local fake SMTP server." : "A real SMTP server sends mail; nothing new is captured."}
          </span>
        </Link>
      </div>
    </div>
  );
}
