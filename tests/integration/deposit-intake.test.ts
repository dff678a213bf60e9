/** What route handlers build on: reading uploads from requests, job polling, stateless checks, demo seeding. */
import "./deposit-env";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { count, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { model, version } from "@/db/schema";
import { ALPINE_BUMBLEBEES, DEMO_MODELS, HARBOUR_SEALS, seedDemoModels } from "@/lib/demo/models";
import { NotFound, PayloadTooLarge, RateLimited, ValidationError } from "@/lib/errors";
import { getJobStatus } from "@/lib/jobs";
import { createModel } from "@/lib/models";
import { readSpecUpload, readSupplementUpload, uploadName } from "@/lib/storage";
import { addVersion } from "@/lib/versions";
import { CHECK_BACKLOG_LIMIT, startInlineWorker, stopWorker, verifyDetached } from "@/lib/worker";
import { EnginePool } from "@/lib/worker/pool";
import { makeUser, makeVenue, migrated } from "./deposit-support";

beforeAll(async () => {
  await migrated();
});

afterAll(async () => {
  await stopWorker();
});

async function caught(p: Promise<unknown>): Promise<unknown> {
  try {
    await p;
  } catch (e) {
    return e;
  }
  throw new Error("expected a rejection");
}

const post = (body: BodyInit, headers: Record<string, string> = {}, query = "") =>
  new Request(`http://localhost/api/v1/models/x/versions${query}`, { method: "POST", body, headers, duplex: "half" } as RequestInit);

describe("reading uploads from requests", () => {
  it("takes the name from X-File-Name (percent-encoded), then ?name=, then a default", () => {
    expect(uploadName(post("x", { "X-File-Name": encodeURIComponent("../Données é.csv") }), "file")).toBe("../Données é.csv");
    expect(uploadName(post("x", { "X-File-Name": "%E0%A4%A" }), "file")).toBe("%E0%A4%A");
    expect(uploadName(post("x", {}, "?name=runs.csv"), "file")).toBe("runs.csv");
    expect(uploadName(post("x"), "spec.json")).toBe("spec.json");
    const s = readSupplementUpload(post("abc", { "X-File-Name": "a.csv", "Content-Length": "3" }));
    expect([s.name, s.declaredLength]).toEqual(["a.csv", 3]);
  });

  it("reads a spec body as text, refusing other extensions and bodies over 1 MB", async () => {
    const text = JSON.stringify(ALPINE_BUMBLEBEES);
    expect(await readSpecUpload(post(text, { "X-File-Name": "../../bees.json" }))).toEqual({ text, fileName: "bees.json" });
    const wrong = await caught(readSpecUpload(post(text, { "X-File-Name": "bees.txt" })));
    expect((wrong as ValidationError).message).toBe("A specification must be a .json file.");
    const big = await caught(readSpecUpload(post("x".repeat(1_000_001))));
    expect(big).toBeInstanceOf(PayloadTooLarge);
    const declared = await caught(readSpecUpload(post("{}", { "Content-Length": "2000000" })));
    expect((declared as PayloadTooLarge).message).toBe("The specification is larger than the limit of 1 MB.");
  });
});

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

describe("stateless checks", () => {
  it("verifies spec text on a thread with the real engine and stores nothing", async () => {
    const [before] = await db.select({ n: count() }).from(version);
    const report = await verifyDetached(JSON.stringify(HARBOUR_SEALS));
    expect(report.verdict).toBe("contradicted");
    expect((await verifyDetached("{ not json")).verdict).toBe("invalid");
    const [after] = await db.select({ n: count() }).from(version);
    expect(after?.n).toBe(before?.n);
  }, 60_000);

  it("turns checks away while the backlog is full", async () => {
    const pool = new EnginePool({ size: 1, taskModule: path.join(import.meta.dirname, "jobs-task-fixture.ts") });
    try {
      const running = Array.from({ length: CHECK_BACKLOG_LIMIT }, () => verifyDetached("sleep:1500", pool));
      const e = await caught(verifyDetached("ok", pool));
      expect(e).toBeInstanceOf(RateLimited);
      expect((e as RateLimited).message).toBe("The checker is busy with other specs; try again in a few seconds.");
      await Promise.all(running);
      expect((await verifyDetached("ok", pool)).verdict).toBe("confirmed");
    } finally {
      await pool.close();
    }
  }, 60_000);
});

describe("demo models", () => {
  it("deposits each demo model once, however often the seed runs", async () => {
    const author = await makeUser("Demo");
    const venueId = await makeVenue("demo-venue");
    const ctx = {
      accounts: {
        author: { id: author.id, email: author.email, name: "Demo" },
        editor: { id: "", email: "", name: "" },
        admin: { id: "", email: "", name: "" },
      },
      venue: { id: venueId, slug: "demo-venue", name: "demo-venue", description: "" },
    };
    await seedDemoModels(ctx);
    await seedDemoModels(ctx);
    const models = await db.select().from(model).where(eq(model.ownerId, author.id));
    expect(models.map((m) => m.title).sort()).toEqual(DEMO_MODELS.map((d) => d.entry.title).sort());
    expect(models.filter((m) => m.venueId === venueId)).toHaveLength(DEMO_MODELS.filter((d) => d.toVenue).length);
    for (const m of models) {
      expect(await db.select().from(version).where(eq(version.modelId, m.id))).toHaveLength(1);
    }
  });
});

describe("inline worker switch", () => {
  it("starts nothing in a process told to leave the work to worker processes", () => {
    expect(startInlineWorker()).toBeNull();
  });
});
