import "./deposit-env";
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { accountWithToken, ctx, jsonRequest, request, type TestAccount } from "./api-support";
import { fakeReport, migrated } from "./deposit-support";
import { uploadsDir } from "./deposit-env";
import { UNSUPPORTED_SPEC_TYPE_MESSAGE } from "@/app/api/v1/_support/params";

type Versions = typeof import("@/app/api/v1/models/[slug]/versions/route");
type OneVersion = typeof import("@/app/api/v1/models/[slug]/versions/[number]/route");
type ReportRoute = typeof import("@/app/api/v1/models/[slug]/versions/[number]/report/route");
type FilesRoute = typeof import("@/app/api/v1/models/[slug]/versions/[number]/files/route");
type FileRoute = typeof import("@/app/api/v1/files/[id]/route");
type JobRoute = typeof import("@/app/api/v1/jobs/[id]/route");
let versions: Versions;
let oneVersion: OneVersion;
let reportRoute: ReportRoute;
let files: FilesRoute;
let fileRoute: FileRoute;
let jobRoute: JobRoute;
let alice: TestAccount;
let bob: TestAccount;

const exampleText = readFileSync(path.resolve("schemas/examples/fog-dune-beetles.json"), "utf8");
const example = JSON.parse(exampleText) as Record<string, unknown>;

beforeAll(async () => {
  await migrated();
  versions = await import("@/app/api/v1/models/[slug]/versions/route");
  oneVersion = await import("@/app/api/v1/models/[slug]/versions/[number]/route");
  reportRoute = await import("@/app/api/v1/models/[slug]/versions/[number]/report/route");
  files = await import("@/app/api/v1/models/[slug]/versions/[number]/files/route");
  fileRoute = await import("@/app/api/v1/files/[id]/route");
  jobRoute = await import("@/app/api/v1/jobs/[id]/route");
  alice = await accountWithToken("Alice");
  bob = await accountWithToken("Bob");
});

async function newModel(owner: TestAccount): Promise<string> {
  const { POST } = await import("@/app/api/v1/models/route");
  const res = await POST(jsonRequest("POST", "/api/v1/models", { token: owner.token }, { title: "Mist beetles" }));
  return ((await res.json()) as { model: { slug: string } }).model.slug;
}

function postSpec(slug: string, owner: TestAccount, text: string, contentType = "application/json"): Promise<Response> {
  return versions.POST(
    request("POST", `/api/v1/models/${slug}/versions`, { token: owner.token }, { body: text, headers: { "content-type": contentType } }),
    ctx({ slug }),
  );
}

/** A multipart request as Uppy sends it: its metadata fields first, then the file. */
async function postMultipart(url: string, owner: TestAccount | null, field: string, name: string, content: BlobPart): Promise<Request> {
  const form = new FormData();
  form.append("name", name);
  form.append(field, new Blob([content]), name);
  const encoded = new Request("http://x/", { method: "POST", body: form });
  const bytes = new Uint8Array(await encoded.arrayBuffer());
  return request("POST", url, owner === null ? {} : { token: owner.token }, {
    body: bytes,
    headers: { "content-type": encoded.headers.get("content-type") ?? "", "content-length": String(bytes.length) },
  });
}

interface VersionAnswer {
  status: string;
  message: string;
  version: { id: string; number: number; specSha256: string; job: { id: string; state: string } | null };
}

describe("spec upload", () => {
  let slug: string;
  beforeAll(async () => {
    slug = await newModel(alice);
  });

  it("makes v1 from a raw JSON body and queues its verification", async () => {
    const res = await postSpec(slug, alice, exampleText);
    expect(res.status).toBe(201);
    const b = (await res.json()) as VersionAnswer;
    expect(b.status).toBe("created");
    expect(b.message).toBe("Version v1 was made; its verification is queued.");
    expect(b.version.number).toBe(1);
    expect(b.version.specSha256).toMatch(/^[0-9a-f]{64}$/);
    expect(b.version.job?.state).toBe("queued");
    expect(res.headers.get("location")).toBe(`/api/v1/models/${slug}/versions/1`);
  });

  it("says identical for the same content with other spacing and key order, and makes no version", async () => {
    const reordered = JSON.stringify(Object.fromEntries(Object.entries(example).reverse()));
    const res = await postSpec(slug, alice, reordered);
    expect(res.status).toBe(200);
    const b = (await res.json()) as VersionAnswer;
    expect(b.status).toBe("identical");
    expect(b.message).toBe("Identical to v1: no new version was made.");
    const list = (await (await versions.GET(request("GET", `/api/v1/models/${slug}/versions`, { token: alice.token }), ctx({ slug }))).json()) as {
      versions: unknown[];
    };
    expect(list.versions).toHaveLength(1);
  });

  it("makes v2 from a multipart upload (the widget's way)", async () => {
    const changed = JSON.stringify({ ...example, title: "Mist beetles, corrected" }, null, 2);
    const req = await postMultipart(`/api/v1/models/${slug}/versions`, alice, "spec", "dunes-v2.json", changed);
    const res = await versions.POST(req, ctx({ slug }));
    expect(res.status).toBe(201);
    const b = (await res.json()) as VersionAnswer;
    expect(b.version.number).toBe(2);
    const v = (await (await oneVersion.GET(request("GET", `/api/v1/models/${slug}/versions/2`, { token: alice.token }), ctx({ slug, number: "2" }))).json()) as {
      version: { specText: string; files: { purpose: string; originalName: string }[] };
    };
    expect(v.version.specText).toBe(changed);
    expect(v.version.files.map((f) => [f.purpose, f.originalName])).toEqual([["spec", "dunes-v2.json"]]);
  });

  it("lists every schema problem with its JSON pointer and line, and stores nothing", async () => {
    const broken = exampleText.replace('"count": 7', '"count": "seven"').replace('"duration": 40, "samples": 201 },\n    { "id": "crest-crowded"', '"duration": -1, "samples": 201 },\n    { "id": "crest-crowded"');
    const res = await postSpec(slug, alice, broken);
    expect(res.status).toBe(422);
    const b = (await res.json()) as { error: { code: string; message: string; details: { path: string; line?: number; message: string }[] } };
    expect(b.error.code).toBe("validation_failed");
    expect(b.error.message).toBe("The specification has 2 problems; nothing was stored.");
    const lines = broken.split("\n");
    const lineOf = (needle: string) => lines.findIndex((l) => l.includes(needle)) + 1;
    expect(b.error.details.map((d) => [d.path, d.line])).toEqual([
      ["/experiments/0/duration", lineOf('"duration": -1')],
      ["/claims/5/count", lineOf('"count": "seven"')],
    ]);
    const list = (await (await versions.GET(request("GET", `/api/v1/models/${slug}/versions`, { token: alice.token }), ctx({ slug }))).json()) as {
      versions: unknown[];
    };
    expect(list.versions).toHaveLength(2);
  });

  it("checks the rules beyond the schema: shares of a state must sum to 1", async () => {
    const broken = exampleText.replace('"state": [0, 0, 1]', '"state": [0, 0.5, 1]');
    const res = await postSpec(slug, alice, broken);
    expect(res.status).toBe(422);
    const b = (await res.json()) as { error: { details: { path: string; line?: number }[] } };
    expect(b.error.details.map((d) => [d.path, d.line])).toEqual([
      ["/claims/4/state", broken.split("\n").findIndex((l) => l.includes("[0, 0.5, 1]")) + 1],
    ]);
  });

  it("refuses a file that is not JSON, at the root of the document", async () => {
    const res = await postSpec(slug, alice, '{\n  "format": "restpoint/model@1",\n  "title": oops\n}');
    expect(res.status).toBe(422);
    const b = (await res.json()) as { error: { message: string; details: { path: string; line?: number; message: string }[] } };
    expect(b.error.message).toBe("The specification is not valid JSON; nothing was stored.");
    expect(b.error.details).toHaveLength(1);
    expect(b.error.details[0]?.path).toBe("");
    expect(b.error.details[0]).toEqual({ path: "", line: 3, message: 'The file is not valid JSON at line 3, column 12, near "oops\\n}".' });
  });

  it("refuses a spec over 1 MB with 413, by its declared length and while streaming", async () => {
    const big = JSON.stringify({ ...example, summary: "x".repeat(1_000_001) });
    const declared = await versions.POST(
      request("POST", `/api/v1/models/${slug}/versions`, { token: alice.token }, {
        body: big,
        headers: { "content-type": "application/json", "content-length": String(big.length) },
      }),
      ctx({ slug }),
    );
    expect(declared.status).toBe(413);
    expect(await declared.json()).toEqual({ error: { code: "payload_too_large", message: "The specification is larger than the limit of 1 MB." } });
    const streamed = await postSpec(slug, alice, big);
    expect(streamed.status).toBe(413);
  });

  it("refuses a multipart spec that is not named .json, and other content types", async () => {
    const req = await postMultipart(`/api/v1/models/${slug}/versions`, alice, "spec", "model.txt", exampleText);
    const res = await versions.POST(req, ctx({ slug }));
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: { message: string } }).error.message).toBe("A specification must be a .json file.");
    const plain = await postSpec(slug, alice, exampleText, "text/plain");
    expect(plain.status).toBe(400);
    expect(((await plain.json()) as { error: { message: string } }).error.message).toBe(UNSUPPORTED_SPEC_TYPE_MESSAGE);
  });

  it("refuses a spec that is not UTF-8 text", async () => {
    const res = await versions.POST(
      request("POST", `/api/v1/models/${slug}/versions`, { token: alice.token }, {
        body: new Uint8Array([0x7b, 0xff, 0xfe, 0x7d]),
        headers: { "content-type": "application/json" },
      }),
      ctx({ slug }),
    );
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: { message: string } }).error.message).toBe("The specification is not UTF-8 text.");
  });
});

describe("another author's private model", () => {
  let slug: string;
  let jobId: string;
  let fileId: string;
  beforeAll(async () => {
    slug = await newModel(alice);
    const b = (await (await postSpec(slug, alice, exampleText)).json()) as VersionAnswer;
    jobId = b.version.job?.id ?? "";
    const up = await files.POST(await postMultipart(`/api/v1/models/${slug}/versions/1/files`, alice, "file", "data.csv", "t,x\n0,1\n"), ctx({ slug, number: "1" }));
    fileId = ((await up.json()) as { file: { id: string } }).file.id;
  });

  it("answers 404 on every route, signed in as someone else or anonymous", async () => {
    for (const auth of [{ token: bob.token }, {}]) {
      const answers = [
        await versions.GET(request("GET", `/api/v1/models/${slug}/versions`, auth), ctx({ slug })),
        await oneVersion.GET(request("GET", `/api/v1/models/${slug}/versions/1`, auth), ctx({ slug, number: "1" })),
        await reportRoute.GET(request("GET", `/api/v1/models/${slug}/versions/1/report`, auth), ctx({ slug, number: "1" })),
        await files.GET(request("GET", `/api/v1/models/${slug}/versions/1/files`, auth), ctx({ slug, number: "1" })),
        await fileRoute.GET(request("GET", `/api/v1/files/${fileId}`, auth), ctx({ id: fileId })),
        await jobRoute.GET(request("GET", `/api/v1/jobs/${jobId}`, auth), ctx({ id: jobId })),
      ];
      expect(answers.map((r) => r.status)).toEqual([404, 404, 404, 404, 404, 404]);
    }
  });

  it("answers 404 to uploads by someone else, even oversize ones, and 401 to anonymous uploads", async () => {
    const big = "x".repeat(1_100_000);
    const res = await versions.POST(
      request("POST", `/api/v1/models/${slug}/versions`, { token: bob.token }, { body: big, headers: { "content-type": "application/json", "content-length": String(big.length) } }),
      ctx({ slug }),
    );
    expect(res.status).toBe(404);
    const file = await files.POST(await postMultipart(`/api/v1/models/${slug}/versions/1/files`, bob, "file", "x.csv", "a\n"), ctx({ slug, number: "1" }));
    expect(file.status).toBe(404);
    const anon = await versions.POST(request("POST", `/api/v1/models/${slug}/versions`, {}, { body: exampleText, headers: { "content-type": "application/json" } }), ctx({ slug }));
    expect(anon.status).toBe(401);
  });

  it("answers 404 for a version number that does not exist or is not a number", async () => {
    for (const number of ["9", "0", "1e3", "-1"]) {
      const res = await oneVersion.GET(request("GET", `/api/v1/models/${slug}/versions/${number}`, { token: alice.token }), ctx({ slug, number }));
      expect(res.status).toBe(404);
      expect(await res.json()).toEqual({ error: { code: "not_found", message: "No such version." } });
    }
  });
});

describe("report and job while verification runs and after", () => {
  it("answers 202 with the job state, then 200 with the stored report", async () => {
    const slug = await newModel(alice);
    const b = (await (await postSpec(slug, alice, exampleText)).json()) as VersionAnswer;
    const pending = await reportRoute.GET(request("GET", `/api/v1/models/${slug}/versions/1/report`, { token: alice.token }), ctx({ slug, number: "1" }));
    expect(pending.status).toBe(202);
    expect(pending.headers.get("retry-after")).toBe("2");
    expect(((await pending.json()) as { state: string; report: null }).state).toBe("queued");

    const job = await jobRoute.GET(request("GET", `/api/v1/jobs/${b.version.job?.id ?? ""}`, { token: alice.token }), ctx({ id: b.version.job?.id ?? "" }));
    expect(job.status).toBe(200);
    expect(((await job.json()) as { job: { state: string; versionId: string } }).job).toMatchObject({ state: "queued", versionId: b.version.id });

    // Play the worker: claim every queued job of this test file and finish this one.
    const { claimNext, completeJob } = await import("@/lib/jobs");
    for (;;) {
      const claimed = await claimNext("test-worker", 60_000);
      if (claimed === null) break;
      if (claimed.versionId === b.version.id) {
        const report = fakeReport("confirmed", [{ id: "mixed-rest-point", kind: "rest-point", status: "confirmed", message: "found", deviation: 3e-9 }]);
        expect(await completeJob(claimed.id, "test-worker", report, 12)).toBe(true);
      }
    }
    const done = await reportRoute.GET(request("GET", `/api/v1/models/${slug}/versions/1/report`, { token: alice.token }), ctx({ slug, number: "1" }));
    expect(done.status).toBe(200);
    const r = (await done.json()) as { state: string; verdict: string; counts: Record<string, number>; report: { claims: { deviation: number }[] } };
    expect(r.state).toBe("finished");
    expect(r.verdict).toBe("confirmed");
    expect(r.counts).toEqual({ confirmed: 1, contradicted: 0, inconclusive: 0 });
    expect(r.report.claims[0]?.deviation).toBe(3e-9);
  });
});

describe("report of a public model and of a job that failed", () => {
  it("serves a public model's versions and report to anonymous readers", async () => {
    const slug = await newModel(alice);
    await postSpec(slug, alice, exampleText);
    const { PATCH } = await import("@/app/api/v1/models/[slug]/route");
    await PATCH(jsonRequest("PATCH", `/api/v1/models/${slug}`, { token: alice.token }, { visibility: "public" }), ctx({ slug }));
    const list = await versions.GET(request("GET", `/api/v1/models/${slug}/versions`), ctx({ slug }));
    expect(list.status).toBe(200);
    const pending = await reportRoute.GET(request("GET", `/api/v1/models/${slug}/versions/1/report`), ctx({ slug, number: "1" }));
    expect(pending.status).toBe(202);
    // Reading is open, uploading is not.
    const upload = await versions.POST(
      request("POST", `/api/v1/models/${slug}/versions`, { token: bob.token }, { body: exampleText, headers: { "content-type": "application/json" } }),
      ctx({ slug }),
    );
    expect(upload.status).toBe(403);
  });

  it("answers state failed with the last error once every attempt failed", async () => {
    const slug = await newModel(alice);
    const b = (await (await postSpec(slug, alice, exampleText)).json()) as VersionAnswer;
    const { db } = await import("@/db/client");
    const { job } = await import("@/db/schema");
    const { eq } = await import("drizzle-orm");
    await db.update(job).set({ state: "failed", attempts: 3, lastError: "budget exceeded: the run took longer than 10 s of computing time" }).where(eq(job.id, b.version.job?.id ?? ""));
    const res = await reportRoute.GET(request("GET", `/api/v1/models/${slug}/versions/1/report`, { token: alice.token }), ctx({ slug, number: "1" }));
    expect(res.status).toBe(200);
    const body = (await res.json()) as { state: string; error: string; report: null; job: { attempts: number } };
    expect(body).toMatchObject({ state: "failed", error: "budget exceeded: the run took longer than 10 s of computing time", report: null });
    expect(body.job.attempts).toBe(3);
  });
});

describe("supplementary files", () => {
  let slug: string;
  beforeAll(async () => {
    slug = await newModel(alice);
    await postSpec(slug, alice, exampleText);
  });
  const url = () => `/api/v1/models/${slug}/versions/1/files`;

  it("stores a CSV by content hash and serves it back as an attachment", async () => {
    const csv = "t,Crest,Lee\n0,0.1,0.8\n";
    const res = await files.POST(await postMultipart(url(), alice, "file", "trajectory.csv", csv), ctx({ slug, number: "1" }));
    expect(res.status).toBe(201);
    const { file } = (await res.json()) as { file: { id: string; sha256: string; size: number; mediaType: string; originalName: string } };
    expect(file).toMatchObject({ size: csv.length, mediaType: "text/csv", originalName: "trajectory.csv" });
    expect(readFileSync(path.join(uploadsDir, file.sha256.slice(0, 2), file.sha256.slice(2)), "utf8")).toBe(csv);
    const down = await fileRoute.GET(request("GET", `/api/v1/files/${file.id}`, { token: alice.token }), ctx({ id: file.id }));
    expect(down.status).toBe(200);
    expect(await down.text()).toBe(csv);
    expect(down.headers.get("content-type")).toBe("text/csv");
    expect(down.headers.get("content-disposition")).toBe(`attachment; filename="trajectory.csv"; filename*=UTF-8''trajectory.csv`);
    expect(down.headers.get("x-content-type-options")).toBe("nosniff");
    expect(down.headers.get("cache-control")).toBe("private, max-age=0, must-revalidate");
    const listed = (await (await files.GET(request("GET", url(), { token: alice.token }), ctx({ slug, number: "1" }))).json()) as { files: { purpose: string }[] };
    expect(listed.files.map((f) => f.purpose)).toEqual(["spec", "supplement"]);
  });

  it("refuses a file whose content does not match its declared type", async () => {
    const res = await files.POST(await postMultipart(url(), alice, "file", "paper.pdf", "just text, not a PDF"), ctx({ slug, number: "1" }));
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: { message: string } }).error.message).toBe(
      'The content of "paper.pdf" does not match its type: it is not a PDF (it does not start with %PDF-).',
    );
    const zip = await files.POST(await postMultipart(url(), alice, "file", "code.zip", "%PDF-1.7 pretending"), ctx({ slug, number: "1" }));
    expect(zip.status).toBe(422);
    const csv = await files.POST(await postMultipart(url(), alice, "file", "data.csv", new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0, 0, 0xff])), ctx({ slug, number: "1" }));
    expect(csv.status).toBe(422);
  });

  it("refuses types that are not allowed", async () => {
    const res = await files.POST(await postMultipart(url(), alice, "file", "tool.exe", "MZ"), ctx({ slug, number: "1" }));
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: { message: string } }).error.message).toBe(
      "Only CSV, plain-text, PDF and ZIP files can be attached (.csv, .txt, .pdf, .zip).",
    );
  });

  it("refuses a file over 50 MB by its declared length", async () => {
    const req = request("POST", url(), { token: alice.token }, {
      body: "irrelevant",
      headers: { "content-type": "multipart/form-data; boundary=b", "content-length": String(60_000_000) },
    });
    const res = await files.POST(req, ctx({ slug, number: "1" }));
    expect(res.status).toBe(413);
    expect(await res.json()).toEqual({
      error: { code: "payload_too_large", message: "The file is larger than the limit of 50 MB for a supplementary file." },
    });
  });

  it("stops reading and keeps nothing once a streamed file passes 50 MB", async () => {
    const chunk = new Uint8Array(1024 * 1024).fill(0x61);
    const head = new TextEncoder().encode('--b\r\nContent-Disposition: form-data; name="file"; filename="huge.txt"\r\n\r\n');
    let sent = 0;
    const body = new ReadableStream<Uint8Array>({
      start(c) {
        c.enqueue(head);
      },
      pull(c) {
        sent += 1;
        if (sent > 60) return c.close();
        c.enqueue(chunk);
      },
    });
    const req = new Request(`http://localhost:3000${url()}`, {
      method: "POST",
      body,
      headers: { authorization: `Bearer ${alice.token}`, "content-type": "multipart/form-data; boundary=b" },
      duplex: "half",
    } as RequestInit);
    const before = readdirSync(uploadsDir, { recursive: true }).length;
    const res = await files.POST(req, ctx({ slug, number: "1" }));
    expect(res.status).toBe(413);
    expect(sent).toBeLessThanOrEqual(50);
    expect(readdirSync(uploadsDir, { recursive: true }).length).toBe(before);
  });

  it("keeps hostile file names as display metadata only: no path escapes uploads/", async () => {
    const names = ["../../../../tmp/escape.csv", "..\\..\\windows\\evil.txt", "\u202Egnp.csv", "/etc/passwd.txt"];
    const stored: string[] = [];
    for (const name of names) {
      const res = await files.POST(await postMultipart(url(), alice, "file", name, `hostile ${name}\n`), ctx({ slug, number: "1" }));
      expect(res.status).toBe(201);
      stored.push(((await res.json()) as { file: { originalName: string } }).file.originalName);
    }
    expect(stored).toEqual(["escape.csv", "evil.txt", "gnp.csv", "passwd.txt"]);
    // Every entry under uploads/ is a two-character folder of hash-named blobs (or the temp folder).
    for (const entry of readdirSync(uploadsDir, { recursive: true }) as string[]) {
      expect(entry).toMatch(/^(\.tmp|[0-9a-f]{2})([/\\]([0-9a-f]{62}|[0-9a-f-]{36}))?$/);
    }
  });
});
