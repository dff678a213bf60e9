/**
 * Browser journeys of an author: deposit a model, upload the example spec through the upload
 * widget, watch the verification finish without reloading, read the report with its figures,
 * upload a corrected version, find the mail for each; and a script that uploads with an API
 * token created in the settings.
 */
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { app, mailTo, openBrowser, screenshot, signIn, uniqueEmail, type OpenBrowser } from "./support/harness";

let b: OpenBrowser;
beforeAll(async () => {
  b = await openBrowser();
});
afterAll(async () => {
  await b.close();
});

const PASSWORD = "tidal-flat-notebook-7";
const EXAMPLE_PATH = path.resolve("schemas/examples/fog-dune-beetles.json");
const exampleText = readFileSync(EXAMPLE_PATH, "utf8");
const work = mkdtempSync(path.join(os.tmpdir(), "restpoint-deposit-e2e-"));
/** The first journey's private model, which the second author must not find. */
let privateSlug = "";

function writeSpec(name: string, text: string): string {
  const file = path.join(work, name);
  writeFileSync(file, text);
  return file;
}

/** Sign-up, confirmation link from the captured mail, sign-in: a brand-new author. */
async function newAuthor(name: string): Promise<{ page: Page; email: string }> {
  const email = uniqueEmail("depositor");
  const page = await b.page();
  await page.goto("/sign-up");
  await page.getByLabel("Name").fill(name);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Create account" }).click();
  await page.getByTestId("sign-up-done").waitFor();
  const confirm = await mailTo(email);
  const link = /https?:\/\/\S+/.exec(confirm.text)?.[0];
  expect(link).toBeDefined();
  await page.goto(link ?? "/");
  await page.waitForURL("**/verify-email?confirmed=1");
  await signIn(page, { email, password: PASSWORD });
  await page.getByTestId("signed-in-as").waitFor();
  return { page, email };
}

/** Chooses a file in the widget's own file input (what its "browse files" link opens). */
async function chooseFile(page: Page, widget: string, file: string): Promise<void> {
  await page.locator(`[data-testid="${widget}-widget"] input[type=file]`).first().setInputFiles(file);
}

/** Drops a file on the widget the way a browser does (dragenter, dragover, drop with a DataTransfer). */
async function dropFile(page: Page, widget: string, name: string, text: string, type: string): Promise<void> {
  await page.evaluate(
    ({ selector, name, text, type }) => {
      const target = document.querySelector(selector);
      if (target === null) throw new Error(`no drop zone ${selector}`);
      const data = new DataTransfer();
      data.items.add(new File([text], name, { type }));
      for (const kind of ["dragenter", "dragover", "drop"]) {
        target.dispatchEvent(new DragEvent(kind, { bubbles: true, cancelable: true, dataTransfer: data }));
      }
    },
    { selector: `[data-testid="${widget}-widget"] .uppy-Dashboard-inner`, name, text, type },
  );
}

function markNoReload(page: Page): Promise<void> {
  return page.evaluate(() => {
    Object.assign(window, { __restpointNoReload: true });
  });
}
function stillNoReload(page: Page): Promise<boolean> {
  return page.evaluate(() => "__restpointNoReload" in window);
}

describe("an author depositing a model", () => {
  it("uploads the example spec, watches it verify, reads the report, corrects it, and gets mail for each", async () => {
    const title = "Mist beetles, deposited in the browser";
    const { page, email } = await newAuthor("Wren Deposit");

    // The model entry: a wrong ORCID check character is caught before anything is sent.
    await page.getByRole("link", { name: "Your models" }).first().click();
    await page.waitForURL("**/workspace/models");
    await page.getByRole("link", { name: "Deposit a model" }).first().click();
    await page.waitForURL("**/workspace/models/new");
    await page.getByLabel("Title", { exact: true }).fill(title);
    await page.locator("#author-0-name").fill("Wren Deposit");
    await page.locator("#author-0-orcid").fill("0000-0002-1825-0098");
    await page.getByLabel("DOI").fill("10.5555/dunes.2026");
    await page.getByLabel("Year").fill("2026");
    await page.getByRole("button", { name: "Create the model entry" }).click();
    await expect(page.locator("#author-0-orcid-error").textContent()).resolves.toBe(
      "Not a valid ORCID iD (0000-0000-0000-000X with a correct check character).",
    );
    await screenshot(page, "deposit-new-model-orcid-error");
    // ORCID's own documented sample iD: a well-formed iD with a correct check character.
    await page.locator("#author-0-orcid").fill("0000-0002-1825-0097");
    await page.getByRole("button", { name: "Create the model entry" }).click();
    await page.waitForURL(/\/workspace\/models\/rp-[a-z0-9]+\?created=1$/);
    const slug = new URL(page.url()).pathname.split("/").pop() ?? "";
    privateSlug = slug;

    // The restrictions are on screen before a file is chosen.
    await expect(page.getByTestId("spec-upload-limits").textContent()).resolves.toBe("One specification: a .json file up to 1 MB.");
    await screenshot(page, "deposit-model-entry-empty");

    // v1: the example spec through the widget; the status changes with no reload.
    const polls: string[] = [];
    page.on("request", (r) => {
      if (r.url().endsWith(`/api/v1/models/${slug}`)) polls.push(r.url());
    });
    await markNoReload(page);
    await chooseFile(page, "spec-upload", EXAMPLE_PATH);
    await page.getByTestId("spec-upload-result").getByText("was made from fog-dune-beetles.json").waitFor();
    const v1State = page.getByTestId("version-1-state");
    await v1State.locator("[data-verdict]").waitFor({ timeout: 60_000 });
    await expect(v1State.locator("[data-verdict]").getAttribute("data-verdict")).resolves.toBe("confirmed");
    expect(await stillNoReload(page)).toBe(true);
    expect(polls.length).toBeGreaterThan(0);
    await screenshot(page, "deposit-model-entry-v1");

    // The widget refuses a wrong type and an oversize file before sending anything.
    let uploadsSent = 0;
    page.on("request", (r) => {
      if (r.method() === "POST" && r.url().endsWith(`/api/v1/models/${slug}/versions`)) uploadsSent += 1;
    });
    await dropFile(page, "spec-upload", "notes.txt", "not a spec", "text/plain");
    await page.getByTestId("spec-upload-widget").locator(".uppy-Informer").getByText("You can only upload").first().waitFor();
    await screenshot(page, "deposit-model-entry-refused-type");
    await dropFile(page, "spec-upload", "huge.json", `{"pad": "${"x".repeat(1_000_100)}"}`, "application/json");
    await page.getByTestId("spec-upload-widget").locator(".uppy-Informer").getByText("exceeds maximum allowed size").first().waitFor();
    expect(uploadsSent).toBe(0);

    // The same content again: no new version, and the page says which version it matches.
    await chooseFile(page, "spec-upload", writeSpec("same.json", JSON.stringify(JSON.parse(exampleText))));
    await page.getByTestId("spec-upload-result").getByText("is identical to v1").waitFor();

    // A broken spec: every problem at once, with JSON pointer and line; nothing stored.
    const broken = exampleText.replace('"count": 7', '"count": "seven"');
    await chooseFile(page, "spec-upload", writeSpec("broken.json", broken));
    const errors = page.getByTestId("spec-errors");
    await errors.waitFor();
    const brokenLine = broken.split("\n").findIndex((l) => l.includes('"count": "seven"')) + 1;
    await expect(errors.textContent()).resolves.toContain("/claims/5/count");
    await expect(errors.textContent()).resolves.toContain(`line ${brokenLine}`);
    await expect(page.getByTestId("spec-upload-result").textContent()).resolves.toContain("broken.json was not stored");
    await screenshot(page, "deposit-model-entry-schema-errors");
    expect(await page.getByTestId("version-list").locator("tbody tr").count()).toBe(1);

    // The report page: verdict, claims, rest points, figures.
    await page.getByRole("link", { name: "v1", exact: true }).click();
    await page.waitForURL(`**/workspace/models/${slug}/v/1`);
    const report = page.getByTestId("report-view");
    await report.waitFor();
    await expect(page.getByTestId("verdict-banner").getAttribute("data-verdict")).resolves.toBe("confirmed");
    await expect(page.getByTestId("claims-table").locator("tbody tr").count()).resolves.toBe(10);
    await expect(page.getByTestId("rest-points-table").locator("tbody tr").count()).resolves.toBe(7);
    expect(await page.locator("section[aria-labelledby=report-experiments] svg").count()).toBeGreaterThanOrEqual(4);
    await screenshot(page, "deposit-report-v1-light");
    await page.emulateMedia({ colorScheme: "dark" });
    await screenshot(page, "deposit-report-v1-dark");
    await page.emulateMedia({ colorScheme: "light" });

    // Supplementary files on the version: a CSV is attached; a "PDF" that is text is refused.
    await expect(page.getByTestId(`supplement-upload-v1-limits`).textContent()).resolves.toBe(
      "Supplementary files: CSV, PDF, ZIP or plain text, up to 50 MB each.",
    );
    await dropFile(page, "supplement-upload-v1", "field-counts.csv", "site,beetles\n1,4\n2,6\n", "text/csv");
    await page.getByTestId("file-list").getByText("field-counts.csv").waitFor();
    await chooseFile(page, "supplement-upload-v1", writeSpec("paper.pdf", "this is not a PDF"));
    await page
      .getByTestId("supplement-upload-result")
      .getByText('was not stored: The content of "paper.pdf" does not match its type: it is not a PDF (it does not start with %PDF-).')
      .waitFor();
    await screenshot(page, "deposit-version-files");

    // v2: a corrected spec, again watched without a reload.
    await page.getByRole("link", { name: "All versions" }).click();
    await page.waitForURL(`**/workspace/models/${slug}`);
    const corrected = JSON.parse(exampleText) as { summary: string; claims: { id: string; note?: string }[] };
    corrected.summary = `${corrected.summary} Corrected: the fixation claim's note now says what was measured.`;
    for (const c of corrected.claims) if (c.id === "trough-fixation") c.note = "Measured in the dew season of the fictional dune.";
    await markNoReload(page);
    await dropFile(page, "spec-upload", "dunes-v2.json", JSON.stringify(corrected, null, 2), "application/json");
    await page.getByTestId("spec-upload-result").getByText("v2 was made from dunes-v2.json").waitFor();
    // Straight to v2's page: while the job runs it shows the job's state, then the report, with no reload.
    await page.getByRole("link", { name: "v2", exact: true }).click();
    await page.waitForURL(`**/workspace/models/${slug}/v/2`);
    await markNoReload(page);
    await page.getByTestId("report-view").waitFor({ timeout: 60_000 });
    expect(await stillNoReload(page)).toBe(true);
    await page.getByRole("link", { name: "All versions" }).click();
    await page.waitForURL(`**/workspace/models/${slug}`);
    await page.getByTestId("version-2-state").locator("[data-verdict]").waitFor({ timeout: 60_000 });
    await screenshot(page, "deposit-model-entry-v2");
    await page.emulateMedia({ colorScheme: "dark" });
    await screenshot(page, "deposit-model-entry-v2-dark");
    await page.emulateMedia({ colorScheme: "light" });

    // One mail per finished version, listed in the captured-mail page.
    const subjects = [1, 2].map((n) => `Restpoint: version ${n} of "${title}" is confirmed`);
    await page.getByRole("link", { name: "Captured mail" }).first().click();
    await page.waitForURL("**/dev/mail");
    const list = page.getByTestId("mail-list");
    // The worker sends each mail after storing the report; give the second one a moment.
    const deadline = Date.now() + 20_000;
    let listed = (await list.textContent()) ?? "";
    while (!subjects.every((s) => listed.includes(s)) && Date.now() < deadline) {
      await page.waitForTimeout(500);
      await page.reload();
      listed = (await list.textContent()) ?? "";
    }
    for (const s of subjects) expect(listed).toContain(s);
    expect((await mailTo(email)).subject).toMatch(/^Restpoint: version \d of /);
    await list.getByText(`Restpoint: version 2 of "${title}" is confirmed`).click();
    await expect(page.getByTestId("mail-message").textContent()).resolves.toContain("Verdict: confirmed.");
    await screenshot(page, "deposit-captured-mail");
    // The mail's link leads to the version's report.
    await page.getByTestId("mail-message").getByTestId("mail-link").first().click();
    await page.waitForURL(`**/workspace/models/${slug}/v/2`);
    await page.getByTestId("report-view").waitFor();
  });
});

describe("a script with an API token", () => {
  it("creates a token in the settings, uploads a version with fetch() and polls its report", async () => {
    const { page } = await newAuthor("Ash Script");
    await page.goto("/workspace/settings/tokens");
    await page.getByLabel("Name of a new token").fill("upload script");
    await page.getByRole("button", { name: "Create token" }).click();
    const token = (await page.getByTestId("new-token-value").textContent()) ?? "";
    expect(token).toMatch(/^rp_/);
    await screenshot(page, "deposit-token-created");
    // Shown once: after a reload only the prefix is listed.
    await page.reload();
    await expect(page.getByTestId("new-token").count()).resolves.toBe(0);
    await expect(page.getByTestId("active-tokens").textContent()).resolves.toContain(token.slice(0, 9));

    const { baseUrl } = app();
    const auth = { authorization: `Bearer ${token}` };
    const created = await fetch(`${baseUrl}/api/v1/models`, {
      method: "POST",
      headers: { ...auth, "content-type": "application/json" },
      body: JSON.stringify({ title: "Mist beetles, from a script" }),
    });
    expect(created.status).toBe(201);
    const { model } = (await created.json()) as { model: { slug: string } };
    const upload = await fetch(`${baseUrl}/api/v1/models/${model.slug}/versions`, {
      method: "POST",
      headers: { ...auth, "content-type": "application/json" },
      body: exampleText,
    });
    expect(upload.status).toBe(201);
    let answer: { state: string; verdict?: string } = { state: "queued" };
    const deadline = Date.now() + 60_000;
    while (Date.now() < deadline) {
      const res = await fetch(`${baseUrl}/api/v1/models/${model.slug}/versions/1/report`, { headers: auth });
      answer = (await res.json()) as typeof answer;
      if (res.status === 200) break;
      expect(res.status).toBe(202);
      await new Promise((r) => setTimeout(r, 500));
    }
    expect(answer.state).toBe("finished");
    expect(answer.verdict).toBe("confirmed");

    // Another author's private model is not there for this one, on pages and API alike.
    expect(privateSlug).not.toBe("");
    for (const p of [`/workspace/models/${privateSlug}`, `/workspace/models/${privateSlug}/v/1`]) {
      await page.goto(p);
      await page.getByTestId("status-404").waitFor();
    }
    await screenshot(page, "deposit-other-authors-model");
    for (const p of [`/api/v1/models/${privateSlug}`, `/api/v1/models/${privateSlug}/versions/1/report`, `/api/v1/models/${privateSlug}/versions/1/files`]) {
      expect((await fetch(`${baseUrl}${p}`, { headers: auth })).status, p).toBe(404);
    }
    await page.goto("/workspace/settings/tokens");

    // Revoked in the settings: the script is refused from then on.
    await page.getByRole("button", { name: "Revoke the token upload script" }).click();
    await page.getByTestId("revoked-tokens").waitFor();
    const after = await fetch(`${baseUrl}/api/v1/models`, { headers: auth });
    expect(after.status).toBe(401);
    await screenshot(page, "deposit-token-revoked");
  });
});

describe("an upload that never reaches the server", () => {
  it("says so beside the widget, and the model stays without a version", async () => {
    const page = await b.page();
    await signIn(page, "author");
    await page.goto("/workspace/models/new");
    await page.getByLabel("Title", { exact: true }).fill("Upload on a broken line");
    await page.getByRole("button", { name: "Create the model entry" }).click();
    await page.waitForURL(/\/workspace\/models\/rp-[a-z0-9]+\?created=1$/);
    await page.route("**/api/v1/models/*/versions", (route) => route.abort("connectionreset"));
    await dropFile(page, "spec-upload", "dunes.json", exampleText, "application/json");
    await page
      .getByTestId("spec-upload-result")
      .getByText("The upload did not reach the server. Check the connection and try again.")
      .waitFor();
    await expect(page.getByText("No version yet. Upload the model’s specification to make v1.").count()).resolves.toBe(1);
    await screenshot(page, "deposit-upload-network-error");
  });
});
