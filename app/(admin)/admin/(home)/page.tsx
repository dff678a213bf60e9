import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/ui/PageHeader";
import { pageRole } from "@/lib/authz";
import { listCapturedMail } from "@/lib/captured-mail";
import { env } from "@/lib/env";
import { countAccountsByRole } from "@/lib/users";

export const metadata: Metadata = { title: "Administration" };

export default async function AdminHome() {
  await pageRole("admin");
  const counts = await countAccountsByRole();
  const recentMail = await listCapturedMail({ limit: 5 });
  const total = counts.author + counts.editor + counts.admin;
  return (
    <div className="flex flex-col gap-8">
      <PageHeader overline="Administration" title="This server" lede="Accounts and roles, and the mail the server has sent." />
      <div className="grid gap-4 sm:grid-cols-2">
        <Link href="/admin/accounts" className="rp-card flex flex-col gap-1 p-5 hover:border-tide">
          <span className="text-sm font-semibold text-tide">Accounts</span>
          <span className="font-mono text-3xl">{total}</span>
          <span className="text-sm text-ink-soft">
            {counts.author} authors · {counts.editor} editors · {counts.admin} administrators
          </span>
        </Link>
        <Link href="/admin/mail" className="rp-card flex flex-col gap-1 p-5 hover:border-tide">
          <span className="text-sm font-semibold text-tide">Captured mail</span>
          <span className="font-mono text-3xl">{recentMail.length === 5 ? "5+" : recentMail.length}</span>
          <span className="text-sm text-ink-soft">{env.useFakeSmtp ? "Mail is kept by the local fake SMTP server." : "A real SMTP server sends mail; nothing new is captured."}</span>
        </Link>
      </div>
    </div>
  );
}
