import type { Metadata } from "next";
import { CapturedMailView } from "@/components/mail/CapturedMailView";
import { PageHeader } from "@/components/ui/PageHeader";
import { pageRole } from "@/lib/authz";
import { getCapturedMail, listCapturedMail } from "@/lib/captured-mail";

export const metadata: Metadata = { title: "Captured mail" };

export default async function AdminMailPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await pageRole("admin");
  const params = await searchParams;
  const mails = await listCapturedMail({ limit: 200 });
  const selected = typeof params.id === "string" ? await getCapturedMail(params.id) : null;
  return (
    <div className="flex flex-col gap-6">
      <PageHeader overline="Administration" title="Captured mail" lede="Messages this server sent to the local fake SMTP server, newest first." />
      <CapturedMailView mails={mails} selected={selected} basePath="/admin/mail" emptyText="Messages appear here when someone signs up or asks for a new password." />
    </div>
  );
}
