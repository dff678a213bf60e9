import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { removeTempDir, setUpDatabase } from "./readers-db";
import { depositPublicModel } from "./readers-seed";

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

const specText = readFileSync("schemas/examples/fog-dune-beetles.json", "utf8");
let publicSlug = "";
let privateSlug = "";
let publicOwner = "";
const routes: Record<string, Handler> = {};

beforeAll(async () => {
  await setUpDatabase();
  const base = "@/app/(public)/models/[slug]/v/[number]";
  routes["spec.json"] = (await import(`${base}/spec.json/route`)).GET as Handler;
  routes["report.json"] = (await import(`${base}/report.json/route`)).GET as Handler;
  routes["citation.bib"] = (await import(`${base}/citation.bib/route`)).GET as Handler;
  routes["citation.txt"] = (await import(`${base}/citation.txt/route`)).GET as Handler;
  routes.csv = (await import(`${base}/experiments/[file]/route`)).GET as Handler;
  ({ slug: publicSlug, ownerId: publicOwner } = await depositPublicModel([specText], {
    title: "Mist beetles: where to stand in the fog",
    authors: [{ name: "Ilse Vandermeer" }, { name: "Reef & Kelp Lab" }],
    doi: "10.5555/dunes.2026_7",
  }));
  privateSlug = (await depositPublicModel([specText], { title: "Hidden draft of the mist beetle model", visibility: "private" })).slug;
}, 180_000);

afterAll(removeTempDir);

function call(name: string, slug: string, number = "1", file?: string): Promise<Response> {
  const handler = routes[name];
  if (handler === undefined) throw new Error(`no route ${name}`);
  const params: Record<string, string> = { slug, number, ...(file === undefined ? {} : { file }) };
  return handler(new Request(`http://localhost/models/${slug}/v/${number}/${file ?? name}`), { params: Promise.resolve(params) });
}

const downloads: [string, string | undefined][] = [
  ["spec.json", undefined],
  ["report.json", undefined],
  ["citation.bib", undefined],
  ["citation.txt", undefined],
  ["csv", "lee-crowded.csv"],
];

describe("public downloads", () => {
  it("serves the spec exactly as uploaded, as an attachment", async () => {
    const res = await call("spec.json", publicSlug);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/json; charset=utf-8");
    expect(res.headers.get("content-disposition")).toBe(`attachment; filename="${publicSlug}-v1-spec.json"`);
    expect(await res.text()).toBe(specText);
  });

  it("answers a repeated download with 304 when the reader's copy is current", async () => {
    const first = await call("report.json", publicSlug);
    const etag = first.headers.get("etag") ?? "";
    expect(etag).toMatch(/^"[A-Za-z0-9_-]{32}"$/);
    const again = await routes["report.json"]?.(
      new Request(`http://localhost/models/${publicSlug}/v/1/report.json`, { headers: { "if-none-match": etag } }),
      { params: Promise.resolve({ slug: publicSlug, number: "1" }) },
    );
    expect(again?.status).toBe(304);
    expect(await again?.text()).toBe("");
  });

  it("serves the server's stored report", async () => {
    const res = await call("report.json", publicSlug);
    expect(res.status).toBe(200);
    const report = (await res.json()) as { format: string; experiments: { id: string }[]; verdict: string };
    expect(report.format).toBe("restpoint/report@1");
    expect(report.experiments.map((e) => e.id)).toEqual(["lee-crowded", "crest-crowded", "trough-crowded"]);
  });

  it("serves each run as CSV with a header row and every sample", async () => {
    const res = await call("csv", publicSlug, "1", "lee-crowded.csv");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("text/csv; charset=utf-8; header=present");
    expect(res.headers.get("content-disposition")).toBe(`attachment; filename="${publicSlug}-v1-lee-crowded.csv"`);
    const text = await res.text();
    const lines = text.split("\r\n");
    expect(lines[0]).toBe("time,Crest,Lee,Trough");
    // 201 samples (the spec's count), then the final CRLF leaves one empty string.
    expect(lines).toHaveLength(1 + 201 + 1);
    expect(lines[1]).toBe("0,0.1,0.8,0.1");
    const last = (lines[201] ?? "").split(",").map(Number);
    expect(last[0]).toBe(40);
    // Each row is a state: shares sum to 1 (common practice: the replicator dynamics keeps the simplex).
    expect(Math.abs((last[1] ?? 0) + (last[2] ?? 0) + (last[3] ?? 0) - 1)).toBeLessThan(1e-8);
  });

  it("answers an unknown run or a file name without .csv with 404", async () => {
    for (const file of ["nope.csv", "lee-crowded", "lee-crowded.json"]) {
      const res = await call("csv", publicSlug, "1", file);
      expect(res.status).toBe(404);
      expect(await res.json()).toEqual({ error: { code: "not_found", message: "This version has no run by that name." } });
    }
  });

  it("serves BibTeX and plain-text citations carrying the spec hash", async () => {
    const { specSha256 } = (await (await call("report.json", publicSlug)).json()) as { specSha256: string };
    const bib = await (await call("citation.bib", publicSlug)).text();
    expect(bib.startsWith(`@misc{restpoint-${publicSlug}-v1,`)).toBe(true);
    expect(bib).toContain("title = {{Fog basking on an imagined coastal dune: where mist beetles stand at dawn}}");
    expect(bib).toContain("author = {Ilse Vandermeer and Reef \\& Kelp Lab}");
    expect(bib).toContain(`specification SHA-256 ${specSha256}`);
    const txt = await (await call("citation.txt", publicSlug)).text();
    expect(txt).toContain("Ilse Vandermeer and Reef & Kelp Lab (");
    expect(txt).toContain(`Specification SHA-256: ${specSha256}.`);
    expect(txt).toContain("https://doi.org/10.5555/dunes.2026_7");
  });
});

describe("a private or unknown model is not found, the same way, on every public route", () => {
  it.each(downloads)("%s", async (name, file) => {
    const priv = await call(name, privateSlug, "1", file);
    const unknown = await call(name, "rp-nothere", "1", file);
    expect(priv.status).toBe(404);
    expect(unknown.status).toBe(404);
    const a = await priv.text();
    expect(a).toBe(await unknown.text());
    expect(JSON.parse(a)).toEqual({ error: { code: "not_found", message: "No such model." } });
  });

  it("an unknown or malformed version number of a public model is not found", async () => {
    for (const n of ["2", "0", "01", "1.0", "-1", "x"]) {
      expect((await call("spec.json", publicSlug, n)).status).toBe(404);
    }
  });

  it("the page loader refuses private and unknown models alike", async () => {
    const { loadPublicVersion } = await import("@/lib/registry");
    await expect(loadPublicVersion(privateSlug)).rejects.toMatchObject({ status: 404, message: "No such model." });
    await expect(loadPublicVersion("rp-nothere")).rejects.toMatchObject({ status: 404, message: "No such model." });
    const model = await loadPublicVersion(publicSlug);
    expect(model.version.number).toBe(1);
    expect(model.latest).toBe(true);
    // An internal id must not open a public page either.
    await expect(loadPublicVersion(model.model.id)).rejects.toMatchObject({ status: 404 });
  });

  it("lists a public version's supplementary files, which anonymous readers can download", async () => {
    const { loadPublicVersion } = await import("@/lib/registry");
    const { attachSupplement } = await import("@/lib/files");
    const before = await loadPublicVersion(publicSlug);
    expect(before.supplements).toEqual([]);
    const body = new Blob(["site,count\r\nnorth,12\r\n"]).stream();
    await attachSupplement(before.version.id, { id: publicOwner, role: "author" }, { body, name: "field-counts.csv" });
    const after = await loadPublicVersion(publicSlug);
    expect(after.supplements.map((f) => [f.originalName, f.purpose])).toEqual([["field-counts.csv", "supplement"]]);
    const { GET } = await import("@/app/api/v1/files/[id]/route");
    const id = after.supplements[0]?.id ?? "";
    const res = await GET(new Request(`http://localhost/api/v1/files/${id}`), { params: Promise.resolve({ id }) });
    expect(res.status).toBe(200);
    expect(await res.text()).toBe("site,count\r\nnorth,12\r\n");
  });

  it("the registry API and the sitemap list the public model only", async () => {
    const { GET } = await import("@/app/api/v1/registry/route");
    const res = await GET(new Request("http://localhost/api/v1/registry?q=beetle"));
    const body = (await res.json()) as { entries: { slug: string }[]; total: number };
    expect(body.entries.map((e) => e.slug)).toEqual([publicSlug]);
    expect(body.total).toBe(1);
    const sitemap = (await import("@/app/sitemap")).default;
    const urls = (await sitemap()).map((e) => e.url);
    expect(urls.some((u) => u.includes(publicSlug))).toBe(true);
    expect(urls.some((u) => u.includes(privateSlug))).toBe(false);
    expect(urls).toContain(`http://localhost:3000/models/${publicSlug}/v/1`);
  });

  it("the registry API answers a bad query with 400 and the problems", async () => {
    const { GET } = await import("@/app/api/v1/registry/route");
    const res = await GET(new Request("http://localhost/api/v1/registry?verdict=great"));
    expect(res.status).toBe(400);
    expect(await res.json()).toEqual({
      error: {
        code: "validation_failed",
        message: "The search has invalid fields.",
        details: [{ path: "/verdict", message: "Verdict: one of confirmed, contradicted, inconclusive, invalid, pending." }],
      },
    });
  });
});
