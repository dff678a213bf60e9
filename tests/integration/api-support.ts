/**
 * Helpers for the deposit API tests: accounts with personal API tokens or browser sessions,
 * and requests built the way Next hands them to route handlers. Import ./deposit-env first.
 */
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { apiToken, user } from "@/db/schema";
import { newApiToken } from "@/lib/token-hash";
import { makeUser } from "./deposit-support";

export const BASE = "http://localhost:3000";

export interface TestAccount {
  id: string;
  role: string;
  email: string;
  token: string;
  tokenId: string;
}

/** An account with one live API token (inserted directly: token creation has its own tests). */
export async function accountWithToken(name: string, role: "author" | "editor" | "admin" = "author"): Promise<TestAccount> {
  const u = await makeUser(name, role);
  const t = newApiToken();
  const tokenId = crypto.randomUUID();
  await db.insert(apiToken).values({ id: tokenId, userId: u.id, name: "tests", prefix: t.prefix, tokenHash: t.tokenHash });
  return { ...u, token: t.token, tokenId };
}

/** A browser session cookie for `email`, through better-auth's own sign-up and sign-in. */
export async function sessionCookie(name: string): Promise<{ cookie: string; userId: string }> {
  const { auth } = await import("@/lib/auth");
  const email = `${name.toLowerCase()}-${crypto.randomUUID().slice(0, 8)}@example.test`;
  const password = "correct horse battery staple 42";
  await auth.api.signUpEmail({ body: { name, email, password } });
  // Verification is by mail link; the tests mark the address verified directly.
  await db.update(user).set({ emailVerified: true }).where(eq(user.email, email));
  const res = await auth.api.signInEmail({ body: { email, password }, asResponse: true });
  const cookies = res.headers.getSetCookie().map((c) => c.split(";")[0] ?? "");
  const rows = await db.select({ id: user.id }).from(user).where(eq(user.email, email));
  const userId = rows[0]?.id;
  if (userId === undefined) throw new Error("sign-up made no user row");
  return { cookie: cookies.join("; "), userId };
}

export interface Auth {
  token?: string;
  cookie?: string;
}

export function request(method: string, path: string, auth: Auth = {}, init: { body?: BodyInit; headers?: Record<string, string> } = {}): Request {
  const headers = new Headers(init.headers);
  if (auth.token !== undefined) headers.set("authorization", `Bearer ${auth.token}`);
  if (auth.cookie !== undefined) headers.set("cookie", auth.cookie);
  return new Request(`${BASE}${path}`, { method, headers, body: init.body });
}

export function jsonRequest(method: string, path: string, auth: Auth, body: unknown): Request {
  return request(method, path, auth, { body: JSON.stringify(body), headers: { "content-type": "application/json" } });
}

/** Route context as Next passes it: params as a promise. */
export function ctx<P extends Record<string, string>>(params: P): { params: Promise<P> } {
  return { params: Promise.resolve(params) };
}

export async function body(res: Response): Promise<unknown> {
  return res.json();
}
