import "./editors-env";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { decision, job, model, report, submission, version } from "@/db/schema";
import { recordDecision } from "@/lib/decisions";
import { ValidationError } from "@/lib/errors";
import { listQueue, parseQueueQuery, type QueueQuery } from "@/lib/queue";
import { summarizeVenues } from "@/lib/venues";
import { addSubmitted, addVersion, claim, makeModel, makeUser, makeVenueWith, migrated, type Person } from "./editors-support";

let ada: Person;
let bram: Person;
let editor: Person;
let venue: { id: string; slug: string; name: string };
let other: { id: string; slug: string; name: string };
const slugs: Record<string, string> = {};

const query = (params: Record<string, string> = {}): QueueQuery => parseQueueQuery(new URLSearchParams(params));

beforeAll(async () => {
  await migrated();
  ada = await makeUser("Ada Okafor", "author");
  bram = await makeUser("Bram Visser", "author");
  editor = await makeUser("Cleo", "editor");
  venue = await makeVenueWith("dune-letters", [editor]);
  other = await makeVenueWith("fjord-notes", []);

  // Five models at the venue, in different states, plus one at another venue.
  const confirmed = await makeModel(ada, venue.id, { title: "Sandpiper foraging on the dune" });
  await addSubmitted(ada, confirmed, 1, "confirmed", [claim("a", "confirmed"), claim("b", "confirmed")]);
  slugs.confirmed = confirmed.slug;

  const revised = await makeModel(bram, venue.id, { title: "Crab burrow defence" });
  await addSubmitted(bram, revised, 1, "contradicted", [claim("a", "contradicted", 0.3), claim("b", "confirmed")]);
  await recordDecision({ id: editor.id, role: "editor" }, { model: revised.slug, number: 1 }, { outcome: "changes-requested", comment: "Claim a fails." });
  await addSubmitted(bram, revised, 2, "inconclusive", [claim("a", "inconclusive"), claim("b", "confirmed"), claim("c", "inconclusive")]);
  slugs.revised = revised.slug;

  const pending = await makeModel(ada, venue.id, { title: "Tern colony spacing" });
  await addSubmitted(ada, pending, 1, null);
  slugs.pending = pending.slug;

  const failed = await makeModel(bram, venue.id, { title: "Gull_kleptoparasitism 100%" });
  const fv = await addVersion(bram, failed, 1, null);
  await db.insert(job).values({ versionId: fv.id, state: "failed", attempts: 3, lastError: "budget" });
  const { submitVersion } = await import("@/lib/venues");
  await submitVersion({ id: bram.id, role: "author" }, { model: failed.slug, number: 1 });
  slugs.failed = failed.slug;

  const declined = await makeModel(ada, venue.id, { title: "Plover decoy displays" });
  await addSubmitted(ada, declined, 1, "confirmed", [claim("a", "confirmed")]);
  await recordDecision({ id: editor.id, role: "editor" }, { model: declined.slug, number: 1 }, { outcome: "declined", comment: "Out of scope." });
  slugs.declined = declined.slug;

  const elsewhere = await makeModel(ada, other.id, { title: "Sandpiper elsewhere" });
  await addSubmitted(ada, elsewhere, 1);

  // A model that moved to another venue after being submitted here leaves this queue.
  const moved = await makeModel(ada, venue.id, { title: "Sandpiper that moved" });
  await addSubmitted(ada, moved, 1);
  const { eq } = await import("drizzle-orm");
  await db.update(model).set({ venueId: other.id }).where(eq(model.id, moved.id));
});

describe("listQueue", () => {
  it("lists one row per model at its newest submitted version, with status, verdict and counts", async () => {
    const page = await listQueue(venue.id, query({ sort: "title", dir: "asc" }));
    expect(page.total).toBe(5);
    expect(page.rows.map((r) => r.model.title)).toEqual([
      "Crab burrow defence",
      "Gull_kleptoparasitism 100%",
      "Plover decoy displays",
      "Sandpiper foraging on the dune",
      "Tern colony spacing",
    ]);
    const crab = page.rows[0];
    expect(crab?.version.number).toBe(2);
    expect(crab?.submittedVersions).toBe(2);
    expect(crab?.status).toBe("awaiting-decision");
    expect(crab?.verdict).toBe("inconclusive");
    expect(crab?.counts).toEqual({ confirmed: 1, contradicted: 0, inconclusive: 2 });
    expect(crab?.author.name).toBe("Bram Visser");
    expect(crab?.previousDecision).toEqual({ outcome: "changes-requested", number: 1 });
    expect(page.rows.map((r) => r.status)).toEqual(["awaiting-decision", "check-failed", "declined", "awaiting-decision", "awaiting-check"]);
    const plover = page.rows[2];
    expect(plover?.decision?.outcome).toBe("declined");
    expect(plover?.decision?.editorName).toBe("Cleo");
    expect(plover?.previousDecision).toBeNull();
    expect(page.rows[1]?.jobState).toBe("failed");
    expect(page.rows[4]?.verdict).toBeNull();
    expect(page.rows[4]?.counts).toBeNull();
    expect(page.statusCounts).toEqual({
      "awaiting-check": 1,
      "check-failed": 1,
      "awaiting-decision": 2,
      verified: 0,
      "changes-requested": 0,
      declined: 1,
    });
  });

  it("filters by status, verdict, author, title words, version, counts and dates", async () => {
    const titles = async (p: Record<string, string>) => (await listQueue(venue.id, query({ sort: "title", dir: "asc", ...p }))).rows.map((r) => r.model.slug);
    expect(await titles({ status: "awaiting-decision" })).toEqual([slugs.revised, slugs.confirmed]);
    expect(await titles({ status: "declined,check-failed" })).toEqual([slugs.failed, slugs.declined]);
    expect(await titles({ verdict: "pending" })).toEqual([slugs.failed, slugs.pending]);
    expect(await titles({ verdict: "confirmed,inconclusive" })).toEqual([slugs.revised, slugs.declined, slugs.confirmed]);
    expect(await titles({ author: "visser" })).toEqual([slugs.revised, slugs.failed]);
    expect(await titles({ author: "ada okafor" })).toEqual([slugs.declined, slugs.confirmed, slugs.pending]);
    expect(await titles({ q: "sandpiper dune" })).toEqual([slugs.confirmed]);
    expect(await titles({ q: slugs.pending ?? "" })).toEqual([slugs.pending]);
    // LIKE wildcards typed by the editor are taken literally.
    expect(await titles({ q: "_" })).toEqual([slugs.failed]);
    expect(await titles({ q: "100%" })).toEqual([slugs.failed]);
    expect(await titles({ q: "%" })).toEqual([slugs.failed]);
    expect(await titles({ version: "2" })).toEqual([slugs.revised]);
    expect(await titles({ minInconclusive: "1" })).toEqual([slugs.revised]);
    expect(await titles({ minConfirmed: "2" })).toEqual([slugs.confirmed]);
    expect(await titles({ minContradicted: "1" })).toEqual([]);
    const today = new Date().toISOString().slice(0, 10);
    expect((await titles({ submittedFrom: today, submittedTo: today })).length).toBe(5);
    expect(await titles({ submittedTo: "2001-01-01" })).toEqual([]);
  });

  it("sorts by counts and verdict with missing values last, and pages without repeats", async () => {
    const byContradicted = await listQueue(venue.id, query({ sort: "inconclusive", dir: "desc" }));
    expect(byContradicted.rows[0]?.model.slug).toBe(slugs.revised);
    const asc = await listQueue(venue.id, query({ sort: "verdict", dir: "asc" }));
    expect(asc.rows.slice(-2).every((r) => r.verdict === null)).toBe(true);
    const seen: string[] = [];
    for (let p = 1; p <= 3; p++) {
      const page = await listQueue(venue.id, query({ sort: "submitted", pageSize: "2", page: String(p) }));
      expect(page.pages).toBe(3);
      seen.push(...page.rows.map((r) => r.submissionId));
    }
    expect(new Set(seen).size).toBe(5);
    const beyond = await listQueue(venue.id, query({ page: "9", pageSize: "2" }));
    expect(beyond.rows).toEqual([]);
    expect(beyond.total).toBe(5);
  });

  it("does not show another venue's submissions, nor a model that has moved away", async () => {
    const page = await listQueue(other.id, query());
    // "Sandpiper that moved" names this venue now but was never submitted here.
    expect(page.rows.map((r) => r.model.title)).toEqual(["Sandpiper elsewhere"]);
  });

  it("summarizes venues with editors and the number awaiting a decision", async () => {
    const [s] = await summarizeVenues([{ ...venue, description: "" }]);
    expect(s?.models).toBe(5);
    expect(s?.awaitingDecision).toBe(4);
    expect(s?.editors.map((e) => e.name)).toEqual(["Cleo"]);
  });
});

describe("parseQueueQuery", () => {
  function problems(params: Record<string, string>) {
    try {
      parseQueueQuery(new URLSearchParams(params));
    } catch (e) {
      if (e instanceof ValidationError) return { message: e.message, problems: e.problems };
      throw e;
    }
    throw new Error("expected a ValidationError");
  }

  it("names every field it refuses", () => {
    expect(problems({ status: "open" })).toEqual({
      message: "The queue query has invalid fields.",
      problems: [{ path: "/status", message: "Each status must be one of: awaiting-check, check-failed, awaiting-decision, verified, changes-requested, declined." }],
    });
    expect(problems({ verdict: "great" }).problems[0]?.message).toBe("Each verdict must be one of: confirmed, contradicted, inconclusive, invalid, pending.");
    expect(problems({ sort: "colour" }).problems[0]?.message).toBe(
      "Sort by one of: submitted, uploaded, decided, title, author, version, status, verdict, confirmed, contradicted, inconclusive.",
    );
    expect(problems({ dir: "up" }).problems[0]?.message).toBe("Direction is asc or desc.");
    expect(problems({ page: "0" }).problems[0]).toEqual({ path: "/page", message: "Pages start at 1." });
    expect(problems({ pageSize: "500" }).problems[0]).toEqual({ path: "/pageSize", message: "At most 100." });
    expect(problems({ version: "1.5" }).problems[0]).toEqual({ path: "/version", message: "A whole number." });
    expect(problems({ submittedFrom: "12/01/2026" }).problems[0]).toEqual({ path: "/submittedFrom", message: "A date as YYYY-MM-DD." });
    expect(problems({ submittedTo: "2026-13-45" }).problems[0]).toEqual({ path: "/submittedTo", message: "Not a calendar date." });
    expect(problems({ minContradicted: "-1" }).problems[0]).toEqual({ path: "/minContradicted", message: "At least 0." });
  });

  it("treats empty form fields as unset and reads page searchParams objects", () => {
    const q = parseQueueQuery({ status: "", q: "", sort: "title", verdict: ["confirmed", "pending"] });
    expect(q.status).toEqual([]);
    expect(q.verdict).toEqual(["confirmed", "pending"]);
    expect(q.sort).toBe("title");
    expect(q.page).toBe(1);
    expect(q.pageSize).toBe(25);
  });
});

describe("a queue of thousands", () => {
  it("answers a filtered, sorted page in well under a second", async () => {
    const big = await makeVenueWith("big-estuary", [editor]);
    const owners = [ada, bram];
    const n = 4000;
    const now = Date.now();
    // Bulk rows straight into the tables: models, versions (1..3), reports, submissions.
    const models: (typeof model.$inferInsert)[] = [];
    const versions: (typeof version.$inferInsert)[] = [];
    const reports: (typeof report.$inferInsert)[] = [];
    const subs: (typeof submission.$inferInsert)[] = [];
    const decisions: (typeof decision.$inferInsert)[] = [];
    for (let i = 0; i < n; i++) {
      const owner = owners[i % 2] ?? ada;
      const modelId = crypto.randomUUID();
      models.push({ id: modelId, slug: `rp-big${i}`, ownerId: owner.id, title: `Estuary model ${i}`, venueId: big.id });
      const count = 1 + (i % 3);
      for (let k = 1; k <= count; k++) {
        const versionId = crypto.randomUUID();
        versions.push({ id: versionId, modelId, number: k, specSha256: `${i}-${k}`.padEnd(64, "0"), specText: "{}", title: "t", uploadedBy: owner.id });
        const verdicts = ["confirmed", "contradicted", "inconclusive"] as const;
        reports.push({
          versionId,
          verdict: verdicts[(i + k) % 3] ?? "confirmed",
          engineVersion: "t",
          specSha256: "x",
          confirmedCount: (i * 7) % 5,
          contradictedCount: (i + k) % 3 === 1 ? 1 : 0,
          inconclusiveCount: (i + k) % 3 === 2 ? 2 : 0,
          reportJson: "{}",
        });
        subs.push({ venueId: big.id, modelId, versionId, submittedBy: owner.id, createdAt: new Date(now - (n - i) * 60_000 + k) });
        if (k < count) decisions.push({ venueId: big.id, modelId, versionId, editorId: editor.id, outcome: "changes-requested" });
      }
    }
    const chunk = <T,>(xs: T[], size = 500) => Array.from({ length: Math.ceil(xs.length / size) }, (_, j) => xs.slice(j * size, (j + 1) * size));
    for (const c of chunk(models)) await db.insert(model).values(c);
    for (const c of chunk(versions)) await db.insert(version).values(c);
    for (const c of chunk(reports)) await db.insert(report).values(c);
    for (const c of chunk(subs)) await db.insert(submission).values(c);
    for (const c of chunk(decisions)) await db.insert(decision).values(c);

    const timed = async (p: Record<string, string>) => {
      const t0 = performance.now();
      const page = await listQueue(big.id, query(p));
      return { page, ms: performance.now() - t0 };
    };
    await timed({}); // warm the page cache
    const plain = await timed({});
    const filtered = await timed({ status: "awaiting-decision", verdict: "contradicted", author: "visser", sort: "title", dir: "asc", page: "3" });
    const counted = await timed({ minInconclusive: "1", sort: "confirmed" });
    expect(plain.page.total).toBe(n);
    expect(plain.page.rows).toHaveLength(25);
    expect(filtered.page.rows.every((r) => r.verdict === "contradicted" && r.author.name === "Bram Visser")).toBe(true);
    expect(counted.page.rows.every((r) => (r.counts?.inconclusive ?? 0) >= 1)).toBe(true);
    console.info(`queue of ${n} models (${versions.length} versions): ${plain.ms.toFixed(0)} ms plain, ${filtered.ms.toFixed(0)} ms filtered, ${counted.ms.toFixed(0)} ms by counts`);
    expect(plain.ms).toBeLessThan(1000);
    expect(filtered.ms).toBeLessThan(1000);
  }, 120_000);
});
