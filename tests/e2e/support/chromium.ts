/** Debian's Chromium, driven by playwright-core (never a downloaded browser). */
import { chromium, type Browser, type BrowserContext } from "playwright-core";

// Test tooling may read the environment directly: the app's own rule (lib/env.ts only) is for app code.
export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

// Quiet, offline, root-safe: no sandbox (root), no GPU, no background calls to the outside.
export const CHROMIUM_ARGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--disable-dev-shm-usage",
];

/** A fresh browser; playwright gives each launch its own temporary --user-data-dir. */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS, headless: true });
}

export function newContext(browser: Browser, baseUrl: string, colorScheme: "light" | "dark" = "light"): Promise<BrowserContext> {
  return browser.newContext({ baseURL: baseUrl, colorScheme, viewport: { width: 1280, height: 860 }, locale: "en-GB", timezoneId: "UTC" });
}
