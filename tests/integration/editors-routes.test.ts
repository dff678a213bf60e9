/** What the editors' routes answer on their good paths, and their error bodies. */
import "./editors-env";
import { beforeAll, describe, expect, it } from "vitest";
import { accountWithToken, ctx, jsonRequest, request, type TestAccount } from "./api-support";
import { addSubmitted, claim, makeModel, makeVenueWith, migrated } from "./editors-support";

let owner: TestAccount;
let editor: TestAccount;
let admin: TestAccount;
let venue: { id: string; slug: string; name: string };
let m: { id: string; slug: string; title: string };

const routes = {
  queue: () => import("@/app/api/v1/venues/[venue]/queue/route"),
  decisions: () => import("@/app/api/v1/models/[slug]/versions/[number]/decisions/route"),
  diff: () => import("@/app/api/v1/models/[slug]/diff/route"),
  audit: () => import("@/app/api/v1/models/[slug]/audit/route"),
  modelBadge: () => import("@/app/badges/models/[slug]/route"),
  versionBadge: () => import("@/app/badges/models/[slug]/v/[number]/route"),
  venues: () => import("@/app/api/v1/venues/route"),
  editors: () => import("@/app/api/v1/venues/[venue]/editors/route"),
  submissions: () => import("@/app/api/v1/venues/[venue]/submissions/route"),
};

const asOwner = () => ({ token: owner.token });
const asEditor = () => ({ token: editor.token });

async function decide(n: number, outcome: string, comment: string): Promise<Response> {
  const { POST } = await routes.decisions();
  return POST(jsonRequest("POST", `/api/v1/models/${m.slug}/versions/${n}/decisions`, asEditor(), { outcome, comment }), ctx({ slug: m.slug, number: String(n) }));
}
async function modelBadge(headers: Record<string, string> = {}): Promise<Response> {
  const { GET } = await routes.modelBadge();
  return GET(request("GET", `/badges/models/${m.slug}.svg`, asOwner(), { headers }), ctx({ slug: `${m.slug}.svg` }));
}
async function versionBadge(n: number, headers: Record<string, string> = {}): Promise<Response> {
  const { GET } = await routes.versionBadge();
  return GET(request("GET", `/badges/models/${m.slug}/v/${n}.svg`, asOwner(), { headers }), ctx({ slug: m.slug, number: `${n}.svg` }));
}

beforeAll(async () => {
  await migrated();
  owner = await accountWithToken("Noor", "author");
  editor = await accountWithToken("Tomas", "editor");
  admin = await accountWithToken("Rhea", "admin");
  venue = await makeVenueWith("routes", [editor]);
  const o = { id: owner.id, role: owner.role, email: owner.email };
  m = await makeModel(o, venue.id, { title: "Limpet grazing fronts" });
  await addSubmitted(o, m, 1, "contradicted", [claim("mixed-herd", "contradicted", 0.12)]);
  await addSubmitted(o, m, 2, "confirmed", [claim("mixed-herd", "confirmed", 1e-9), claim("two-rest-points", "confirmed")]);
});

describe("queue API", () => {
  it("answers a filtered page with the venue and status counts", async () => {
    const { GET } = await routes.queue();
    const res = await GET(request("GET", `/api/v1/venues/${venue.slug}/queue?q=limpet&status=awaiting-decision`, asEditor()), ctx({ venue: venue.slug }));
    expect(res.status).toBe(200);
    expect(res.headers.get("cache-control")).toBe("private, no-store");
    const b = (await res.json()) as { venue: { slug: string }; total: number; rows: { model: { slug: string }; version: { number: number } }[]; statusCounts: Record<string, number> };
    expect(b.venue.slug).toBe(venue.slug);
    expect(b.total).toBe(1);
    expect(b.rows[0]?.model.slug).toBe(m.slug);
    expect(b.rows[0]?.version.number).toBe(2);
    expect(b.statusCounts["awaiting-decision"]).toBe(1);
  });

  it("answers 422 with details for a bad query, and 404 for an unknown venue", async () => {
    const { GET } = await routes.queue();
    const bad = await GET(request("GET", `/api/v1/venues/${venue.slug}/queue?sort=colour`, asEditor()), ctx({ venue: venue.slug }));
    expect(bad.status).toBe(422);
    expect(await bad.json()).toEqual({
      error: {
        code: "validation_failed",
        message: "The queue query has invalid fields.",
        details: [{ path: "/sort", message: "Sort by one of: submitted, uploaded, decided, title, author, version, status, verdict, confirmed, contradicted, inconclusive." }],
      },
    });
    const none = await GET(request("GET", "/api/v1/venues/nowhere/queue", asEditor()), ctx({ venue: "nowhere" }));
    expect(none.status).toBe(404);
    expect(await none.json()).toEqual({ error: { code: "not_found", message: "No such venue." } });
  });
});

describe("diff API", () => {
  it("returns the spec line diff and the verdict diff", async () => {
    const { GET } = await routes.diff();
    const res = await GET(request("GET", `/api/v1/models/${m.slug}/diff?from=1&to=2`, asEditor()), ctx({ slug: m.slug }));
    expect(res.status).toBe(200);
    const b = (await res.json()) as {
      from: { number: number; verdict: string };
      to: { number: number; verdict: string };
      spec: { added: number; removed: number; rows: { kind: string; text?: string }[] };
      verdicts: { verdictChanged: boolean; counts: Record<string, number> };
    };
    expect(b.from).toMatchObject({ number: 1, verdict: "contradicted" });
    expect(b.to).toMatchObject({ number: 2, verdict: "confirmed" });
    expect(b.spec.added).toBeGreaterThan(0);
    expect(b.spec.rows.some((r) => r.kind === "added" && (r.text ?? "").includes('"two-rest-points"'))).toBe(true);
    expect(b.verdicts.verdictChanged).toBe(true);
    expect(b.verdicts.counts).toEqual({ added: 1, removed: 0, changed: 1, unchanged: 0 });
  });

  it("explains what is wrong with the version numbers", async () => {
    const { GET } = await routes.diff();
    const missing = await GET(request("GET", `/api/v1/models/${m.slug}/diff?from=1`, asEditor()), ctx({ slug: m.slug }));
    expect(missing.status).toBe(422);
    expect(((await missing.json()) as { error: { message: string; details: unknown } }).error).toEqual({
      code: "validation_failed",
      message: "The comparison needs two version numbers.",
      details: [{ path: "/to", message: "Give to=N." }],
    });
    const same = await GET(request("GET", `/api/v1/models/${m.slug}/diff?from=2&to=2`, asEditor()), ctx({ slug: m.slug }));
    expect(((await same.json()) as { error: { message: string } }).error.message).toBe("Choose two different versions to compare.");
    const absent = await GET(request("GET", `/api/v1/models/${m.slug}/diff?from=1&to=9`, asEditor()), ctx({ slug: m.slug }));
    expect(absent.status).toBe(404);
    expect(((await absent.json()) as { error: { message: string } }).error.message).toBe("No version 9 of this model.");
  });
});

describe("decisions, badges and the audit trail", () => {
  it("refuses a non-latest version with a clear message", async () => {
    const res = await decide(1, "declined", "Old.");
    expect(res.status).toBe(409);
    expect(await res.json()).toEqual({
      error: { code: "conflict", message: "Version 1 is not the latest submitted version of this model: version 2 is. Decide on version 2 instead." },
    });
  });

  it("answers 400 to a body that is not JSON and 422 to a missing comment", async () => {
    const { POST } = await routes.decisions();
    const notJson = await POST(
      request("POST", `/api/v1/models/${m.slug}/versions/2/decisions`, asEditor(), { body: "outcome=verified", headers: { "content-type": "text/plain" } }),
      ctx({ slug: m.slug, number: "2" }),
    );
    expect(notJson.status).toBe(400);
    expect(((await notJson.json()) as { error: { message: string } }).error.message).toBe("The request body is not valid JSON.");
    const noComment = await decide(2, "verified", "");
    expect(noComment.status).toBe(422);
    expect(((await noComment.json()) as { error: { details: unknown } }).error.details).toEqual([{ path: "/comment", message: "Write a comment for the authors." }]);
    const badNumber = await POST(jsonRequest("POST", `/api/v1/models/${m.slug}/versions/x/decisions`, asEditor(), {}), ctx({ slug: m.slug, number: "x" }));
    expect(badNumber.status).toBe(404);
  });

  it("changes the model badge with a decision, keeps a decided version badge immutable, and answers 304 to a current ETag", async () => {
    const before = await modelBadge();
    expect(before.status).toBe(200);
    expect(before.headers.get("content-type")).toBe("image/svg+xml; charset=utf-8");
    expect(before.headers.get("cache-control")).toBe("private, no-store"); // still private
    const beforeSvg = await before.text();
    expect(beforeSvg).toContain("no decided version yet");

    const v2before = await versionBadge(2);
    expect(await v2before.text()).toContain("no decision");

    const res = await decide(2, "verified", "Both claims re-run and match.");
    expect(res.status).toBe(201);
    const d = (await res.json()) as { decision: { outcome: string; versionNumber: number } };
    expect(d.decision).toMatchObject({ outcome: "verified", versionNumber: 2 });

    // Verified made the model public: public caching from now on.
    const after = await modelBadge();
    expect(after.headers.get("cache-control")).toBe("public, max-age=60, must-revalidate");
    const afterSvg = await after.text();
    expect(afterSvg).toContain("all 2 claims confirmed");
    expect(afterSvg).toContain(`${m.slug} v2 ·`);
    const etag = after.headers.get("etag") ?? "";
    expect(etag).toMatch(/^"[0-9a-f]{32}"$/);
    const cached = await modelBadge({ "if-none-match": etag });
    expect(cached.status).toBe(304);
    expect(await cached.text()).toBe("");

    const v2 = await versionBadge(2);
    expect(v2.headers.get("cache-control")).toBe("public, max-age=31536000, immutable");
    expect(await v2.text()).toContain("verified");
    // v1 was never decided: it may still change, so it is not immutable.
    const v1 = await versionBadge(1);
    expect(v1.headers.get("cache-control")).toBe("public, max-age=60, must-revalidate");
    expect(await v1.text()).toContain("1 of 1 claim contradicted");

    const { GET } = await routes.decisions();
    const list = await GET(request("GET", `/api/v1/models/${m.slug}/versions/2/decisions`), ctx({ slug: m.slug, number: "2" }));
    expect(((await list.json()) as { decisions: { outcome: string }[] }).decisions.map((x) => x.outcome)).toEqual(["verified"]);
  });

  it("serves 404 for a badge path without .svg or an unknown model", async () => {
    const { GET } = await routes.modelBadge();
    expect((await GET(request("GET", `/badges/models/${m.slug}`), ctx({ slug: m.slug }))).status).toBe(404);
    expect((await GET(request("GET", "/badges/models/rp-none.svg"), ctx({ slug: "rp-none.svg" }))).status).toBe(404);
    const v = await routes.versionBadge();
    expect((await v.GET(request("GET", `/badges/models/${m.slug}/v/0.svg`), ctx({ slug: m.slug, number: "0.svg" }))).status).toBe(404);
    expect((await v.GET(request("GET", `/badges/models/${m.slug}/v/7.svg`), ctx({ slug: m.slug, number: "7.svg" }))).status).toBe(404);
  });

  it("lists every step in the audit trail, oldest first, with names", async () => {
    const { GET } = await routes.audit();
    const res = await GET(request("GET", `/api/v1/models/${m.slug}/audit`, asOwner()), ctx({ slug: m.slug }));
    const b = (await res.json()) as { events: { action: string; actor: { name: string } | null; versionNumber: number | null; detail: Record<string, unknown> }[] };
    expect(b.events.map((e) => `${e.action} v${e.versionNumber ?? "-"}`)).toEqual(["version.submitted v1", "version.submitted v2", "decision.recorded v2"]);
    expect(b.events[2]?.actor?.name).toBe("Tomas");
    expect(b.events[2]?.detail).toMatchObject({ outcome: "verified", comment: "Both claims re-run and match." });
  });
});

describe("venue administration API", () => {
  it("creates a venue, refuses a taken slug, assigns and removes an editor", async () => {
    const { POST, GET } = await routes.venues();
    const slug = `kelp-review-${crypto.randomUUID().slice(0, 6)}`;
    const created = await POST(jsonRequest("POST", "/api/v1/venues", { token: admin.token }, { slug, name: "Kelp Review" }));
    expect(created.status).toBe(201);
    const again = await POST(jsonRequest("POST", "/api/v1/venues", { token: admin.token }, { slug, name: "Kelp Review" }));
    expect(again.status).toBe(409);
    expect(await again.json()).toEqual({ error: { code: "conflict", message: "A venue with this short name exists already." } });
    const bad = await POST(jsonRequest("POST", "/api/v1/venues", { token: admin.token }, { slug: "Kelp Review!", name: "" }));
    expect(((await bad.json()) as { error: { details: unknown } }).error.details).toEqual([
      { path: "/slug", message: "Lower-case letters, digits and single hyphens, like tidewater-letters." },
      { path: "/name", message: "The venue needs a name." },
    ]);

    const eds = await routes.editors();
    const noAccount = await eds.POST(jsonRequest("POST", `/api/v1/venues/${slug}/editors`, { token: admin.token }, { email: "nobody@example.test" }), ctx({ venue: slug }));
    expect(noAccount.status).toBe(422);
    expect(((await noAccount.json()) as { error: { message: string } }).error.message).toBe("No account has this e-mail address.");
    const notEditor = await eds.POST(jsonRequest("POST", `/api/v1/venues/${slug}/editors`, { token: admin.token }, { email: owner.email }), ctx({ venue: slug }));
    expect(((await notEditor.json()) as { error: { message: string } }).error.message).toBe(
      "Only accounts with the editor or admin role can edit a venue; change the account's role first.",
    );
    const added = await eds.POST(jsonRequest("POST", `/api/v1/venues/${slug}/editors`, { token: admin.token }, { email: editor.email.toUpperCase() }), ctx({ venue: slug }));
    expect(added.status).toBe(201);
    const listed = await eds.GET(request("GET", `/api/v1/venues/${slug}/editors`, { token: admin.token }), ctx({ venue: slug }));
    expect(((await listed.json()) as { editors: { id: string }[] }).editors.map((e) => e.id)).toEqual([editor.id]);
    const removed = await eds.DELETE(jsonRequest("DELETE", `/api/v1/venues/${slug}/editors`, { token: admin.token }, { userId: editor.id }), ctx({ venue: slug }));
    expect(removed.status).toBe(204);
    const twice = await eds.DELETE(jsonRequest("DELETE", `/api/v1/venues/${slug}/editors`, { token: admin.token }, { userId: editor.id }), ctx({ venue: slug }));
    expect(((await twice.json()) as { error: { message: string } }).error.message).toBe("This account is not an editor of the venue.");

    const all = await GET(request("GET", "/api/v1/venues", { token: admin.token }));
    const venues = ((await all.json()) as { venues: { slug: string; editors?: unknown[] }[] }).venues;
    expect(venues.find((v) => v.slug === slug)?.editors).toEqual([]);
  });

  it("tells an author what a submission body needs", async () => {
    const { POST } = await routes.submissions();
    const res = await POST(jsonRequest("POST", `/api/v1/venues/${venue.slug}/submissions`, asOwner(), { model: m.slug }), ctx({ venue: venue.slug }));
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: { details: unknown } }).error.details).toEqual([{ path: "/version", message: "Give the version number." }]);
  });
});
