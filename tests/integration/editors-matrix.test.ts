/**
 * Every editors' route against every kind of caller, as a table: the status each one gets.
 * The subject is a PRIVATE model of `owner` submitted to venue A (editors: editorA); editorB
 * edits venue B only; `stranger` is another author. Rows that change state get a fresh
 * model per cell, so the cells do not depend on each other's order.
 */
import "./editors-env";
import { beforeAll, describe, expect, it } from "vitest";
import { accountWithToken, ctx, jsonRequest, request, type TestAccount } from "./api-support";
import { addSubmitted, makeModel, makeVenueWith, migrated, setVisibility } from "./editors-support";

type Who = "anonymous" | "owner" | "stranger" | "editorA" | "editorB" | "admin";
const WHO: Who[] = ["anonymous", "owner", "stranger", "editorA", "editorB", "admin"];

let people: Record<Exclude<Who, "anonymous">, TestAccount>;
let venueA: { id: string; slug: string; name: string };
let venueB: { id: string; slug: string; name: string };

type Handler = (req: Request, c: { params: Promise<Record<string, string>> }) => Promise<Response>;
async function load(path: string, method: string): Promise<Handler> {
  const mod = (await import(/* @vite-ignore */ path)) as Record<string, Handler | undefined>;
  const h = mod[method];
  if (h === undefined) throw new Error(`${path} has no ${method}`);
  return h;
}

interface Subject {
  slug: string;
}

/** A private model of the owner, v1 and v2 submitted to venue A, each with a report. */
async function subject(): Promise<Subject> {
  const owner = { id: people.owner.id, role: people.owner.role, email: people.owner.email };
  const m = await makeModel(owner, venueA.id, { title: "Matrix model" });
  await addSubmitted(owner, m, 1);
  await addSubmitted(owner, m, 2);
  return m;
}

interface Row {
  name: string;
  module: string;
  method: "GET" | "POST" | "DELETE";
  /** Fresh subject per cell for rows that change state. */
  fresh?: boolean;
  path: (s: Subject) => string;
  params: (s: Subject) => Record<string, string>;
  body?: (s: Subject, who: Who) => unknown;
  expect: Record<Who, number>;
}

let shared: Subject;
let counter = 0;

const ROWS: Row[] = [
  {
    name: "list venues",
    module: "@/app/api/v1/venues/route",
    method: "GET",
    path: () => "/api/v1/venues",
    params: () => ({}),
    expect: { anonymous: 401, owner: 200, stranger: 200, editorA: 200, editorB: 200, admin: 200 },
  },
  {
    name: "create a venue",
    module: "@/app/api/v1/venues/route",
    method: "POST",
    path: () => "/api/v1/venues",
    params: () => ({}),
    body: () => ({ slug: `matrix-venue-${++counter}`, name: "Matrix venue" }),
    expect: { anonymous: 401, owner: 403, stranger: 403, editorA: 403, editorB: 403, admin: 201 },
  },
  {
    name: "list a venue's editors",
    module: "@/app/api/v1/venues/[venue]/editors/route",
    method: "GET",
    path: () => `/api/v1/venues/${venueA.slug}/editors`,
    params: () => ({ venue: venueA.slug }),
    expect: { anonymous: 401, owner: 403, stranger: 403, editorA: 403, editorB: 403, admin: 200 },
  },
  {
    name: "assign an editor",
    module: "@/app/api/v1/venues/[venue]/editors/route",
    method: "POST",
    path: () => `/api/v1/venues/${venueB.slug}/editors`,
    params: () => ({ venue: venueB.slug }),
    body: () => ({ email: people.editorB.email }),
    expect: { anonymous: 401, owner: 403, stranger: 403, editorA: 403, editorB: 403, admin: 201 },
  },
  {
    name: "remove an editor",
    module: "@/app/api/v1/venues/[venue]/editors/route",
    method: "DELETE",
    path: () => `/api/v1/venues/${venueA.slug}/editors`,
    params: () => ({ venue: venueA.slug }),
    // Not an editor of A: the admin gets 404 and nothing changes for the other cells.
    body: () => ({ userId: people.stranger.id }),
    expect: { anonymous: 401, owner: 403, stranger: 403, editorA: 403, editorB: 403, admin: 404 },
  },
  {
    name: "read the queue",
    module: "@/app/api/v1/venues/[venue]/queue/route",
    method: "GET",
    path: () => `/api/v1/venues/${venueA.slug}/queue`,
    params: () => ({ venue: venueA.slug }),
    expect: { anonymous: 401, owner: 403, stranger: 403, editorA: 200, editorB: 403, admin: 200 },
  },
  {
    name: "submit a version",
    module: "@/app/api/v1/venues/[venue]/submissions/route",
    method: "POST",
    path: () => `/api/v1/venues/${venueA.slug}/submissions`,
    params: () => ({ venue: venueA.slug }),
    body: (s) => ({ model: s.slug, version: 2 }),
    expect: { anonymous: 401, owner: 200, stranger: 404, editorA: 403, editorB: 404, admin: 200 },
  },
  {
    name: "read decisions",
    module: "@/app/api/v1/models/[slug]/versions/[number]/decisions/route",
    method: "GET",
    path: (s) => `/api/v1/models/${s.slug}/versions/2/decisions`,
    params: (s) => ({ slug: s.slug, number: "2" }),
    expect: { anonymous: 404, owner: 200, stranger: 404, editorA: 200, editorB: 404, admin: 200 },
  },
  {
    name: "record a decision",
    module: "@/app/api/v1/models/[slug]/versions/[number]/decisions/route",
    method: "POST",
    fresh: true,
    path: (s) => `/api/v1/models/${s.slug}/versions/2/decisions`,
    params: (s) => ({ slug: s.slug, number: "2" }),
    body: () => ({ outcome: "changes-requested", comment: "Please add the stability of the mixed state." }),
    // The owner has the author role (403 by role); the admin is no editor of venue A.
    expect: { anonymous: 401, owner: 403, stranger: 403, editorA: 201, editorB: 404, admin: 403 },
  },
  {
    name: "record a decision on a non-latest version",
    module: "@/app/api/v1/models/[slug]/versions/[number]/decisions/route",
    method: "POST",
    path: (s) => `/api/v1/models/${s.slug}/versions/1/decisions`,
    params: (s) => ({ slug: s.slug, number: "1" }),
    body: () => ({ outcome: "declined", comment: "Older version." }),
    expect: { anonymous: 401, owner: 403, stranger: 403, editorA: 409, editorB: 404, admin: 403 },
  },
  {
    name: "compare versions",
    module: "@/app/api/v1/models/[slug]/diff/route",
    method: "GET",
    path: (s) => `/api/v1/models/${s.slug}/diff?from=1&to=2`,
    params: (s) => ({ slug: s.slug }),
    expect: { anonymous: 401, owner: 200, stranger: 404, editorA: 200, editorB: 404, admin: 200 },
  },
  {
    name: "read the audit trail",
    module: "@/app/api/v1/models/[slug]/audit/route",
    method: "GET",
    path: (s) => `/api/v1/models/${s.slug}/audit`,
    params: (s) => ({ slug: s.slug }),
    expect: { anonymous: 401, owner: 200, stranger: 404, editorA: 200, editorB: 404, admin: 200 },
  },
  {
    name: "model badge",
    module: "@/app/badges/models/[slug]/route",
    method: "GET",
    path: (s) => `/badges/models/${s.slug}.svg`,
    params: (s) => ({ slug: `${s.slug}.svg` }),
    expect: { anonymous: 404, owner: 200, stranger: 404, editorA: 200, editorB: 404, admin: 200 },
  },
  {
    name: "version badge",
    module: "@/app/badges/models/[slug]/v/[number]/route",
    method: "GET",
    path: (s) => `/badges/models/${s.slug}/v/1.svg`,
    params: (s) => ({ slug: s.slug, number: "1.svg" }),
    expect: { anonymous: 404, owner: 200, stranger: 404, editorA: 200, editorB: 404, admin: 200 },
  },
];

beforeAll(async () => {
  await migrated();
  people = {
    owner: await accountWithToken("Owner", "author"),
    stranger: await accountWithToken("Stranger", "author"),
    editorA: await accountWithToken("EditorA", "editor"),
    editorB: await accountWithToken("EditorB", "editor"),
    admin: await accountWithToken("Admin", "admin"),
  };
  venueA = await makeVenueWith("matrix-a", [people.editorA]);
  venueB = await makeVenueWith("matrix-b", []);
  shared = await subject();
});

describe("editors' routes x callers", () => {
  for (const row of ROWS) {
    for (const who of WHO) {
      it(`${row.method} ${row.name} as ${who} -> ${row.expect[who]}`, async () => {
        const s = row.fresh === true ? await subject() : shared;
        const handler = await load(row.module, row.method);
        const auth = who === "anonymous" ? {} : { token: people[who].token };
        const req = row.body === undefined ? request(row.method, row.path(s), auth) : jsonRequest(row.method, row.path(s), auth, row.body(s, who));
        const res = await handler(req, ctx(row.params(s)));
        expect(res.status).toBe(row.expect[who]);
        if (res.status >= 400) {
          const b = (await res.json()) as { error?: { code?: string; message?: string } };
          expect(typeof b.error?.message).toBe("string");
        }
      });
    }
  }
});

describe("a public model", () => {
  it("shows its badges to anyone with public caching, but keeps review routes to its reviewers", async () => {
    const s = await subject();
    const { db } = await import("@/db/client");
    const { model } = await import("@/db/schema");
    const { eq } = await import("drizzle-orm");
    const [row] = await db.select({ id: model.id }).from(model).where(eq(model.slug, s.slug));
    await setVisibility(row?.id ?? "", "public");
    const badge = await load("@/app/badges/models/[slug]/route", "GET");
    const res = await badge(request("GET", `/badges/models/${s.slug}.svg`), ctx({ slug: `${s.slug}.svg` }));
    expect(res.status).toBe(200);
    expect(res.headers.get("cache-control")).toBe("public, max-age=60, must-revalidate");
    const diff = await load("@/app/api/v1/models/[slug]/diff/route", "GET");
    const d = await diff(request("GET", `/api/v1/models/${s.slug}/diff?from=1&to=2`, { token: people.stranger.token }), ctx({ slug: s.slug }));
    expect(d.status).toBe(403);
    expect(await d.json()).toEqual({ error: { code: "forbidden", message: "Only the model's owner, the editors of its venue and admins may see this." } });
    const post = await load("@/app/api/v1/models/[slug]/versions/[number]/decisions/route", "POST");
    const p = await post(
      jsonRequest("POST", `/api/v1/models/${s.slug}/versions/2/decisions`, { token: people.editorB.token }, { outcome: "declined", comment: "x" }),
      ctx({ slug: s.slug, number: "2" }),
    );
    expect(p.status).toBe(403);
    expect(await p.json()).toEqual({ error: { code: "forbidden", message: "You are not an editor of this venue." } });
  });
});
