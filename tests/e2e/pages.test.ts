/**
 * Every page of the frame in light and dark mode and on a narrow screen: it answers with the
 * expected status, shows no console errors, does not scroll sideways, and is saved as a
 * screenshot in tests/.artifacts/pages/ for people to look at.
 */
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Role } from "@/db/schema";
import { openBrowser, screenshot, signIn, type OpenBrowser } from "./support/harness";

interface PageCase {
  name: string;
  path: string;
  as: Role | "anonymous";
  status: number;
}

const PAGES: PageCase[] = [
  { name: "home", path: "/", as: "anonymous", status: 200 },
  { name: "home-signed-in", path: "/", as: "author", status: 200 },
  { name: "sign-in", path: "/sign-in", as: "anonymous", status: 200 },
  { name: "sign-up", path: "/sign-up", as: "anonymous", status: 200 },
  { name: "verify-email", path: "/verify-email", as: "anonymous", status: 200 },
  { name: "verify-email-confirmed", path: "/verify-email?confirmed=1", as: "anonymous", status: 200 },
  { name: "verify-email-expired", path: "/verify-email?error=TOKEN_EXPIRED", as: "anonymous", status: 200 },
  { name: "forgot-password", path: "/forgot-password", as: "anonymous", status: 200 },
  { name: "reset-password", path: "/reset-password?token=abc", as: "anonymous", status: 200 },
  { name: "reset-password-invalid", path: "/reset-password?error=INVALID_TOKEN", as: "anonymous", status: 200 },
  { name: "not-found", path: "/no-such-page", as: "anonymous", status: 404 },
  { name: "unauthorized", path: "/workspace", as: "anonymous", status: 401 },
  { name: "forbidden", path: "/admin", as: "author", status: 403 },
  { name: "workspace-author", path: "/workspace", as: "author", status: 200 },
  { name: "workspace-editor", path: "/workspace", as: "editor", status: 200 },
  { name: "workspace-admin", path: "/workspace", as: "admin", status: 200 },
  { name: "admin", path: "/admin", as: "admin", status: 200 },
  { name: "admin-accounts", path: "/admin/accounts", as: "admin", status: 200 },
  { name: "admin-mail", path: "/admin/mail", as: "admin", status: 200 },
  { name: "dev-mail", path: "/dev/mail", as: "author", status: 200 },
];

let b: OpenBrowser;
const signedIn = new Map<string, Page>();

async function pageFor(as: PageCase["as"], scheme: "light" | "dark"): Promise<Page> {
  const key = `${as}-${scheme}`;
  const existing = signedIn.get(key);
  if (existing !== undefined) return existing;
  const page = await b.page(scheme);
  if (as !== "anonymous") await signIn(page, as);
  signedIn.set(key, page);
  return page;
}

beforeAll(async () => {
  b = await openBrowser();
  // Some mail to show on the mail pages: a password reset for the demo author.
  const p = await b.page();
  await p.goto("/forgot-password");
  await p.getByLabel("E-mail address").fill("author@restpoint.local");
  await p.getByRole("button", { name: "Send the link" }).click();
  await p.getByText("Check your inbox").waitFor();
});
afterAll(async () => {
  await b.close();
});

describe.each(["light", "dark"] as const)("%s mode", (scheme) => {
  it.each(PAGES)("$name", async ({ name, path, as, status }) => {
    const page = await pageFor(as, scheme);
    const errors: string[] = [];
    const onConsole = (m: { type(): string; text(): string }) => {
      // The 401/403/404 answers themselves are logged by the browser as failed loads.
      if (m.type() === "error" && !/status of (401|403|404)/.test(m.text())) errors.push(m.text());
    };
    page.on("console", onConsole);
    const res = await page.goto(path);
    await page.waitForLoadState("networkidle");
    page.off("console", onConsole);
    expect(res?.status()).toBe(status);
    expect(errors).toEqual([]);
    // One frame per page: status pages rendered inside a layout must not bring a second one.
    expect(await page.locator("main").count()).toBe(1);
    expect(await page.getByRole("banner").count()).toBe(1);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, `pages/${name}-${scheme}`);
  });
});

describe("narrow screen", () => {
  it.each(PAGES.filter((p) => ["home", "sign-up", "workspace-editor", "admin-accounts", "dev-mail"].includes(p.name)))("$name", async ({ name, path, as, status }) => {
    const page = await pageFor(as, "light");
    await page.setViewportSize({ width: 390, height: 800 });
    const res = await page.goto(path);
    expect(res?.status()).toBe(status);
    await screenshot(page, `pages/${name}-narrow`);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    const widest = await page.evaluate(() => {
      const el = [...document.querySelectorAll("body *")].find((e) => e.getBoundingClientRect().right > window.innerWidth + 1);
      return el === undefined ? "" : `${el.tagName}.${el.className}`;
    });
    expect(overflow, `wider than the screen: ${widest}`).toBeLessThanOrEqual(0);
    await page.setViewportSize({ width: 1280, height: 860 });
  });
});
