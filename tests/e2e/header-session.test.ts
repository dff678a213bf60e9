/**
 * The header's account area is filled in the browser from the session endpoint. While that
 * answer is on its way a same-size placeholder stands in, so nothing below the header moves.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { openBrowser, screenshot, signIn, type OpenBrowser } from "./support/harness";

let b: OpenBrowser;
beforeAll(async () => {
  b = await openBrowser();
});
afterAll(async () => {
  await b?.close();
});

/** Opens `path` with the session answer held back; returns the header's height then and once it arrived. */
async function headerHeights(page: Page, path: string): Promise<{ pending: number; known: number }> {
  let release = (): void => {};
  const gate = new Promise<void>((resolve) => {
    release = resolve;
  });
  await page.route("**/api/auth/get-session**", async (route) => {
    await gate;
    await route.continue();
  });
  await page.goto(path);
  await page.getByTestId("account-pending").waitFor();
  const pending = (await page.locator("body > header").boundingBox())?.height ?? -1;
  release();
  await page.getByTestId("account-pending").waitFor({ state: "detached" });
  const known = (await page.locator("body > header").boundingBox())?.height ?? -2;
  return { pending, known };
}

describe("the header's account area", () => {
  for (const width of [390, 1280]) {
    it(`keeps the header's height when an administrator's session arrives (${width} px wide)`, async () => {
      const page = await b.page();
      await page.setViewportSize({ width, height: 800 });
      await signIn(page, "admin");
      const { pending, known } = await headerHeights(page, "/models");
      await page.getByTestId("signed-in-as").waitFor();
      await expect(page.getByRole("link", { name: "Administration" }).count()).resolves.toBe(1);
      expect(pending).toBeGreaterThan(0);
      expect(known).toBe(pending);
      await screenshot(page, `header-admin-${width}`);
    });

    it(`keeps the header's height for an anonymous reader and offers the sign-in link (${width} px wide)`, async () => {
      const page = await b.page();
      await page.setViewportSize({ width, height: 800 });
      const { pending, known } = await headerHeights(page, "/models");
      await expect(page.getByRole("link", { name: "Sign in" }).count()).resolves.toBe(1);
      await expect(page.getByRole("link", { name: "Workspace" }).count()).resolves.toBe(0);
      expect(known).toBe(pending);
    });
  }
});
