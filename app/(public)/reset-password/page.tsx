import type { Metadata } from "next";
import { FormCard } from "@/components/layout/Shell";
import { ButtonLink } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { ResetPasswordForm } from "./ResetPasswordForm";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const token = typeof params.token === "string" ? params.token : null;
  if (token === null || typeof params.error === "string") {
    return (
      <FormCard title="Choose a new password">
        <Notice tone="error" title="This reset link is not valid.">
          It may have expired, been used already, or been copied incompletely.
        </Notice>
        <ButtonLink href="/forgot-password" kind="secondary">
          Ask for a new link
        </ButtonLink>
      </FormCard>
    );
  }
  return (
    <FormCard title="Choose a new password" lede="After this, sign in with the new password. Other signed-in browsers are signed out.">
      <ResetPasswordForm token={token} />
    </FormCard>
  );
}
