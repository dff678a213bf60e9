"use client";
import { EmailLinkForm } from "@/components/account/EmailLinkForm";
import { Notice } from "@/components/ui/Notice";
import { authClient, VERIFIED_CALLBACK } from "@/lib/auth-client";

export function ResendVerification() {
  return (
    <EmailLinkForm
      send={(email) => authClient.sendVerificationEmail({ email, callbackURL: VERIFIED_CALLBACK })}
      submitLabel="Send a new link"
      kind="secondary"
      sent={<Notice tone="success" title="If that address has an unconfirmed account, a new link is on its way." />}
    />
  );
}
