import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { removeTempDir, setUpDatabase } from "./readers-db";
import { seedModel, seedUser } from "./readers-seed";

type Registry = typeof import("@/lib/registry");
let registry: Registry;

beforeAll(async () => {
  await setUpDatabase();
  registry = await import("@/lib/registry");
  const owner = await seedUser();
  await seedModel(owner, {
    slug: "heron-nests",
    title: "Heron nest sharing",
    authors: ["Ada Marsh", "Tomas Reed"],
    doi: "10.5555/heron.2026_1",
    versions: [
      { strategies: ["Guard", "Raid"], verdict: "contradicted", createdAt: new Date(Date.UTC(2026, 0, 2)) },
      // The newest version decides what is listed: a third strategy and a new verdict.
      { strategies: ["Guard", "Raid", "Share"], verdict: "confirmed", createdAt: new Date(Date.UTC(2026, 0, 5)) },
    ],
  });
  await seedModel(owner, {
    slug: "kelp-market",
    title: "Kelp market pricing",
    authors: ["Ana Ruiz"],
    versions: [{ strategies: ["Undercut", "Hold price"], dynamics: "logit", verdict: "inconclusive", createdAt: new Date(Date.UTC(2026, 0, 4)) }],
  });
  await seedModel(owner, {
    slug: "moth-lure",
    title: "Moth lure 100% _test_",
    authors: ["Li Wen"],
    versions: [{ strategies: ["Bright", "Dull"], dynamics: "smith", createdAt: new Date(Date.UTC(2026, 0, 3)) }],
  });
  await seedModel(owner, {
    slug: "secret-raid",
    title: "Secret raid model",
    visibility: "private",
    authors: ["Ada Marsh"],
    versions: [{ strategies: ["Raid", "Share"], verdict: "confirmed" }],
  });
  for (let i = 0; i < 23; i++) {
    await seedModel(owner, {
      slug: `bulk-${String(i).padStart(2, "0")}`,
      title: `Bulk finch model ${String(i).padStart(2, "0")}`,
      versions: [{ strategies: ["Seed", "Insect"], verdict: "confirmed", createdAt: new Date(Date.UTC(2025, 0, 1, 0, i)) }],
    });
  }
});

afterAll(removeTempDir);

const slugs = async (q: Record<string, string>) =>
  (await registry.searchRegistry(registry.parseRegistryQuery(q))).entries.map((e) => e.slug);

describe("searchRegistry", () => {
  it("finds a model by a strategy name of its newest version, and never a private one", async () => {
    expect(await slugs({ q: "share" })).toEqual(["heron-nests"]);
    expect(await slugs({ strategy: "Raid" })).toEqual(["heron-nests"]);
    expect(await slugs({ strategy: "Hold price" })).toEqual(["kelp-market"]);
  });

  it("lists the newest version's number, strategies, dynamics and verdict, with authors in order", async () => {
    const page = await registry.searchRegistry(registry.parseRegistryQuery({ q: "heron" }));
    expect(page.entries).toHaveLength(1);
    expect(page.entries[0]).toMatchObject({
      slug: "heron-nests",
      title: "Heron nest sharing",
      authors: ["Ada Marsh", "Tomas Reed"],
      latestVersion: 2,
      strategyNames: ["Guard", "Raid", "Share"],
      dynamicsKind: "replicator",
      verdict: "confirmed",
      doi: "10.5555/heron.2026_1",
      updatedAt: "2026-01-05T00:00:00.000Z",
    });
  });

  it("searches by title, author and DOI (bare or as a doi.org link)", async () => {
    expect(await slugs({ title: "kelp" })).toEqual(["kelp-market"]);
    expect(await slugs({ author: "marsh" })).toEqual(["heron-nests"]);
    expect(await slugs({ q: "Ruiz" })).toEqual(["kelp-market"]);
    expect(await slugs({ doi: "https://doi.org/10.5555/heron.2026_1" })).toEqual(["heron-nests"]);
    expect(await slugs({ q: "10.5555/heron" })).toEqual(["heron-nests"]);
  });

  it("requires every word of the free text to match", async () => {
    expect(await slugs({ q: "heron guard" })).toEqual(["heron-nests"]);
    expect(await slugs({ q: "heron undercut" })).toEqual([]);
  });

  it("treats % and _ in the search as plain characters", async () => {
    expect(await slugs({ q: "100%" })).toEqual(["moth-lure"]);
    expect(await slugs({ q: "_test_" })).toEqual(["moth-lure"]);
    // "_" must not match any single character.
    expect(await slugs({ title: "Kelp_market" })).toEqual([]);
  });

  it("filters by dynamics kind and by verdict, pending meaning no report yet", async () => {
    expect(await slugs({ dynamics: "logit" })).toEqual(["kelp-market"]);
    expect(await slugs({ verdict: "inconclusive" })).toEqual(["kelp-market"]);
    expect(await slugs({ verdict: "pending" })).toEqual(["moth-lure"]);
    // The older version's verdict no longer counts.
    expect(await slugs({ verdict: "contradicted" })).toEqual([]);
    expect(await slugs({ verdict: "confirmed", q: "heron" })).toEqual(["heron-nests"]);
  });

  it("pages on the server with a total count, newest first", async () => {
    const first = await registry.searchRegistry(registry.parseRegistryQuery({ q: "finch", pageSize: "10" }));
    expect(first.total).toBe(23);
    expect(first.pageCount).toBe(3);
    expect(first.entries.map((e) => e.slug)).toEqual(
      Array.from({ length: 10 }, (_, i) => `bulk-${String(22 - i).padStart(2, "0")}`),
    );
    const last = await registry.searchRegistry(registry.parseRegistryQuery({ q: "finch", pageSize: "10", page: "3" }));
    expect(last.entries.map((e) => e.slug)).toEqual(["bulk-02", "bulk-01", "bulk-00"]);
    expect(last.total).toBe(23);
    const beyond = await registry.searchRegistry(registry.parseRegistryQuery({ q: "finch", pageSize: "10", page: "9" }));
    expect(beyond.entries).toEqual([]);
    expect(beyond.total).toBe(23);
  });

  it("sorts by title when asked", async () => {
    const all = await slugs({ sort: "title", pageSize: "100" });
    expect(all.slice(-3)).toEqual(["heron-nests", "kelp-market", "moth-lure"]);
    expect(all).not.toContain("secret-raid");
    expect(all).toHaveLength(26);
  });

  it("lists public versions for the sitemap, marking the newest", async () => {
    const rows = await registry.publicVersionsForSitemap();
    const heron = rows.filter((r) => r.slug === "heron-nests");
    expect(heron.map((r) => [r.number, r.latest])).toEqual([
      [1, false],
      [2, true],
    ]);
    expect(rows.some((r) => r.slug === "secret-raid")).toBe(false);
  });
});

describe("parseRegistryQuery", () => {
  it("ignores empty fields and takes the first of repeated ones", () => {
    const q = registry.parseRegistryQuery({ q: "", dynamics: "", verdict: ["confirmed", "invalid"] });
    expect(q).toEqual({ q: undefined, title: undefined, author: undefined, doi: undefined, strategy: undefined, dynamics: undefined, verdict: "confirmed", sort: "recent", page: 1, pageSize: 20 });
  });

  it("reads URLSearchParams", () => {
    expect(registry.parseRegistryQuery(new URLSearchParams("strategy=Raid&page=2")).page).toBe(2);
  });

  it("refuses bad values with a 400 that lists each field and its rule", () => {
    let caught: unknown;
    try {
      registry.parseRegistryQuery({ dynamics: "chaos", verdict: "great", page: "0", pageSize: "1000", sort: "stars", q: "x".repeat(201) });
    } catch (e) {
      caught = e;
    }
    expect(caught).toMatchObject({
      status: 400,
      message: "The search has invalid fields.",
      problems: expect.arrayContaining([
        { path: "/dynamics", message: "Dynamics: one of replicator, replicator-mutator, logit, brown-von-neumann-nash, smith." },
        { path: "/verdict", message: "Verdict: one of confirmed, contradicted, inconclusive, invalid, pending." },
        { path: "/page", message: "Page: a whole number from 1." },
        { path: "/pageSize", message: "Page size: a whole number from 1 to 100." },
        { path: "/sort", message: "Sort: one of recent, title." },
        { path: "/q", message: "Search: at most 200 characters." },
      ]),
    });
    expect(() => registry.parseRegistryQuery({ page: "two" })).toThrow("The search has invalid fields.");
    expect(() => registry.parseRegistryQuery({ page: "1.5" })).toThrow(
      expect.objectContaining({ problems: [{ path: "/page", message: "Page: a whole number from 1." }] }),
    );
  });
});
