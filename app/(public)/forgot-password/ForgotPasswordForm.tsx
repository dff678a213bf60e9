"use client";
import { EmailLinkForm } from "@/components/account/EmailLinkForm";
import { Notice } from "@/components/ui/Notice";
import { authClient } from "@/lib/auth-client";

export function ForgotPasswordForm() {
  return (
    <EmailLinkForm
      send={(email) => authClient.requestPasswordReset({ email, redirectTo: "/reset-password" })}
      submitLabel="Send the link"
      sent={
        <Notice tone="success" title="Check your inbox">
          If an account uses that address, a link for choosing a new password is on its way. It expires in one hour.
        </Notice>
      }
    />
  );
}
