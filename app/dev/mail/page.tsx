/**
 * Development and demo only (when the fake SMTP server is in use): the mail this server sent.
 * Signed-in users see every captured message; a visitor who has just signed up in this
 * browser sees the mail sent to their new address (lib/mailbox.ts), so they can confirm it.
 */
import type { Metadata } from "next";
import { cookies } from "next/headers";
import { notFound, unauthorized } from "next/navigation";
import { connection } from "next/server";
import { CapturedMailView } from "@/components/mail/CapturedMailView";
import { Notice } from "@/components/ui/Notice";
import { PageHeader } from "@/components/ui/PageHeader";
import { getActor } from "@/lib/authz";
import { getCapturedMail, listCapturedMail } from "@/lib/captured-mail";
import { env } from "@/lib/env";
import { MAILBOX_COOKIE, readMailbox } from "@/lib/mailbox";

export const metadata: Metadata = { title: "Captured mail" };

export default async function DevMailPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  // Decided per request: a build (no demo flag, production mode) must not bake in the 404.
  await connection();
  if (!env.useFakeSmtp) notFound();
  const actor = await getActor();
  const mailbox = actor === null ? readMailbox((await cookies()).get(MAILBOX_COOKIE)?.value) : null;
  if (actor === null && mailbox === null) unauthorized();
  const params = await searchParams;
  const mails = await listCapturedMail({ to: mailbox ?? undefined, limit: 100 });
  const requested = typeof params.id === "string" ? await getCapturedMail(params.id) : null;
  // A visitor who is not signed in may open only the messages listed for them.
  const selected = requested !== null && mails.some((m) => m.id === requested.id) ? requested : null;
  return (
    <div className="flex flex-col gap-6">
        <PageHeader
          overline="Development"
          title="Captured mail"
          lede="This server is not connected to a real mail server: it keeps what it sends here instead. Open a message to follow its link."
        />
        {mailbox === null ? null : (
          <Notice tone="info" title={`Showing mail to ${mailbox}`}>
            You created this account in this browser. Once you have confirmed the address and signed in, you will see all captured mail here.
          </Notice>
        )}
        <CapturedMailView mails={mails} selected={selected} basePath="/dev/mail" emptyText="Nothing has been sent yet. A sign-up or a password reset sends a message." />
    </div>
  );
}
