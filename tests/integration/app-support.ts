/**
 * Helpers for the app frame's integration tests: requests to better-auth's HTTP handler as a
 * browser would send them, waiting for captured mail, and accounts in each role.
 * Import ./app-env first.
 */
import { eq } from "drizzle-orm";
import { migrateDatabase } from "@/db/migrate";
import { db } from "@/db/client";
import { user, type Role } from "@/db/schema";
import type { CapturedMail } from "@/lib/captured-mail";

export const ORIGIN = "http://localhost:3000";

let migrated: Promise<void> | null = null;
export function ready(): Promise<void> {
  migrated ??= migrateDatabase();
  return migrated;
}

/** A different client address per caller keeps rate-limit buckets of separate tests apart. */
let ipCounter = 10;
export function freshIp(): string {
  ipCounter += 1;
  return `198.51.100.${ipCounter}`;
}

export async function authCall(method: "GET" | "POST", path: string, options: { body?: unknown; ip?: string; cookie?: string } = {}): Promise<Response> {
  const { auth } = await import("@/lib/auth");
  const headers = new Headers({ origin: ORIGIN, "x-forwarded-for": options.ip ?? "203.0.113.1" });
  if (options.body !== undefined) headers.set("content-type", "application/json");
  if (options.cookie !== undefined) headers.set("cookie", options.cookie);
  const url = path.startsWith("http") ? path : `${ORIGIN}/api/auth${path}`;
  return auth.handler(new Request(url, { method, headers, body: options.body === undefined ? undefined : JSON.stringify(options.body) }));
}

/** `name=value; name2=value2` from a response's Set-Cookie headers. */
export function cookieHeader(res: Response): string {
  return res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0] ?? "")
    .join("; ");
}

/** Polls captured_mail for the newest message to `address` (the fake SMTP stores it asynchronously). */
export async function waitForMail(address: string, options: { after?: Date; timeoutMs?: number } = {}): Promise<CapturedMail> {
  const { listCapturedMail } = await import("@/lib/captured-mail");
  const deadline = Date.now() + (options.timeoutMs ?? 10_000);
  while (Date.now() < deadline) {
    const [m] = await listCapturedMail({ to: address, limit: 1 });
    if (m !== undefined && (options.after === undefined || m.receivedAt >= options.after)) return m;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no mail to ${address} within the time limit`);
}

export const PASSWORD = "salt-marsh-heron-41";

let n = 0;
export function uniqueEmail(prefix: string): string {
  n += 1;
  return `${prefix}-${n}-${crypto.randomUUID().slice(0, 6)}@example.test`;
}

/** Signs up through the HTTP handler, marks the address verified, signs in; returns the session cookie. */
export async function accountIn(role: Role, name = `Test ${role}`): Promise<{ id: string; email: string; cookie: string }> {
  const email = uniqueEmail(role);
  const ip = freshIp();
  const up = await authCall("POST", "/sign-up/email", { body: { name, email, password: PASSWORD }, ip });
  if (up.status !== 200) throw new Error(`sign-up failed: ${up.status} ${await up.text()}`);
  await db.update(user).set({ emailVerified: true, role }).where(eq(user.email, email));
  const res = await authCall("POST", "/sign-in/email", { body: { email, password: PASSWORD }, ip });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${await res.text()}`);
  const [row] = await db.select({ id: user.id }).from(user).where(eq(user.email, email));
  if (row === undefined) throw new Error("no user row");
  return { id: row.id, email, cookie: cookieHeader(res) };
}
