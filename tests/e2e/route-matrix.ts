/**
 * Who gets what from each route: the expected HTTP status for an anonymous visitor and for
 * each demo role (routes.test.ts requests every row as each of them, without following
 * redirects). Add a row for every page or route handler you add; `roles` may leave a role
 * out when it does not matter, and `note` says why a status is what it is.
 *
 *   { path: "/workspace/venues", expect: { anonymous: 401, author: 403, editor: 200, admin: 200 } },
 *   { path: "/api/v1/models", method: "POST", body: {...}, expect: { anonymous: 401, author: 201 } },
 */
export type Who = "anonymous" | "author" | "editor" | "admin";

export interface RouteRow {
  path: string;
  method?: "GET" | "POST" | "PATCH" | "PUT" | "DELETE";
  /** JSON body for methods that take one. */
  body?: unknown;
  expect: Partial<Record<Who, number>>;
  note?: string;
}

export const ROUTES: RouteRow[] = [
  // Public pages
  { path: "/", expect: { anonymous: 200, author: 200, editor: 200, admin: 200 } },
  { path: "/sign-in", expect: { anonymous: 200 }, note: "signed-in visitors are sent on to their workspace" },
  { path: "/sign-in", expect: { author: 307 } },
  { path: "/sign-up", expect: { anonymous: 200, editor: 307 } },
  { path: "/verify-email", expect: { anonymous: 200, author: 200 } },
  { path: "/verify-email?confirmed=1", expect: { anonymous: 200 } },
  { path: "/forgot-password", expect: { anonymous: 200 } },
  { path: "/reset-password?token=x", expect: { anonymous: 200 } },
  { path: "/no-such-page", expect: { anonymous: 404, author: 404 } },

  // Signed-in workspace
  { path: "/workspace", expect: { anonymous: 401, author: 200, editor: 200, admin: 200 } },

  // Administration
  { path: "/admin", expect: { anonymous: 401, author: 403, editor: 403, admin: 200 } },
  { path: "/admin/accounts", expect: { anonymous: 401, author: 403, editor: 403, admin: 200 } },
  { path: "/admin/mail", expect: { anonymous: 401, author: 403, editor: 403, admin: 200 } },

  // Captured mail for any signed-in user while the fake SMTP server is in use
  { path: "/dev/mail", expect: { anonymous: 401, author: 200, editor: 200, admin: 200 } },

  // better-auth's own endpoints
  { path: "/api/auth/get-session", expect: { anonymous: 200, author: 200 } },
  // The admin plugin's endpoints are off (lib/auth.ts): roles change only through /admin/accounts.
  { path: "/api/auth/admin/list-users", expect: { anonymous: 404, author: 404, editor: 404, admin: 404 } },
  {
    path: "/api/auth/admin/set-role",
    method: "POST",
    body: { userId: "nobody", role: "admin" },
    expect: { anonymous: 404, author: 404, editor: 404, admin: 404 },
  },
  {
    path: "/api/auth/admin/impersonate-user",
    method: "POST",
    body: { userId: "nobody" },
    expect: { anonymous: 404, author: 404, editor: 404, admin: 404 },
  },

  // Deposit: the author's workspace pages, the deposit API and the JSON Schema
  { path: "/workspace/models", expect: { anonymous: 401, author: 200, editor: 200, admin: 200 } },
  { path: "/workspace/models/new", expect: { anonymous: 401, author: 200, editor: 200, admin: 200 } },
  { path: "/workspace/settings/tokens", expect: { anonymous: 401, author: 200, editor: 200, admin: 200 } },
  { path: "/workspace/models/rp-nosuch", expect: { anonymous: 401, author: 404, admin: 404 } },
  { path: "/workspace/models/rp-nosuch/v/1", expect: { anonymous: 401, author: 404 } },
  { path: "/schemas/model-spec.v1.json", expect: { anonymous: 200, author: 200 } },
  { path: "/api/v1/models", expect: { anonymous: 401, author: 200, editor: 200, admin: 200 } },
  { path: "/api/v1/models", method: "POST", body: { title: "Route matrix probe" }, expect: { anonymous: 401, author: 201 } },
  { path: "/api/v1/models", method: "POST", body: { title: "" }, expect: { author: 422 }, note: "an empty title breaks the entry schema" },
  { path: "/api/v1/models/rp-nosuch", expect: { anonymous: 404, author: 404, admin: 404 } },
  { path: "/api/v1/models/rp-nosuch", method: "PATCH", body: { title: "x" }, expect: { anonymous: 401, author: 404 } },
  { path: "/api/v1/models/rp-nosuch/versions", expect: { anonymous: 404, author: 404 } },
  { path: "/api/v1/models/rp-nosuch/versions", method: "POST", body: {}, expect: { anonymous: 401, author: 404 } },
  { path: "/api/v1/models/rp-nosuch/versions/1", expect: { anonymous: 404, author: 404 } },
  { path: "/api/v1/models/rp-nosuch/versions/1/report", expect: { anonymous: 404, author: 404 } },
  { path: "/api/v1/models/rp-nosuch/versions/1/files", expect: { anonymous: 404, author: 404 } },
  { path: "/api/v1/files/no-such-file", expect: { anonymous: 404, author: 404 } },
  { path: "/api/v1/jobs/no-such-job", expect: { anonymous: 404, author: 404 } },
  { path: "/api/v1/tokens", expect: { anonymous: 401, author: 200, editor: 200, admin: 200 } },
  { path: "/api/v1/tokens", method: "POST", body: { name: "" }, expect: { anonymous: 401, author: 422 } },
  { path: "/api/v1/tokens/no-such-token", method: "DELETE", expect: { anonymous: 401, author: 404 } },

  // Editors: venues, queue, review, compare, decisions, badges (the demo editor edits tidewater-letters;
  // an editor of another venue is covered in tests/integration/editors-matrix.test.ts)
  { path: "/workspace/venues", expect: { anonymous: 401, author: 403, editor: 200, admin: 200 } },
  { path: "/workspace/venues/tidewater-letters", expect: { anonymous: 401, author: 403, editor: 200, admin: 200 } },
  { path: "/workspace/venues/no-such-venue", expect: { editor: 404, admin: 404 } },
  { path: "/workspace/venues/tidewater-letters/review/rp-nosuch/v/1", expect: { anonymous: 401, author: 403, editor: 404, admin: 404 } },
  { path: "/workspace/models/rp-nosuch/compare?from=1&to=2", expect: { anonymous: 401, author: 404, editor: 404, admin: 404 } },
  { path: "/admin/venues", expect: { anonymous: 401, author: 403, editor: 403, admin: 200 } },
  { path: "/api/v1/venues", expect: { anonymous: 401, author: 200, editor: 200, admin: 200 } },
  { path: "/api/v1/venues", method: "POST", body: { slug: "", name: "" }, expect: { anonymous: 401, author: 403, editor: 403, admin: 422 } },
  { path: "/api/v1/venues/tidewater-letters/queue", expect: { anonymous: 401, author: 403, editor: 200, admin: 200 } },
  { path: "/api/v1/venues/tidewater-letters/queue?sort=colour", expect: { editor: 422 } },
  { path: "/api/v1/venues/no-such-venue/queue", expect: { editor: 404 } },
  { path: "/api/v1/venues/tidewater-letters/editors", expect: { anonymous: 401, author: 403, editor: 403, admin: 200 } },
  { path: "/api/v1/venues/tidewater-letters/editors", method: "POST", body: { email: "" }, expect: { anonymous: 401, editor: 403, admin: 422 } },
  { path: "/api/v1/venues/tidewater-letters/editors", method: "DELETE", body: { userId: "nobody" }, expect: { anonymous: 401, editor: 403, admin: 404 } },
  { path: "/api/v1/venues/tidewater-letters/submissions", method: "POST", body: { model: "rp-nosuch", version: 1 }, expect: { anonymous: 401, author: 404 } },
  { path: "/api/v1/models/rp-nosuch/versions/1/decisions", expect: { anonymous: 404, editor: 404 } },
  {
    path: "/api/v1/models/rp-nosuch/versions/1/decisions",
    method: "POST",
    body: { outcome: "declined", comment: "probe" },
    expect: { anonymous: 401, author: 403, editor: 404 },
    note: "deciding needs the editor role; an unknown model is 404 to an editor",
  },
  { path: "/api/v1/models/rp-nosuch/diff?from=1&to=2", expect: { anonymous: 401, author: 404, editor: 404 } },
  { path: "/api/v1/models/rp-nosuch/audit", expect: { anonymous: 401, author: 404, editor: 404 } },
  { path: "/badges/models/rp-nosuch.svg", expect: { anonymous: 404, author: 404 } },
  { path: "/badges/models/rp-nosuch/v/1.svg", expect: { anonymous: 404, editor: 404 } },
];
