/** Sign-up, the verification mail and its link, sign-in, session cookies, password reset. */
import "./app-env";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { user } from "@/db/schema";
import { MESSAGES } from "@/lib/account-rules";
import { linksIn } from "@/lib/captured-mail";
import { stopFakeSmtp } from "@/lib/fake-smtp";
import { readMailbox, MAILBOX_COOKIE } from "@/lib/mailbox";
import { authCall, cookieHeader, freshIp, PASSWORD, ready, uniqueEmail, waitForMail } from "./app-support";

beforeAll(ready);
afterAll(stopFakeSmtp);

async function errorOf(res: Response): Promise<{ code?: string; message?: string }> {
  return (await res.json()) as { code?: string; message?: string };
}

describe("sign-up refusals say what is wrong", () => {
  it("refuses a malformed address", async () => {
    const res = await authCall("POST", "/sign-up/email", { body: { name: "Ana", email: "ana.example.org", password: PASSWORD }, ip: freshIp() });
    expect(res.status).toBe(400);
    expect(await errorOf(res)).toMatchObject({ code: "INVALID_EMAIL", message: MESSAGES.emailMalformed });
  });

  it("refuses a short password", async () => {
    const res = await authCall("POST", "/sign-up/email", { body: { name: "Ana", email: uniqueEmail("ana"), password: "short1" }, ip: freshIp() });
    expect(res.status).toBe(400);
    expect(await errorOf(res)).toMatchObject({ code: "WEAK_PASSWORD", message: MESSAGES.passwordShort });
  });

  it("refuses a common password", async () => {
    const res = await authCall("POST", "/sign-up/email", { body: { name: "Ana", email: uniqueEmail("ana"), password: "password123" }, ip: freshIp() });
    expect(res.status).toBe(400);
    expect(await errorOf(res)).toMatchObject({ code: "WEAK_PASSWORD", message: MESSAGES.passwordCommon });
  });

  it("refuses a password that contains the address", async () => {
    const res = await authCall("POST", "/sign-up/email", { body: { name: "Ana", email: "marisol@example.test", password: "marisol-2026-x" }, ip: freshIp() });
    expect(res.status).toBe(400);
    expect(await errorOf(res)).toMatchObject({ code: "WEAK_PASSWORD", message: MESSAGES.passwordHasEmail });
  });

  it("refuses an empty name", async () => {
    const res = await authCall("POST", "/sign-up/email", { body: { name: "  ", email: uniqueEmail("ana"), password: PASSWORD }, ip: freshIp() });
    expect(res.status).toBe(400);
    expect(await errorOf(res)).toMatchObject({ code: "INVALID_NAME", message: MESSAGES.nameMissing });
  });

  it("says plainly that an address is taken, whatever its case", async () => {
    const email = uniqueEmail("taken");
    const ip = freshIp();
    expect((await authCall("POST", "/sign-up/email", { body: { name: "First", email, password: PASSWORD }, ip })).status).toBe(200);
    const res = await authCall("POST", "/sign-up/email", { body: { name: "Second", email: email.toUpperCase(), password: PASSWORD }, ip });
    expect(res.status).toBe(422);
    expect(await errorOf(res)).toMatchObject({ code: "EMAIL_TAKEN", message: MESSAGES.emailTaken });
    const rows = await db.select().from(user).where(eq(user.email, email));
    expect(rows).toHaveLength(1);
  });
});

describe("verification by mail", () => {
  it("sends a link that confirms the address, after which sign-in works with safe cookies", async () => {
    const email = uniqueEmail("newcomer");
    const ip = freshIp();
    const before = new Date(Date.now() - 1000);
    const up = await authCall("POST", "/sign-up/email", { body: { name: "Newcomer", email, password: PASSWORD, callbackURL: "/verify-email?confirmed=1" }, ip });
    expect(up.status).toBe(200);
    // The new account starts as an author, unconfirmed.
    const [row] = await db.select().from(user).where(eq(user.email, email));
    expect(row?.role).toBe("author");
    expect(row?.emailVerified).toBe(false);
    // The browser that signed up may read its own mail on the captured-mail page.
    const mailboxCookie = up.headers.getSetCookie().find((c) => c.startsWith(`${MAILBOX_COOKIE}=`));
    expect(mailboxCookie).toMatch(/HttpOnly/i);
    expect(readMailbox(mailboxCookie?.split(";")[0]?.slice(MAILBOX_COOKIE.length + 1))).toBe(email);

    // Not yet: an unconfirmed address cannot sign in.
    const early = await authCall("POST", "/sign-in/email", { body: { email, password: PASSWORD }, ip });
    expect(early.status).toBe(403);
    expect(await errorOf(early)).toMatchObject({ code: "EMAIL_NOT_VERIFIED" });

    const mail = await waitForMail(email, { after: before });
    expect(mail.subject).toBe("Confirm your e-mail address for Restpoint");
    expect(mail.text).toContain("Hello Newcomer,");
    const link = linksIn(mail).find((l) => l.includes("/api/auth/verify-email"));
    expect(link).toBeDefined();

    const visit = await authCall("GET", link ?? "", { ip });
    expect(visit.status).toBe(302);
    expect(visit.headers.get("location")).toBe("/verify-email?confirmed=1");
    const [after] = await db.select().from(user).where(eq(user.email, email));
    expect(after?.emailVerified).toBe(true);

    const signIn = await authCall("POST", "/sign-in/email", { body: { email, password: PASSWORD }, ip });
    expect(signIn.status).toBe(200);
    const session = signIn.headers.getSetCookie().find((c) => c.startsWith("better-auth.session_token="));
    expect(session).toBeDefined();
    expect(session).toMatch(/;\s*HttpOnly/i);
    expect(session).toMatch(/;\s*SameSite=Lax/i);
    expect(session).toMatch(/;\s*Path=\//i);

    const me = await authCall("GET", "/get-session", { cookie: cookieHeader(signIn), ip });
    expect(((await me.json()) as { user: { email: string } }).user.email).toBe(email);
  });

  it("sends a tampered link back with an error instead of confirming", async () => {
    const res = await authCall("GET", `/verify-email?token=not-a-real-token&callbackURL=${encodeURIComponent("/verify-email?confirmed=1")}`, { ip: freshIp() });
    expect(res.status).toBe(302);
    expect(res.headers.get("location")).toContain("error=INVALID_TOKEN");
  });
});

describe("password reset by mail", () => {
  it("mails a link; a weak new password is refused, a good one replaces the old", async () => {
    const email = uniqueEmail("forgetful");
    const ip = freshIp();
    await authCall("POST", "/sign-up/email", { body: { name: "Forgetful", email, password: PASSWORD }, ip });
    await db.update(user).set({ emailVerified: true }).where(eq(user.email, email));

    const before = new Date(Date.now() - 1000);
    const req = await authCall("POST", "/request-password-reset", { body: { email, redirectTo: "/reset-password" }, ip });
    expect(req.status).toBe(200);
    const mail = await waitForMail(email, { after: before });
    expect(mail.subject).toBe("Set a new Restpoint password");
    const link = linksIn(mail).find((l) => l.includes("/api/auth/reset-password/"));
    expect(link).toBeDefined();
    const visit = await authCall("GET", link ?? "", { ip });
    expect(visit.status).toBe(302);
    const location = new URL(visit.headers.get("location") ?? "", "http://localhost:3000");
    expect(location.pathname).toBe("/reset-password");
    const token = location.searchParams.get("token") ?? "";
    expect(token).not.toBe("");

    const weak = await authCall("POST", "/reset-password", { body: { token, newPassword: "tiny" }, ip });
    expect(weak.status).toBe(400);
    expect(await errorOf(weak)).toMatchObject({ code: "WEAK_PASSWORD", message: MESSAGES.passwordShort });

    const newPassword = "tern-colony-autumn-7";
    expect((await authCall("POST", "/reset-password", { body: { token, newPassword }, ip })).status).toBe(200);
    expect((await authCall("POST", "/sign-in/email", { body: { email, password: PASSWORD }, ip })).status).toBe(401);
    expect((await authCall("POST", "/sign-in/email", { body: { email, password: newPassword }, ip })).status).toBe(200);
  });
});
