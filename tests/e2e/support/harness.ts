/**
 * What a browser test needs, in one import:
 *
 *   import { app, openBrowser, signIn, mailTo, screenshot } from "./support/harness";
 *
 *   const b = await openBrowser();                 // in beforeAll; b.close() in afterAll
 *   const page = await b.page();                   // a fresh context (cookies) per call
 *   await signIn(page, "editor");                  // a demo account, through the sign-in form
 *   await page.goto("/workspace");                 // paths are relative to the running app
 *   await screenshot(page, "workspace-editor");    // tests/.artifacts/workspace-editor.png
 *
 * The app runs once per `vitest` run (support/global-setup.ts) with demo data and the fake
 * SMTP server; `mailTo(address)` reads what it captured.
 */
import { mkdirSync } from "node:fs";
import path from "node:path";
import { createClient } from "@libsql/client";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { inject } from "vitest";
import { DEMO_ACCOUNTS } from "@/lib/demo/accounts";
import type { Role } from "@/db/schema";
import { launchChromium, newContext } from "./chromium";

export const ARTIFACTS = path.resolve(import.meta.dirname, "../../.artifacts");

export function app(): { baseUrl: string; databaseFile: string } {
  return inject("e2e");
}

export interface OpenBrowser {
  browser: Browser;
  /** A new page in a new context (its own cookies), light or dark. */
  page(colorScheme?: "light" | "dark"): Promise<Page>;
  close(): Promise<void>;
}

export async function openBrowser(): Promise<OpenBrowser> {
  const browser = await launchChromium();
  const contexts: BrowserContext[] = [];
  return {
    browser,
    async page(colorScheme = "light") {
      const ctx = await newContext(browser, app().baseUrl, colorScheme);
      contexts.push(ctx);
      return ctx.newPage();
    },
    async close() {
      await browser.close();
    },
  };
}

export interface Credentials {
  email: string;
  password: string;
}

export function demo(role: Role): Credentials {
  const a = DEMO_ACCOUNTS.find((x) => x.role === role);
  if (a === undefined) throw new Error(`no demo account for ${role}`);
  return { email: a.email, password: a.password };
}

/** Signs in through the form and waits for the page it leads to (the workspace by default). */
export async function signIn(page: Page, who: Role | Credentials, next = "/workspace"): Promise<void> {
  const c = typeof who === "string" ? demo(who) : who;
  await page.goto(`/sign-in?next=${encodeURIComponent(next)}`);
  await page.getByLabel("E-mail address").fill(c.email);
  await page.getByLabel("Password").fill(c.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => u.pathname === next.split("?")[0], { timeout: 15_000 });
}

/** A session cookie header for plain fetch() calls (route checks without a browser). */
export async function sessionCookie(who: Role | Credentials): Promise<string> {
  const c = typeof who === "string" ? demo(who) : who;
  const { baseUrl } = app();
  const res = await fetch(`${baseUrl}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: baseUrl },
    body: JSON.stringify(c),
  });
  if (res.status !== 200) throw new Error(`sign-in as ${c.email} failed: ${res.status} ${await res.text()}`);
  return res.headers
    .getSetCookie()
    .map((x) => x.split(";")[0] ?? "")
    .join("; ");
}

export interface Mail {
  id: string;
  to: string;
  subject: string;
  text: string;
}

/** The newest mail the app sent to `address`, waiting for it to arrive. */
export async function mailTo(address: string, timeoutMs = 15_000): Promise<Mail> {
  const client = createClient({ url: `file:${app().databaseFile}` });
  try {
    const deadline = Date.now() + timeoutMs;
    while (Date.now() < deadline) {
      const r = await client.execute({
        sql: "SELECT id, to_addresses, subject, text_body FROM captured_mail WHERE to_addresses LIKE ? ORDER BY created_at DESC LIMIT 1",
        args: [`%${address.toLowerCase()}%`],
      });
      const row = r.rows[0];
      if (row !== undefined) return { id: String(row.id), to: String(row.to_addresses), subject: String(row.subject), text: String(row.text_body) };
      await new Promise((res) => setTimeout(res, 150));
    }
  } finally {
    client.close();
  }
  throw new Error(`no mail to ${address} arrived within ${timeoutMs} ms`);
}

/** A full-page PNG in tests/.artifacts/ (git-ignored); returns its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(ARTIFACTS, { recursive: true });
  const file = path.join(ARTIFACTS, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

let counter = 0;
/** An address no other test uses. */
export function uniqueEmail(prefix = "person"): string {
  counter += 1;
  return `${prefix}-${Date.now().toString(36)}-${counter}@example.test`;
}
