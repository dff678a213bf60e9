/**
 * The editor's journey in Chromium: find a submission in the queue by filtering, open its
 * review, compare v1 with v2, request changes (the author gets the mail), the author uploads
 * v3, the editor records "verified"; the model badge changes while the version badges stay;
 * the audit trail shows every step. Screenshots of each page, light and dark.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { DEMO_VENUE } from "@/lib/demo/accounts";
import { app, demo, mailTo, openBrowser, screenshot, sessionCookie, signIn, type OpenBrowser } from "./support/harness";

// A scenario of our own: grazers on a salt meadow that either Graze in place or Wander.
// Payoffs [[1, 3], [2, 1]] put the only interior rest point at Graze = 2/3 (from memory of the
// two-strategy replicator equation: equal payoffs 3 - 2x = 1 + x), and it is stable.
function spec(claims: unknown[]): string {
  return JSON.stringify({
    format: "restpoint/model@1",
    title: "Salt-meadow grazers",
    game: { kind: "symmetric", strategies: ["Graze", "Wander"], payoffs: [[1, 3], [2, 1]] },
    claims,
  });
}
const V1 = spec([{ id: "mixed-herd", kind: "rest-point", state: [0.6, 0.4], stability: "asymptotically-stable" }]);
const V2 = spec([
  { id: "mixed-herd", kind: "rest-point", state: [0.6666667, 0.3333333], stability: "unstable" },
  { id: "three-rest-points", kind: "rest-point-count", count: 3 },
]);
const V3 = spec([
  { id: "mixed-herd", kind: "rest-point", state: [0.6666667, 0.3333333], stability: "asymptotically-stable" },
  { id: "three-rest-points", kind: "rest-point-count", count: 3 },
  { id: "herd-ess", kind: "ess", state: [0.6666667, 0.3333333] },
]);

const TITLE = `Salt-meadow grazers ${Date.now().toString(36)}`;
let b: OpenBrowser;
let authorCookie = "";
let slug = "";

async function api(path: string, init: { method?: string; body?: string; type?: string } = {}): Promise<Response> {
  const headers: Record<string, string> = { cookie: authorCookie, origin: app().baseUrl };
  if (init.type !== undefined) headers["content-type"] = init.type;
  return fetch(`${app().baseUrl}${path}`, { method: init.method ?? "GET", headers, body: init.body });
}

async function upload(text: string): Promise<number> {
  const res = await api(`/api/v1/models/${slug}/versions`, { method: "POST", body: text, type: "application/json" });
  expect(res.status).toBe(201);
  const n = ((await res.json()) as { version: { number: number } }).version.number;
  // Wait for the background re-run, then put the version before the venue.
  const deadline = Date.now() + 60_000;
  for (;;) {
    const v = (await (await api(`/api/v1/models/${slug}/versions/${n}`)).json()) as { version: { verdict: string | null } };
    if (v.version.verdict !== null) break;
    if (Date.now() > deadline) throw new Error(`version ${n} was not verified within a minute`);
    await new Promise((r) => setTimeout(r, 300));
  }
  const sub = await api(`/api/v1/venues/${DEMO_VENUE.slug}/submissions`, { method: "POST", body: JSON.stringify({ model: slug, version: n }), type: "application/json" });
  expect([200, 201]).toContain(sub.status);
  return n;
}

async function badge(path: string): Promise<string> {
  const res = await api(path);
  expect(res.status).toBe(200);
  return res.text();
}

async function shoot(page: Page, name: string): Promise<void> {
  await screenshot(page, `editor-${name}-light`);
  await page.emulateMedia({ colorScheme: "dark" });
  // Buttons ease their colours (transition-colors): let them settle before the picture.
  await page.waitForTimeout(400);
  await screenshot(page, `editor-${name}-dark`);
  await page.emulateMedia({ colorScheme: "light" });
  await page.waitForTimeout(400);
}

beforeAll(async () => {
  b = await openBrowser();
  authorCookie = await sessionCookie("author");
  const venues = (await (await api("/api/v1/venues")).json()) as { venues: { id: string; slug: string }[] };
  const venueId = venues.venues.find((v) => v.slug === DEMO_VENUE.slug)?.id;
  expect(venueId).toBeDefined();
  const created = await api("/api/v1/models", {
    method: "POST",
    type: "application/json",
    body: JSON.stringify({ title: TITLE, summary: "Grazers choose between staying and wandering.", venueId, authors: [{ name: "Noor Varga" }] }),
  });
  expect(created.status).toBe(201);
  slug = ((await created.json()) as { model: { slug: string } }).model.slug;
  expect(await upload(V1)).toBe(1);
  expect(await upload(V2)).toBe(2);
}, 180_000);

afterAll(async () => {
  await b.close();
});

describe("an editor reviews, requests changes, then verifies", () => {
  it("runs the whole journey", async () => {
    const page = await b.page();
    await signIn(page, "editor");

    // Venues list (reached from the workspace sidebar), then the queue, filtered down to our model by its title.
    await page.goto("/workspace");
    await page.getByRole("navigation", { name: "Workspace" }).getByRole("link", { name: "Venues and queues" }).click();
    await page.waitForURL("**/workspace/venues");
    await shoot(page, "venues");
    await page.getByRole("link", { name: "Open the queue" }).first().click();
    await page.waitForURL(`**/workspace/venues/${DEMO_VENUE.slug}`);
    await page.getByTestId("queue-row").first().waitFor();
    await page.getByLabel("Model title or short name").fill(TITLE.split(" ").pop() ?? TITLE);
    await page.getByRole("button", { name: /^Awaiting decision/ }).click();
    await expect.poll(async () => page.getByTestId("queue-row").count(), { timeout: 10_000 }).toBe(1);
    await expect.poll(() => new URL(page.url()).searchParams.get("status")).toBe("awaiting-decision");
    await expect.poll(async () => (await page.getByTestId("queue-summary").textContent()) ?? "").toBe("1 submission matches");
    const row = page.getByTestId("queue-row").first();
    expect(await row.getAttribute("data-model")).toBe(slug);
    expect(await row.textContent()).toContain("v2");
    await shoot(page, "queue-filtered");

    // The review of v2: report, findings, decision form.
    await row.getByTestId("queue-review-link").click();
    await page.waitForURL(`**/review/${slug}/v/2`);
    await page.getByTestId("report-view").waitFor();
    expect(await page.getByTestId("report-view").getAttribute("data-verdict")).toBe("contradicted");
    await shoot(page, "review-v2");

    // Compare v1 with v2.
    await page.getByRole("link", { name: "Compare v1 → v2" }).click();
    await page.waitForURL(`**/workspace/models/${slug}/compare?from=1&to=2`);
    await page.getByTestId("spec-diff").waitFor();
    expect(await page.locator('[data-testid="verdict-diff"] tr[data-claim="three-rest-points"]').getAttribute("data-change")).toBe("added");
    expect(await page.locator('[data-testid="spec-diff"] tr[data-kind="added"]').count()).toBeGreaterThan(0);
    await shoot(page, "compare-v1-v2");

    // Changes requested on v2 (the latest submitted).
    await page.getByRole("link", { name: "← Review of version 2" }).click();
    await page.waitForURL(`**/review/${slug}/v/2`);
    // "Verified" is not offered while a claim is contradicted.
    expect(await page.getByRole("radio", { name: /Verified/ }).isDisabled()).toBe(true);
    await page.getByRole("button", { name: "Record decision" }).click();
    await expect.poll(async () => page.getByTestId("decision-error").textContent()).toBe("Choose a decision and write a comment for the authors before recording it.");
    expect(await page.locator("#decision-outcome-error").textContent()).toBe("Choose Verified, Changes requested or Declined.");
    await page.getByRole("radio", { name: /Changes requested/ }).check();
    await page.getByLabel("Comment for the authors").fill("The mixed herd is stable in the re-run: correct the stability of claim mixed-herd.");
    await page.getByRole("button", { name: "Record decision" }).click();
    await page.waitForURL(`**/review/${slug}/v/2?decided=1`);
    expect(await page.getByTestId("recorded-decision").getAttribute("data-outcome")).toBe("changes-requested");
    await shoot(page, "review-v2-decided");

    // The author receives the mail.
    // The newest mail to the author; the re-run mails of v1 and v2 came before it.
    let mail = await mailTo(demo("author").email);
    for (let i = 0; i < 50 && mail.subject !== `Changes requested: version 2 of ${TITLE}`; i++) {
      await new Promise((r) => setTimeout(r, 200));
      mail = await mailTo(demo("author").email);
    }
    expect(mail.subject).toBe(`Changes requested: version 2 of ${TITLE}`);
    expect(mail.text).toContain("correct the stability of claim mixed-herd");
    const authorPage = await b.page();
    await signIn(authorPage, "author");
    await authorPage.goto(`/dev/mail?id=${mail.id}`);
    await authorPage.getByText(`Changes requested: version 2 of ${TITLE}`).first().waitFor();
    await shoot(authorPage, "author-mail");

    // Badges after the first decision.
    const model1 = await badge(`/badges/models/${slug}.svg`);
    const v1a = await badge(`/badges/models/${slug}/v/1.svg`);
    const v2a = await badge(`/badges/models/${slug}/v/2.svg`);
    expect(model1).toContain("changes requested");
    expect(v2a).toContain("changes requested");

    // v3 answers the request; the editor verifies it.
    expect(await upload(V3)).toBe(3);
    await page.goto(`/workspace/venues/${DEMO_VENUE.slug}?q=${encodeURIComponent(slug)}`);
    await expect.poll(async () => (await page.getByTestId("queue-row").first().textContent()) ?? "", { timeout: 10_000 }).toContain("v3");
    expect(await page.getByTestId("queue-row").first().textContent()).toContain("after v2: changes requested");
    await shoot(page, "queue-resubmitted");
    await page.getByTestId("queue-row").first().getByTestId("queue-review-link").click();
    await page.waitForURL(`**/review/${slug}/v/3`);
    expect(await page.getByTestId("report-view").getAttribute("data-verdict")).toBe("confirmed");
    await page.getByRole("radio", { name: /Verified/ }).check();
    await page.getByLabel("Comment for the authors").fill("All three claims re-run and match.");
    await page.getByRole("button", { name: "Record decision" }).click();
    await page.waitForURL(`**/review/${slug}/v/3?decided=1`);
    expect(await page.getByTestId("recorded-decision").getAttribute("data-outcome")).toBe("verified");
    await shoot(page, "review-v3-verified");

    // The model badge changed; the version badges did not.
    const model2 = await badge(`/badges/models/${slug}.svg`);
    expect(model2).not.toBe(model1);
    expect(model2).toContain("all 3 claims confirmed");
    expect(model2).toContain(`${slug} v3`);
    expect(await badge(`/badges/models/${slug}/v/1.svg`)).toBe(v1a);
    expect(await badge(`/badges/models/${slug}/v/2.svg`)).toBe(v2a);
    const v3res = await fetch(`${app().baseUrl}/badges/models/${slug}/v/3.svg`);
    expect(v3res.status).toBe(200); // public now: no cookie needed
    expect(v3res.headers.get("cache-control")).toBe("public, max-age=31536000, immutable");

    // The audit trail shows every step, on the page and in the API.
    const trail = page.getByTestId("audit-trail");
    const actions = await trail.locator("li").evaluateAll((lis) => lis.map((li) => li.getAttribute("data-action")));
    expect(actions.filter((a) => a === "version.submitted")).toHaveLength(3);
    expect(actions.filter((a) => a === "decision.recorded")).toHaveLength(2);
    const audit = (await (await api(`/api/v1/models/${slug}/audit`)).json()) as { events: { action: string; versionNumber: number | null }[] };
    const steps = audit.events.filter((e) => e.action === "version.submitted" || e.action === "decision.recorded").map((e) => `${e.action}:${e.versionNumber ?? "-"}`);
    expect(steps).toEqual(["version.submitted:1", "version.submitted:2", "decision.recorded:2", "version.submitted:3", "decision.recorded:3"]);

    // The admin's venue page.
    const adminPage = await b.page();
    await signIn(adminPage, "admin");
    await adminPage.goto("/admin/venues");
    await adminPage.getByTestId(`venue-${DEMO_VENUE.slug}`).waitFor();
    await shoot(adminPage, "admin-venues");
    // Create a venue through the form and assign the demo editor to it.
    const newSlug = `estuary-${Date.now().toString(36)}`;
    const create = adminPage.getByTestId("create-venue");
    await create.getByLabel("Short name").fill("Not A Slug");
    await create.getByLabel("Name", { exact: true }).fill("Estuary Notes");
    await create.getByRole("button", { name: "Create venue" }).click();
    await create.getByText("Lower-case letters, digits and single hyphens, like tidewater-letters.").waitFor();
    await create.getByLabel("Short name").fill(newSlug);
    await create.getByRole("button", { name: "Create venue" }).click();
    await create.getByText("Created Estuary Notes.").waitFor();
    const card = adminPage.getByTestId(`venue-${newSlug}`);
    await card.waitFor();
    await card.getByLabel("Editor's e-mail address").fill("nobody@example.test");
    await card.getByRole("button", { name: "Assign editor" }).click();
    await card.getByText("No account has this e-mail address.").waitFor();
    await card.getByLabel("Editor's e-mail address").fill(demo("editor").email);
    await card.getByRole("button", { name: "Assign editor" }).click();
    await card.getByText("Tomas Ekwueme edits this venue.").waitFor();
    await shoot(adminPage, "admin-venue-created");
  }, 240_000);
});
