/**
 * An editor of another venue against a private submission to the demo venue: every page and
 * route answers 403 or 404 and none of them shows the model's title. The second editor is a
 * copy of the demo editor's credentials under a new address (rows written straight into the
 * app's database, as the harness reads captured mail from it); their venue is made through
 * the admin API.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { createClient } from "@libsql/client";
import { DEMO_VENUE } from "@/lib/demo/accounts";
import { app, demo, sessionCookie } from "./support/harness";

const TITLE = `Lagoon shrimp sentinels ${Date.now().toString(36)}`;
const OTHER_EMAIL = `second-editor-${Date.now().toString(36)}@example.test`;
let authorCookie = "";
let otherCookie = "";
let slug = "";
const db = () => createClient({ url: `file:${app().databaseFile}` });

async function call(cookie: string, path: string, init: { method?: string; body?: unknown } = {}): Promise<Response> {
  const headers: Record<string, string> = { cookie, origin: app().baseUrl };
  if (init.body !== undefined) headers["content-type"] = "application/json";
  return fetch(`${app().baseUrl}${path}`, {
    method: init.method ?? "GET",
    headers,
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
    redirect: "manual",
  });
}

beforeAll(async () => {
  authorCookie = await sessionCookie("author");
  const adminCookie = await sessionCookie("admin");
  // A second editor account with the demo editor's password hash.
  const client = db();
  try {
    const editor = await client.execute({ sql: "select u.id, a.password from user u join account a on a.user_id = u.id where u.email = ?", args: [demo("editor").email] });
    const hash = String(editor.rows[0]?.password ?? "");
    const id = crypto.randomUUID();
    const now = Date.now();
    await client.execute({
      sql: "insert into user (id, name, email, email_verified, role, created_at, updated_at) values (?, 'Second Editor', ?, 1, 'editor', ?, ?)",
      args: [id, OTHER_EMAIL, now, now],
    });
    await client.execute({
      sql: "insert into account (id, account_id, provider_id, user_id, password, created_at, updated_at) values (?, ?, 'credential', ?, ?, ?, ?)",
      args: [crypto.randomUUID(), id, id, hash, now, now],
    });
  } finally {
    client.close();
  }
  otherCookie = await sessionCookie({ email: OTHER_EMAIL, password: demo("editor").password });
  const venueSlug = `lagoon-notes-${Date.now().toString(36)}`;
  expect((await call(adminCookie, "/api/v1/venues", { method: "POST", body: { slug: venueSlug, name: "Lagoon Notes" } })).status).toBe(201);
  expect((await call(adminCookie, `/api/v1/venues/${venueSlug}/editors`, { method: "POST", body: { email: OTHER_EMAIL } })).status).toBe(201);

  // A private model submitted to the demo venue.
  const venues = (await (await call(authorCookie, "/api/v1/venues")).json()) as { venues: { id: string; slug: string }[] };
  const venueId = venues.venues.find((v) => v.slug === DEMO_VENUE.slug)?.id;
  const created = await call(authorCookie, "/api/v1/models", { method: "POST", body: { title: TITLE, venueId } });
  slug = ((await created.json()) as { model: { slug: string } }).model.slug;
  const spec = JSON.stringify({
    format: "restpoint/model@1",
    title: TITLE,
    game: { kind: "symmetric", strategies: ["Watch", "Feed"], payoffs: [[1, 3], [2, 1]] },
    claims: [{ id: "count", kind: "rest-point-count", count: 3 }],
  });
  const up = await fetch(`${app().baseUrl}/api/v1/models/${slug}/versions`, { method: "POST", headers: { cookie: authorCookie, origin: app().baseUrl, "content-type": "application/json" }, body: spec });
  expect(up.status).toBe(201);
  expect((await call(authorCookie, `/api/v1/venues/${DEMO_VENUE.slug}/submissions`, { method: "POST", body: { model: slug, version: 1 } })).status).toBe(201);
}, 120_000);


describe("an editor of another venue", () => {
  // The page rows need the 403/404 status to reach the browser: a loading.tsx above these
  // pages (app/(workspace)/workspace/loading.tsx) streams a 200 shell before the page's check.
  const cases: { label: string; path: () => string; method?: string; body?: unknown; status: number }[] = [
    { label: "queue page", path: () => `/workspace/venues/${DEMO_VENUE.slug}`, status: 403 },
    { label: "review page", path: () => `/workspace/venues/${DEMO_VENUE.slug}/review/${slug}/v/1`, status: 403 },
    { label: "compare page", path: () => `/workspace/models/${slug}/compare?from=1&to=1`, status: 404 },
    { label: "queue API", path: () => `/api/v1/venues/${DEMO_VENUE.slug}/queue`, status: 403 },
    { label: "queue API searching the title", path: () => `/api/v1/venues/${DEMO_VENUE.slug}/queue?q=${encodeURIComponent(TITLE)}`, status: 403 },
    { label: "decisions", path: () => `/api/v1/models/${slug}/versions/1/decisions`, status: 404 },
    { label: "recording a decision", path: () => `/api/v1/models/${slug}/versions/1/decisions`, method: "POST", body: { outcome: "declined", comment: "not mine" }, status: 404 },
    { label: "diff API", path: () => `/api/v1/models/${slug}/diff?from=1&to=1`, status: 404 },
    { label: "audit trail", path: () => `/api/v1/models/${slug}/audit`, status: 404 },
    { label: "model badge", path: () => `/badges/models/${slug}.svg`, status: 404 },
    { label: "version badge", path: () => `/badges/models/${slug}/v/1.svg`, status: 404 },
  ];
  for (const c of cases) {
    it(`${c.label} answers ${c.status} without the title`, async () => {
      const res = await call(otherCookie, c.path(), { method: c.method, body: c.body });
      const text = await res.text();
      expect(text).not.toContain(TITLE);
      expect(res.status).toBe(c.status);
    });
  }

  it("sees only their own venue in the venues list", async () => {
    const res = await call(otherCookie, "/workspace/venues");
    const html = await res.text();
    expect(res.status).toBe(200);
    expect(html).toContain("Lagoon Notes");
    expect(html).not.toContain("Tidewater Letters in Behavioural Ecology");
  });

  it("while the demo venue's editor sees the submission", async () => {
    const editorCookie = await sessionCookie("editor");
    const res = await call(editorCookie, `/api/v1/venues/${DEMO_VENUE.slug}/queue?q=${encodeURIComponent(TITLE)}`);
    expect(res.status).toBe(200);
    const body = (await res.json()) as { rows: { model: { slug: string } }[] };
    expect(body.rows.map((r) => r.model.slug)).toEqual([slug]);
  });
});
