/** Job polling, the demo models' seed step and the inline-worker switch. */
import "./deposit-env";
import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { model, version } from "@/db/schema";
import { ALPINE_BUMBLEBEES, DEMO_MODELS, seedDemoModels } from "@/lib/demo/models";
import { NotFound } from "@/lib/errors";
import { listAudit } from "@/lib/audit";
import { attachSupplement } from "@/lib/files";
import { getJobStatus } from "@/lib/jobs";
import { createModel, getModel, updateModel } from "@/lib/models";
import { addVersion } from "@/lib/versions";
import { startInlineWorker } from "@/lib/worker";
import { makeUser, makeVenue, migrated } from "./deposit-support";

beforeAll(async () => {
  await migrated();
});


async function caught(p: Promise<unknown>): Promise<unknown> {
  try {
    await p;
  } catch (e) {
    return e;
  }
  throw new Error("expected a rejection");
}

describe("job status for polling", () => {
  it("answers the owner and hides a private model's job from others as NotFound", async () => {
    const alice = await makeUser("Alice");
    const bob = await makeUser("Bob");
    const m = await createModel(alice, { title: "Polled" });
    const { version: v } = await addVersion(m.id, JSON.stringify(ALPINE_BUMBLEBEES), alice);
    const jobId = v.job?.id ?? "";
    expect((await getJobStatus(jobId, alice)).state).toBe("queued");
    const e = await caught(getJobStatus(jobId, bob));
    expect(e).toBeInstanceOf(NotFound);
    expect((e as NotFound).message).toBe("No such job.");
    expect(await caught(getJobStatus("no-such-job", alice))).toBeInstanceOf(NotFound);
  });
});

describe("audit trail", () => {
  it("lists what happened to a model, newest first, with the details of each step", async () => {
    const alice = await makeUser("Audited");
    const m = await createModel(alice, { title: "Audited model" });
    const { version: v } = await addVersion(m.id, JSON.stringify(ALPINE_BUMBLEBEES), alice, { fileName: "a.json" });
    const body = new ReadableStream<Uint8Array>({
      start(c) {
        c.enqueue(new TextEncoder().encode("t,x\n"));
        c.close();
      },
    });
    await attachSupplement(v.id, alice, { body, name: "runs.csv" });
    await updateModel(m.id, alice, { title: "Audited model", visibility: "public" });
    const events = await listAudit({ modelId: m.id });
    expect(events.map((e) => e.action)).toEqual(["model.updated", "file.attached", "version.uploaded", "model.created"]);
    expect(events.every((e) => e.actorId === alice.id)).toBe(true);
    expect(events[0]?.detail).toEqual({ visibility: "public", previousVisibility: "private" });
    expect(events[1]?.detail).toMatchObject({ name: "runs.csv", size: 4, mediaType: "text/csv" });
    expect(events[2]?.detail).toMatchObject({ number: 1, specSha256: v.specSha256, fileName: "a.json" });
    expect(events[2]?.versionId).toBe(v.id);
    expect(await listAudit({ modelId: m.id, limit: 1 })).toHaveLength(1);
  });
});

/** The seed's context with only the author and the venue filled in (the models need no editor or admin). */
function demoContext(author: { id: string; email: string }, name: string, venueId: string, venueSlug: string) {
  return {
    accounts: {
      author: { id: author.id, email: author.email, name },
      editor: { id: "", email: "", name: "" },
      admin: { id: "", email: "", name: "" },
    },
    venue: { id: venueId, slug: venueSlug, name: venueSlug, description: "" },
  };
}

describe("demo models", () => {
  it("deposits each demo model once, however often the seed runs", async () => {
    const author = await makeUser("Demo");
    const venueId = await makeVenue("demo-venue");
    const ctx = demoContext(author, "Demo", venueId, "demo-venue");
    await seedDemoModels(ctx);
    await seedDemoModels(ctx);
    const models = await db.select().from(model).where(eq(model.ownerId, author.id));
    expect(models.map((m) => m.title).sort()).toEqual(DEMO_MODELS.map((d) => d.entry.title).sort());
    expect(models.filter((m) => m.venueId === venueId)).toHaveLength(DEMO_MODELS.filter((d) => d.toVenue).length);
    for (const m of models) {
      expect(await db.select().from(version).where(eq(version.modelId, m.id))).toHaveLength(1);
    }
  });

  it("brings an older demo database up to date without duplicating a model", async () => {
    const author = await makeUser("Demo2");
    const owner = { id: author.id, role: "author" };
    const venueId = await makeVenue("demo-venue-earlier");
    const ctx = demoContext(author, "Demo2", venueId, "demo-venue-earlier");
    // What an earlier seed left behind: the same title, another author list, a spec with plain numbers.
    // The ORCID iD is ORCID's own documented sample iD, as older demo data carried it.
    const oldAuthors = [{ name: "Earlier Demo Author", orcid: "0000-0002-1825-0097", affiliation: "Institute of Imaginary Meadows" }];
    const { parameters: _dropped, ...withoutParameters } = ALPINE_BUMBLEBEES;
    const oldSpec = { ...withoutParameters, authors: oldAuthors, game: { ...ALPINE_BUMBLEBEES.game, payoffs: [[1, 4], [3, 2]] } };
    const old = await createModel(owner, { title: ALPINE_BUMBLEBEES.title, authors: oldAuthors, visibility: "public", venueId });
    await addVersion(old.id, JSON.stringify(oldSpec, null, 2), owner);

    await seedDemoModels(ctx);
    const bees = await db.select().from(model).where(eq(model.title, ALPINE_BUMBLEBEES.title));
    expect(bees.filter((m) => m.ownerId === author.id).map((m) => m.id)).toEqual([old.id]);
    const view = await getModel(old.id, owner);
    expect(view.venue?.id).toBe(venueId);
    expect(view.authors).toEqual(ALPINE_BUMBLEBEES.authors.map((a) => ({ name: a.name, orcid: null, affiliation: a.affiliation })));
    // The old spec stays as v1; the current one, with its parameters, is v2.
    expect(view.versions.map((v) => v.number)).toEqual([2, 1]);
    const rows = await db.select().from(version).where(eq(version.modelId, old.id)).orderBy(version.number);
    expect(rows.map((v) => (JSON.parse(v.specText) as { parameters?: unknown }).parameters ?? null)).toEqual([null, ALPINE_BUMBLEBEES.parameters]);

    // Once up to date, a further seed changes nothing: no version, no entry update.
    const audit = (await listAudit({ modelId: old.id, limit: 100 })).length;
    await seedDemoModels(ctx);
    expect((await getModel(old.id, owner)).versions).toHaveLength(2);
    expect(await listAudit({ modelId: old.id, limit: 100 })).toHaveLength(audit);
  });
});

describe("inline worker switch", () => {
  it("starts nothing in a process told to leave the work to worker processes", () => {
    expect(startInlineWorker()).toBeNull();
  });
});
