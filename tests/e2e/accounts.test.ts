/** Browser journeys of the app frame: sign-up to workspace, promotion by an admin, refusals. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mailTo, openBrowser, screenshot, signIn, uniqueEmail, type OpenBrowser } from "./support/harness";

let b: OpenBrowser;
beforeAll(async () => {
  b = await openBrowser();
});
afterAll(async () => {
  await b.close();
});

const PASSWORD = "kelp-forest-morning-9";

async function signUp(name: string, email: string) {
  const page = await b.page();
  await page.goto("/sign-up");
  await page.getByLabel("Name").fill(name);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Create account" }).click();
  await page.getByTestId("sign-up-done").waitFor();
  return page;
}

describe("a new user", () => {
  it("signs up, reads the confirmation in the captured mail, confirms, signs in and sees the author workspace", async () => {
    // Someone else's mail (a reset link for the demo editor) that the newcomer must not see.
    const other = await b.page();
    await other.goto("/forgot-password");
    await other.getByLabel("E-mail address").fill("editor@restpoint.local");
    await other.getByRole("button", { name: "Send the link" }).click();
    const othersMail = await mailTo("editor@restpoint.local");

    const email = uniqueEmail("newcomer");
    const page = await signUp("Imke Newcomer", email);
    await expect(page.getByTestId("sign-up-done").textContent()).resolves.toContain(email);
    await screenshot(page, "journey-sign-up-done");

    await page.getByRole("link", { name: "Open the captured mail" }).click();
    await page.waitForURL("**/dev/mail");
    const message = page.getByTestId("mail-message");
    await expect(message.textContent()).resolves.toContain("Confirm your e-mail address for Restpoint");
    const list = await page.getByTestId("mail-list").textContent();
    expect(list).toContain(email);
    expect(list).not.toContain("editor@restpoint.local");
    await screenshot(page, "journey-captured-mail");
    // Asking for the other message by its id shows the newcomer's own mail instead.
    await page.goto(`/dev/mail?id=${othersMail.id}`);
    await expect(page.getByTestId("mail-message").textContent()).resolves.not.toContain("Set a new Restpoint password");
    await page.goBack();

    await message.getByTestId("mail-link").first().click();
    await page.waitForURL("**/verify-email?confirmed=1");
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("Address confirmed");
    await page.getByRole("link", { name: "Sign in" }).last().click();
    await page.waitForURL("**/sign-in");

    await page.getByLabel("E-mail address").fill(email);
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL("**/workspace");
    await page.getByTestId("workspace-author").waitFor();
    await expect(page.getByRole("heading", { name: "Your models" }).count()).resolves.toBe(1);
    await expect(page.getByRole("heading", { name: "Your venues" }).count()).resolves.toBe(0);
    await expect(page.getByTestId("signed-in-role").textContent()).resolves.toBe("Author");
    await screenshot(page, "journey-author-workspace");
  });

  it("cannot sign in before confirming, and is told why", async () => {
    const email = uniqueEmail("hasty");
    const page = await signUp("Hasty Person", email);
    await page.goto("/sign-in");
    await page.getByLabel("E-mail address").fill(email);
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByRole("alert").filter({ hasText: "Confirm your e-mail address first: we have just sent you a new link." }).waitFor();
    expect(new URL(page.url()).pathname).toBe("/sign-in");
  });

  it("sees the sign-up refusals beside the fields", async () => {
    const page = await b.page();
    await page.goto("/sign-up");
    await page.getByLabel("Name").fill("Someone");
    await page.getByLabel("E-mail address").fill("author@restpoint.local");
    await page.getByLabel("Password").fill("short");
    await page.getByRole("button", { name: "Create account" }).click();
    await expect(page.locator("#field-password-error").textContent()).resolves.toBe("Use at least 10 characters for your password.");
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByRole("button", { name: "Create account" }).click();
    await expect(page.locator("#field-email-error").textContent()).resolves.toBe(
      "An account with this e-mail address already exists. Sign in, or reset your password if you forgot it.",
    );
    await page.getByLabel("E-mail address").fill("not-an-address");
    await page.getByRole("button", { name: "Create account" }).click();
    await expect(page.locator("#field-email-error").textContent()).resolves.toBe("Enter an e-mail address such as name@example.org.");
    await screenshot(page, "journey-sign-up-refusals");
  });
});

describe("roles", () => {
  it("an admin promotes an author to editor, who then sees the editor workspace", async () => {
    // A fresh author, confirmed through the mail link.
    const email = uniqueEmail("promoted");
    const page = await signUp("Oskar Promoted", email);
    const mail = await mailTo(email);
    const link = /https?:\/\/\S+verify-email\S+/.exec(mail.text)?.[0];
    expect(link).toBeDefined();
    await page.goto(link ?? "");
    await page.waitForURL("**/verify-email?confirmed=1");
    await signIn(page, { email, password: PASSWORD });
    await page.getByTestId("workspace-author").waitFor();

    const admin = await b.page();
    await signIn(admin, "admin", "/admin/accounts");
    const row = admin.getByTestId(`role-form-${email}`);
    await row.getByRole("combobox").selectOption("editor");
    await row.getByRole("button", { name: "Save" }).click();
    await expect(row.getByRole("status").textContent()).resolves.toContain("Oskar Promoted is now an editor.");
    await screenshot(admin, "journey-admin-promoted");

    await page.reload();
    await page.getByTestId("workspace-editor").waitFor();
    await expect(page.getByRole("heading", { name: "Your venues" }).count()).resolves.toBe(1);
    await expect(page.getByText("You are not an editor of any venue yet.").count()).resolves.toBe(1);
    await expect(page.getByTestId("signed-in-role").textContent()).resolves.toBe("Editor");
  });

  it("the demo editor sees the demo venue", async () => {
    const page = await b.page();
    await signIn(page, "editor");
    await page.getByTestId("workspace-editor").waitFor();
    await expect(page.getByRole("heading", { name: "Tidewater Letters in Behavioural Ecology" }).count()).resolves.toBe(1);
  });

  it("an author opening an admin page gets the 403 page and no admin content", async () => {
    const page = await b.page();
    await signIn(page, "author");
    const res = await page.goto("/admin/accounts");
    expect(res?.status()).toBe(403);
    await page.getByTestId("status-403").waitFor();
    await expect(page.getByRole("link", { name: "Administration" }).count()).resolves.toBe(0);
    await expect(page.locator("table").count()).resolves.toBe(0);
    await screenshot(page, "journey-author-admin-403");
  });

  it("an anonymous visitor opening the workspace gets the 401 page with a way back after sign-in", async () => {
    const page = await b.page();
    const res = await page.goto("/workspace");
    expect(res?.status()).toBe(401);
    await page.getByTestId("status-401").waitFor();
    await page.getByRole("link", { name: "Sign in" }).last().click();
    await page.waitForURL("**/sign-in?next=%2Fworkspace");
    await page.getByLabel("E-mail address").fill("author@restpoint.local");
    await page.getByLabel("Password").fill("reef-writer-2026");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL("**/workspace");
  });
});
