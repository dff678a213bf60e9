/**
 * better-auth in the browser: sign-up, sign-in, sign-out, password reset. Role checks never
 * happen here (see lib/authz.ts); this only sends the forms.
 */
"use client";
import { createAuthClient } from "better-auth/react";

export const authClient = createAuthClient();

/** Where the verification link lands after better-auth confirmed the address. */
export const VERIFIED_CALLBACK = "/verify-email?confirmed=1";

/** better-auth error codes the forms turn into our own sentences (lib/account-rules.ts has the rest). */
export function authErrorMessage(error: { code?: string; message?: string; status?: number } | null): string {
  if (error === null) return "";
  if (error.status === 429) return "Too many attempts from this connection. Wait a minute, then try again.";
  switch (error.code) {
    case "INVALID_EMAIL_OR_PASSWORD":
      return "That e-mail address and password do not match an account.";
    case "EMAIL_NOT_VERIFIED":
      return "Confirm your e-mail address first: we have just sent you a new link.";
    case "INVALID_TOKEN":
      return "This link is no longer valid. Ask for a new one.";
    case "USER_ALREADY_EXISTS":
    case "USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL":
      return "An account with this e-mail address already exists. Sign in, or reset your password if you forgot it.";
    case "BANNED_USER":
      return "This account has been suspended. Contact the registry's administrators.";
    default:
      return error.message !== undefined && error.message !== "" ? error.message : "That did not work. Please try again.";
  }
}
