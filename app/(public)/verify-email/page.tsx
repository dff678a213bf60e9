import type { Metadata } from "next";
import { FormCard } from "@/components/layout/Shell";
import { ButtonLink } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { ResendVerification } from "./ResendVerification";

export const metadata: Metadata = { title: "Confirm your e-mail address" };

export default async function VerifyEmailPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const error = typeof params.error === "string" ? params.error : null;
  if (params.confirmed === "1" && error === null) {
    return (
      <FormCard title="Address confirmed">
        <Notice tone="success" title="Your e-mail address is confirmed.">
          Your account is ready. Sign in to open your workspace.
        </Notice>
        <ButtonLink href="/sign-in">Sign in</ButtonLink>
      </FormCard>
    );
  }
  const problem =
    error === "TOKEN_EXPIRED"
      ? "This confirmation link has expired."
      : error === null
        ? null
        : "This confirmation link is not valid. It may have been used already or copied incompletely.";
  return (
    <FormCard title="Confirm your e-mail address" lede="Open the link in the message we sent when you created your account. Need a new one? Enter your address.">
      {problem === null ? null : <Notice tone="error" title={problem}>Ask for a new link below.</Notice>}
      <ResendVerification />
    </FormCard>
  );
}
