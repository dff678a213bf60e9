/**
 * A reader with no account: finds a model by a strategy name, opens it, re-runs it with a
 * changed parameter, sees the plots change, and downloads the CSV and the BibTeX.
 * Screenshots of the public pages at desktop and phone width, light and dark.
 */
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { app, openBrowser, screenshot, type OpenBrowser } from "./support/harness";

let b: OpenBrowser;
let dunes = "";
let figs = "";
let hidden = "";

// The running app's own worker re-runs what is deposited here, as it would for an author.
const APP_WORKER = { worker: "app" } as const;
const duneSpec = readFileSync("schemas/examples/fog-dune-beetles.json", "utf8");
const figSpec = readFileSync("schemas/examples/cloud-forest-figs.json", "utf8");

beforeAll(async () => {
  // Seed the running app's database through the deposit functions (the seed module reads the environment on import).
  process.env.DATABASE_URL = `file:${app().databaseFile}`;
  const { depositPublicModel } = await import("../integration/readers-seed");
  dunes = (
    await depositPublicModel([duneSpec], {
      title: "Mist beetles: where to stand in the fog",
      summary: "Three dew-collecting sites on a fictional coastal dune.",
      // The ORCID iD is ORCID's own documented sample iD (valid check character), not a real author's.
      authors: [{ name: "Ilse Vandermeer", orcid: "0000-0002-1825-0097" }, { name: "Reef & Kelp Lab" }],
      doi: "10.5555/dunes.2026_7",
    }, APP_WORKER)
  ).slug;
  figs = (await depositPublicModel([figSpec], { title: "Lantern figs and midges", authors: [{ name: "Kofi Brandvold" }] }, APP_WORKER)).slug;
  // Private, and with the same strategy names: it must never show up.
  hidden = (
    await depositPublicModel([duneSpec.replace("Fog basking", "Secret fog basking")], { title: "Secret dune draft", visibility: "private" }, APP_WORKER)
  ).slug;
  b = await openBrowser();
}, 300_000);

afterAll(async () => {
  await b?.close();
});

/** The polyline points of every plotted series inside `scope`, as one string. */
async function seriesPoints(page: Page, scope: string): Promise<string> {
  return page.locator(`${scope} svg[data-plot-svg] polyline`).evaluateAll((els) => els.map((e) => e.getAttribute("points") ?? "").join("|"));
}

describe("a reader without an account", () => {
  it("finds a model by a strategy name, re-runs it with a new parameter and downloads its data", async () => {
    const page = await b.page();
    await page.goto("/models");
    await page.getByLabel("Search models").fill("Trough");
    await page.getByRole("button", { name: "Search" }).click();
    await page.waitForURL((u) => u.searchParams.get("q") === "Trough");
    const results = page.getByTestId("registry-results").locator("li");
    await expect.poll(() => results.count()).toBe(1);
    expect(await page.getByTestId("registry-count").innerText()).toBe("1 model; showing 1–1.");
    expect(await page.content()).not.toContain("Secret dune draft");

    await results.first().getByRole("link", { name: "Mist beetles: where to stand in the fog" }).click();
    await page.waitForURL(`**/models/${dunes}`);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toContain("Fog basking on an imagined coastal dune");
    await page.getByTestId("registered-figures").waitFor();
    const registered = await seriesPoints(page, "[data-testid=report-view]");
    expect(registered.length).toBeGreaterThan(100);

    // A richer Crest (w from 3 to 4) draws beetles up. Solved by hand, every site paying the same
    // inside the simplex: Crest 4 - 4x1 - 2x3 = Lee 2 - 4x2 = Trough 3 - 4x3 with x1 + x2 + x3 = 1
    // gives x3 = x2 + 1/4, x1 = (1 + 2x3)/4, so x3 = 0.4, x2 = 0.15, x1 = 0.45 (was 1/4, 1/4, 1/2).
    await page.getByTestId("param-w").fill("4");
    await page.getByRole("button", { name: "Re-run with these values" }).click();
    const own = page.getByTestId("own-results");
    await own.waitFor({ timeout: 30_000 });
    expect(await own.innerText()).toContain("These are not the registered results of this version");
    expect(await page.getByTestId("own-changes").innerText()).toBe("Your values: w = 4 (registered: 3).");
    const mine = await seriesPoints(page, "[data-testid=own-results]");
    expect(mine.length).toBeGreaterThan(100);
    expect(mine).not.toBe(registered);
    expect(await own.getByRole("table").last().innerText()).toContain("(0.45, 0.15, 0.4)");
    // The registered figures are still there, unchanged.
    expect(await seriesPoints(page, "[data-testid=report-view]")).toBe(registered);
    await screenshot(page, "reader-model-own-values");

    // A value the rules refuse is caught in the browser, next to its field.
    await page.locator("#try-0-0-0").fill("0.5");
    await page.getByRole("button", { name: "Re-run with these values" }).click();
    await expect.poll(() => page.getByTestId("try-values").innerText()).toContain("they sum to 1.4.");
    // The keyboard lands on the first share of the group that needs attention.
    await expect.poll(() => page.evaluate(() => document.activeElement?.id)).toBe("try-0-0-0");
    await page.getByRole("button", { name: "Scale these shares to sum to 1" }).click();
    expect(await page.locator("#try-0-0-0").inputValue()).toBe("0.357142857143");

    // CSV of the server's own run.
    const [csvDownload] = await Promise.all([page.waitForEvent("download"), page.getByTestId("csv-lee-crowded").click()]);
    expect(csvDownload.suggestedFilename()).toBe(`${dunes}-v1-lee-crowded.csv`);
    const csv = readFileSync((await csvDownload.path()) ?? "", "utf8").split("\r\n");
    expect(csv[0]).toBe("time,Crest,Lee,Trough");
    expect(csv[1]).toBe("0,0.1,0.8,0.1");
    expect(csv).toHaveLength(203);

    // BibTeX with the spec's hash.
    const report = (await (await fetch(`${app().baseUrl}/models/${dunes}/v/1/report.json`)).json()) as { specSha256: string };
    const [bibDownload] = await Promise.all([page.waitForEvent("download"), page.getByTestId("bibtex-link").click()]);
    expect(bibDownload.suggestedFilename()).toBe(`${dunes}-v1.bib`);
    const bib = readFileSync((await bibDownload.path()) ?? "", "utf8");
    expect(bib.startsWith(`@misc{restpoint-${dunes}-v1,`)).toBe(true);
    expect(bib).toContain("author = {Ilse Vandermeer and Reef \\& Kelp Lab}");
    expect(bib).toContain(`specification SHA-256 ${report.specSha256}`);
  });

  it("re-runs a two-population model, checking each population's starting shares", async () => {
    const page = await b.page();
    await page.goto(`/models/${figs}`);
    await page.getByTestId("registered-figures").waitFor();
    // Midges' shares (second population) that do not sum to 1 are refused in the browser.
    await page.locator("#try-0-1-0").fill("0.6");
    await page.getByRole("button", { name: "Re-run with these values" }).click();
    await expect.poll(() => page.locator("#try-0-1-sum").innerText()).toContain("sum to 1");
    expect(await page.locator("#try-0-0-0").getAttribute("aria-invalid")).toBeNull();
    await page.getByRole("button", { name: "Scale these shares to sum to 1" }).click();
    await page.getByTestId("param-f").fill("2");
    await page.getByRole("button", { name: "Re-run with these values" }).click();
    const own = page.getByTestId("own-results");
    await own.waitFor({ timeout: 30_000 });
    expect(await page.getByTestId("own-changes").innerText()).toContain("f = 2 (registered: 1)");
    // The threshold between the two matches, where each population is indifferent (solved by hand,
    // no split broods): midges 3 y = 2 (1 - y), so early-bloom share y = 0.4 whatever f is; figs
    // (p - f) a - f (1 - a) = p (1 - a), so early-hatch share a = (p + f) / (2 p) = 6/8 with f = 2 (was 5/8).
    const table = await own.getByRole("table").last().innerText();
    expect(table).toContain("(0.4, 0.6)");
    expect(table).toContain("(0.75, 0.25, 0)");
  });

  it("gets the same 404 for a private model as for one that does not exist", async () => {
    const page = await b.page();
    const priv = await page.goto(`/models/${hidden}`);
    expect(priv?.status()).toBe(404);
    const privText = await page.locator("main").innerText();
    const none = await page.goto("/models/rp-doesnotexist");
    expect(none?.status()).toBe(404);
    expect(await page.locator("main").innerText()).toBe(privText);
    expect(privText).not.toContain("Secret");
  });

  it("sees the page metadata and the sitemap", async () => {
    const page = await b.page();
    await page.goto(`/models/${dunes}`);
    expect(await page.title()).toBe("Fog basking on an imagined coastal dune: where mist beetles stand at dawn · Restpoint");
    expect(await page.locator('meta[property="og:title"]').getAttribute("content")).toContain("Fog basking");
    expect(await page.locator('meta[name="description"]').getAttribute("content")).toContain("Version 1 by Ilse Vandermeer, Reef & Kelp Lab");
    const sitemap = await (await fetch(`${app().baseUrl}/sitemap.xml`)).text();
    expect(sitemap).toContain(`/models/${dunes}</loc>`);
    expect(sitemap).not.toContain(hidden);
  });
});

describe("the public model page's markup", () => {
  // Next.js writes a cached page out from one string; a character above U+00FF makes the whole
  // string two-byte and every response slower to encode (components/ui/Glyph.tsx, measured with
  // `npm run bench:web`). Our own symbols are therefore CSS glyphs; these models' own text is Latin-1.
  it("is Latin-1 throughout when the model's own text is, and still shows the symbols", async () => {
    for (const slug of [dunes, figs]) {
      await expect.poll(async () => (await fetch(`${app().baseUrl}/models/${slug}/v/1/report.json`)).status, { timeout: 60_000 }).toBe(200);
      for (const path of [`/models/${slug}`, `/models/${slug}/v/1`]) {
        const html = await (await fetch(`${app().baseUrl}${path}`)).text();
        expect(html).toContain('data-testid="claims-table"');
        const beyond = [...html.matchAll(/[^\u0000-\u00ff]/gu)].map((m) => `${m[0]} in ${html.slice(Math.max(0, (m.index ?? 0) - 40), (m.index ?? 0) + 5)}`);
        expect(beyond, path).toEqual([]);
      }
    }
    const page = await b.page();
    await page.goto(`/models/${dunes}`);
    const equations = page.getByRole("region", { name: "Equations of the dynamics" });
    // The screen-reader reading of the law of motion, and the glyphs CSS draws for it.
    await expect.poll(() => equations.getByRole("math").first().getAttribute("aria-label")).toBe("dx_i/dt = x_i (f_i - phi)");
    const drawn = await equations.locator(".rp-glyph").evaluateAll((els) => els.map((e) => getComputedStyle(e, "::before").content));
    expect(drawn).toEqual(['"−"', '"φ"', '"φ"', '"Σ"']);
  });
});

describe("screenshots of the public pages", () => {
  for (const scheme of ["light", "dark"] as const) {
    for (const [label, width] of [
      ["desktop", 1280],
      ["phone", 390],
    ] as const) {
      it(`${label}, ${scheme}`, async () => {
        const page = await b.page(scheme);
        await page.setViewportSize({ width, height: 860 });
        await page.goto("/models?q=a");
        await screenshot(page, `reader-registry-${label}-${scheme}`);
        for (const [name, slug] of [
          ["model", dunes],
          ["figs", figs],
        ] as const) {
          await page.goto(`/models/${slug}`);
          // The stored run's figures are drawn in the browser: wait for them.
          await page.getByTestId("registered-figures").waitFor();
          await screenshot(page, `reader-${name}-${label}-${scheme}`);
        }
        // Nothing may stick out sideways on a phone.
        const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
        expect(overflow).toBeLessThanOrEqual(1);
      });
    }
  }
});
