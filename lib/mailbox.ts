/**
 * The captured-mail page (development and demo only) must show a visitor who has just signed
 * up their verification mail before they can sign in. Sign-up sets this signed cookie naming
 * the new address; the page then shows that visitor the mail sent to that address and nothing
 * else. Signed with the auth secret, so a visitor cannot name someone else's address.
 */
import "server-only";
import { createHmac, timingSafeEqual } from "node:crypto";
import { env } from "@/lib/env";

export const MAILBOX_COOKIE = "rp_mailbox";
export const MAILBOX_MAX_AGE_SECONDS = 60 * 60 * 24;

function signature(email: string): string {
  return createHmac("sha256", env.authSecret).update(`mailbox:${email}`).digest("base64url");
}

export function signMailbox(email: string): string {
  const address = email.trim().toLowerCase();
  return `${Buffer.from(address).toString("base64url")}.${signature(address)}`;
}

/** The address in a cookie value, or null when it is missing or its signature is wrong. */
export function readMailbox(value: string | undefined): string | null {
  if (value === undefined) return null;
  const [encoded, sig] = value.split(".");
  if (encoded === undefined || sig === undefined) return null;
  const address = Buffer.from(encoded, "base64url").toString("utf8");
  const expected = Buffer.from(signature(address));
  const given = Buffer.from(sig);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) return null;
  return address;
}
