import "./deposit-env";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { count, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { auditEvent, file, job, version } from "@/db/schema";
import { ALPINE_BUMBLEBEES, HARBOUR_SEALS } from "@/lib/demo/models";
import { Forbidden, NotFound, PayloadTooLarge, ValidationError } from "@/lib/errors";
import { claimNext, completeJob } from "@/lib/jobs";
import { verifySpecText } from "@/lib/engine/verify";
import { createModel, getModel, listModelsForOwner, updateModel } from "@/lib/models";
import { getReportForVersion } from "@/lib/reports";
import { blobPath } from "@/lib/storage";
import { addVersion, checkSpecText, getVersion, getVersionById, listVersions } from "@/lib/versions";
import { uploadsDir } from "./deposit-env";
import { fakeReport, makeUser, makeVenue, migrated } from "./deposit-support";

type Account = { id: string; role: string };
let alice: Account;
let bob: Account;
let editor: Account;
let admin: Account;
let venueId: string;

beforeAll(async () => {
  await migrated();
  alice = await makeUser("Alice");
  bob = await makeUser("Bob");
  editor = await makeUser("Edna", "editor");
  admin = await makeUser("Ada", "admin");
  venueId = await makeVenue("journal", [editor.id]);
});

const specText = (spec: unknown) => `${JSON.stringify(spec, null, 2)}\n`;

async function tableCounts() {
  const [v] = await db.select({ n: count() }).from(version);
  const [f] = await db.select({ n: count() }).from(file);
  const [j] = await db.select({ n: count() }).from(job);
  const [a] = await db.select({ n: count() }).from(auditEvent);
  const blobs = existsSync(uploadsDir) ? readdirSync(uploadsDir, { recursive: true }).length : 0;
  return { versions: v?.n, files: f?.n, jobs: j?.n, audit: a?.n, blobs };
}

async function caught(p: Promise<unknown>): Promise<unknown> {
  try {
    await p;
  } catch (e) {
    return e;
  }
  throw new Error("expected a rejection");
}

describe("model entries", () => {
  it("creates an entry with authors, checks ORCID iDs by their check character and lists the owner's models", async () => {
    const m = await createModel(alice, {
      title: "  Seal model  ",
      doi: "https://doi.org/10.5555/seal.2026",
      year: 2026,
      authors: [{ name: "Alice", orcid: "https://orcid.org/0000-0002-1825-0097" }, { name: "Al", orcid: "" }],
      venueId,
    });
    expect(m.title).toBe("Seal model");
    expect(m.slug).toMatch(/^rp-[2-9a-hjkmnp-z]{6}$/);
    expect(m.doi).toBe("10.5555/seal.2026");
    expect(m.authors).toEqual([
      { name: "Alice", orcid: "0000-0002-1825-0097", affiliation: null },
      { name: "Al", orcid: null, affiliation: null },
    ]);
    expect(m.visibility).toBe("private");
    expect(m.venue?.id).toBe(venueId);
    expect(m.canEdit).toBe(true);

    const e = await caught(createModel(alice, { title: "x", authors: [{ name: "A", orcid: "0000-0002-1825-0098" }], doi: "11.2/x", year: 1800 }));
    expect(e).toBeInstanceOf(ValidationError);
    expect((e as ValidationError).message).toBe("The model entry has invalid fields.");
    expect((e as ValidationError).problems).toEqual([
      { path: "/doi", message: "Not a DOI (10.NNNN/...)." },
      { path: "/year", message: "A year from 1900 on." },
      { path: "/authors/0/orcid", message: "Not a valid ORCID iD (0000-0000-0000-000X with a correct check character)." },
    ]);
    const noVenue = await caught(createModel(alice, { title: "x", venueId: "nope" }));
    expect((noVenue as ValidationError).problems).toEqual([{ path: "/venueId", message: "No such venue." }]);

    const mine = await listModelsForOwner(alice);
    expect(mine.map((x) => x.id)).toContain(m.id);
    expect(await listModelsForOwner(bob)).toEqual([]);
  });

  it("lets only the owner or an admin change an entry", async () => {
    const m = await createModel(alice, { title: "Editable", venueId });
    const updated = await updateModel(m.slug, alice, { title: "Edited", visibility: "public", authors: [{ name: "A. Author" }] });
    expect([updated.title, updated.visibility, updated.authors.length]).toEqual(["Edited", "public", 1]);
    expect(await caught(updateModel(m.id, bob, { title: "Mine now" }))).toBeInstanceOf(Forbidden);
    const hidden = await createModel(alice, { title: "Hidden" });
    expect(await caught(updateModel(hidden.id, bob, { title: "Mine now" }))).toBeInstanceOf(NotFound);
    expect((await updateModel(hidden.id, admin, { title: "Fixed by admin" })).title).toBe("Fixed by admin");
  });
});

describe("versions", () => {
  it("numbers versions, stores the spec by hash with a queued job, and spots identical content", async () => {
    const m = await createModel(alice, { title: "Bumblebees" });
    const text1 = specText(ALPINE_BUMBLEBEES);
    const r1 = await addVersion(m.id, text1, alice, { fileName: "../bees.json" });
    expect(r1.status).toBe("created");
    expect(r1.version.number).toBe(1);
    expect(r1.version.strategyNames).toEqual(["Specialist", "Generalist"]);
    expect(r1.version.job?.state).toBe("queued");
    expect(r1.version.verdict).toBeNull();

    const v1 = await getVersion(m.slug, 1, alice);
    expect(v1.specText).toBe(text1);
    expect(v1.files).toHaveLength(1);
    expect(v1.files[0]?.originalName).toBe("bees.json");
    expect(v1.files[0]?.purpose).toBe("spec");
    const stored = blobPath(v1.files[0]?.sha256 ?? "");
    expect(stored.startsWith(uploadsDir + path.sep)).toBe(true);
    expect(readFileSync(stored, "utf8")).toBe(text1);

    // Same content, other spacing and key order: no new version.
    const { claims, ...rest } = ALPINE_BUMBLEBEES;
    const reordered = JSON.stringify({ claims, ...rest });
    const before = await tableCounts();
    const again = await addVersion(m.id, reordered, alice);
    expect(again.status).toBe("identical");
    expect(again.version.id).toBe(r1.version.id);
    expect(await tableCounts()).toEqual(before);

    const r2 = await addVersion(m.id, specText({ ...ALPINE_BUMBLEBEES, title: "Bees, second look" }), alice);
    expect(r2.status).toBe("created");
    expect(r2.version.number).toBe(2);
    expect((await listVersions(m.id, alice)).map((v) => v.number)).toEqual([2, 1]);
    expect((await getVersionById(r2.version.id, alice)).title).toBe("Bees, second look");
  });

  it("gives concurrent uploads distinct numbers", async () => {
    const m = await createModel(alice, { title: "Race" });
    const results = await Promise.all(
      [1, 2, 3].map((i) => addVersion(m.id, specText({ ...ALPINE_BUMBLEBEES, title: `Race ${i}` }), alice)),
    );
    expect(results.map((r) => r.version.number).sort()).toEqual([1, 2, 3]);
  });

  it("refuses a spec that is not JSON, with the line, and stores nothing", async () => {
    const m = await createModel(alice, { title: "Broken" });
    const before = await tableCounts();
    const e = await caught(addVersion(m.id, '{\n  "format": "restpoint/model@1",\n  "title": "x",\n}\n', alice));
    expect(e).toBeInstanceOf(ValidationError);
    expect((e as ValidationError).message).toBe("The specification is not valid JSON; nothing was stored.");
    const [problem] = (e as ValidationError).problems;
    expect(problem).toMatchObject({ path: "", line: 4 });
    // The engine's own wording (lib/engine/verify.ts), not the JavaScript parser's.
    expect(problem?.message).toBe('The file is not valid JSON at line 4, column 1, near "}\\n".');
    const truncated = await caught(addVersion(m.id, '{\n"a": [1,\n', alice));
    expect((truncated as ValidationError).problems[0]).toEqual({ path: "", line: 3, message: "The file is not valid JSON (the text ends too early)." });
    // Said the same way as POST /api/v1/check says it (verifySpecText's invalid report).
    const oops = '{"format": "restpoint/model@1", oops: 1}';
    const viaUpload = await caught(addVersion(m.id, oops, alice));
    expect((viaUpload as ValidationError).problems).toEqual(verifySpecText(oops).errors);
    expect((viaUpload as ValidationError).problems[0]?.message).toBe('The file is not valid JSON at line 1, column 33, near "oops: 1}".');
    expect(await tableCounts()).toEqual(before);
  });

  it("accepts a spec that starts with a byte order mark, as the engine that re-runs it does", async () => {
    const m = await createModel(alice, { title: "Marked" });
    const r = await addVersion(m.id, "\uFEFF" + specText({ ...ALPINE_BUMBLEBEES, title: "Marked" }), alice);
    expect(r.version.number).toBe(1);
  });

  it("refuses a spec that breaks the format, listing each problem with its pointer and line, and stores nothing", async () => {
    const m = await createModel(alice, { title: "Invalid" });
    const bad = structuredClone(ALPINE_BUMBLEBEES) as Record<string, unknown> & { claims: Record<string, unknown>[] };
    bad.claims[0] = { id: "even-mix", kind: "rest-point", state: [0.5, 0.6] };
    bad.claims[4] = { id: "specialists-spread", kind: "final-state", experiment: "no-such-run", state: [0.5, 0.5] };
    const text = specText(bad);
    const before = await tableCounts();
    const e = await caught(addVersion(m.id, text, alice));
    expect(e).toBeInstanceOf(ValidationError);
    const problems = (e as ValidationError).problems as { path: string; message: string; line?: number }[];
    expect((e as ValidationError).message).toBe(`The specification has ${problems.length} problems; nothing was stored.`);
    const textLines = text.split("\n");
    for (const pointer of ["/claims/0/state", "/claims/4/experiment"]) {
      const p = problems.find((x) => x.path === pointer);
      expect(p, pointer).toBeDefined();
      // The line named is the one that holds the offending member.
      const key = pointer.split("/").pop() ?? "";
      expect(textLines[(p?.line ?? 0) - 1]).toContain(`"${key}"`);
    }
    expect(await tableCounts()).toEqual(before);
  });

  it("refuses a spec over 1 MB", async () => {
    const m = await createModel(alice, { title: "Huge" });
    const huge = specText({ ...ALPINE_BUMBLEBEES, summary: "x".repeat(1_000_001) });
    const e = await caught(addVersion(m.id, huge, alice));
    expect(e).toBeInstanceOf(PayloadTooLarge);
    expect((e as PayloadTooLarge).message).toBe("The specification is larger than the limit of 1 MB.");
    expect(() => checkSpecText(huge)).toThrow(PayloadTooLarge);
  });
});

describe("access to models, versions and reports", () => {
  it("hides another author's private model as NotFound everywhere, and shows it to its venue's editor and admins", async () => {
    const m = await createModel(alice, { title: "Private seals", venueId });
    const { version: v } = await addVersion(m.id, specText(HARBOUR_SEALS), alice);
    const notFound = async (p: Promise<unknown>, resource: string) => {
      const e = await caught(p);
      expect(e).toBeInstanceOf(NotFound);
      expect((e as NotFound).message).toBe(`No such ${resource}.`);
    };
    for (const viewer of [bob, null]) {
      await notFound(getModel(m.id, viewer), "model");
      await notFound(getModel(m.slug, viewer), "model");
      await notFound(listVersions(m.id, viewer), "model");
      await notFound(getVersion(m.slug, 1, viewer), "model");
      await notFound(getVersionById(v.id, viewer), "version");
      await notFound(getReportForVersion(v.id, viewer), "version");
      await notFound(addVersion(m.id, specText(ALPINE_BUMBLEBEES), viewer), "model");
    }
    // Editors of the model's venue and admins read it; only the owner uploads.
    expect((await getModel(m.id, editor)).canEdit).toBe(false);
    expect((await getVersion(m.id, 1, admin)).number).toBe(1);
    const e = await caught(addVersion(m.id, specText(ALPINE_BUMBLEBEES), editor));
    expect(e).toBeInstanceOf(Forbidden);
    expect((e as Forbidden).message).toBe("Only the model's owner may change it or upload to it.");
    // A version number that does not exist is NotFound too.
    await notFound(getVersion(m.id, 99, alice), "version");

    // Published: anyone reads it.
    await updateModel(m.id, alice, { title: "Public seals", venueId, visibility: "public" });
    expect((await getModel(m.slug, null)).title).toBe("Public seals");
    expect(await getReportForVersion(v.id, null)).toBeNull();
  });

  it("shows each version's verdict and counts once its report is stored", async () => {
    const m = await createModel(alice, { title: "Verdicts" });
    const { version: v } = await addVersion(m.id, specText(ALPINE_BUMBLEBEES), alice);
    // Claim this model's job (the queue may hold others from earlier tests).
    let claimed = await claimNext("t", 60_000, Date.now() + 10 ** 6);
    while (claimed !== null && claimed.versionId !== v.id) claimed = await claimNext("t", 60_000, Date.now() + 10 ** 6);
    expect(claimed?.versionId).toBe(v.id);
    await completeJob(claimed?.id ?? "", "t", fakeReport("contradicted", [
      { id: "a", kind: "ess", status: "contradicted", message: "m", deviation: 0.2 },
      { id: "b", kind: "ess", status: "confirmed", message: "m" },
    ]), 3, Date.now() + 10 ** 6);
    const [listed] = (await listModelsForOwner(alice)).filter((x) => x.id === m.id);
    expect(listed?.versions[0]?.verdict).toBe("contradicted");
    expect(listed?.versions[0]?.counts).toEqual({ confirmed: 1, contradicted: 1, inconclusive: 0 });
    expect(listed?.versions[0]?.job?.state).toBe("finished");
    const r = await getReportForVersion(v.id, alice);
    expect(r?.claims.map((c) => [c.claimId, c.status, c.deviation])).toEqual([
      ["a", "contradicted", 0.2],
      ["b", "confirmed", null],
    ]);
    expect(r?.report.verdict).toBe("contradicted");
  });
});
