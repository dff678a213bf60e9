/**
 * Helpers for the deposit API tests: accounts with personal API tokens or browser sessions,
 * and requests built the way Next hands them to route handlers. Import ./deposit-env first.
 */
import { db } from "@/db/client";
import { apiToken } from "@/db/schema";
import { newApiToken } from "@/lib/token-hash";
import { accountIn } from "./app-support";
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

/** A browser session cookie, through better-auth's own sign-up and sign-in (the app frame's helper). */
export async function sessionCookie(name: string): Promise<{ cookie: string; userId: string }> {
  const { id, cookie } = await accountIn("author", name);
  return { cookie, userId: id };
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
