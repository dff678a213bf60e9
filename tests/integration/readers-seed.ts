/**
 * Rows for the readers' search tests, written straight into the tables so each test controls
 * exactly which models are public, what their newest version says and what verdict it has.
 */
import { createHash, randomUUID } from "node:crypto";
import { db } from "@/db/client";
import { model, modelAuthor, report, user, version } from "@/db/schema";
import type { Verdict } from "@/lib/engine/types";

export async function seedUser(): Promise<string> {
  const id = randomUUID();
  await db.insert(user).values({ id, name: "Seed Author", email: `${id}@example.test`, emailVerified: true });
  return id;
}

export interface SeedModel {
  slug: string;
  title: string;
  visibility?: "public" | "private";
  authors?: string[];
  doi?: string;
  versions: { title?: string; strategies: string[]; dynamics?: string; verdict?: Verdict; createdAt?: Date }[];
}

export async function seedModel(ownerId: string, m: SeedModel): Promise<string> {
  const modelId = randomUUID();
  await db.insert(model).values({
    id: modelId,
    slug: m.slug,
    ownerId,
    title: m.title,
    summary: `About ${m.title}`,
    doi: m.doi ?? null,
    visibility: m.visibility ?? "public",
  });
  for (const [i, name] of (m.authors ?? []).entries()) {
    await db.insert(modelAuthor).values({ modelId, position: i, name });
  }
  for (const [i, v] of m.versions.entries()) {
    const specText = JSON.stringify({ title: v.title ?? m.title, n: i, slug: m.slug });
    const sha = createHash("sha256").update(specText).digest("hex");
    const versionId = randomUUID();
    await db.insert(version).values({
      id: versionId,
      modelId,
      number: i + 1,
      specSha256: sha,
      specText,
      title: v.title ?? m.title,
      strategyNames: v.strategies.join("\n"),
      dynamicsKind: v.dynamics ?? "replicator",
      uploadedBy: ownerId,
      createdAt: v.createdAt ?? new Date(Date.UTC(2026, 0, 1) + i * 1000),
    });
    if (v.verdict !== undefined) {
      await db.insert(report).values({
        versionId,
        verdict: v.verdict,
        engineVersion: "0.0.0-test",
        specSha256: sha,
        reportJson: "{}",
      });
    }
  }
  return modelId;
}

function isBusy(e: unknown): boolean {
  for (let x: unknown = e; x !== undefined && x !== null; x = (x as { cause?: unknown }).cause) {
    const text = `${(x as { code?: unknown }).code ?? ""} ${x instanceof Error ? x.message : ""}`;
    if (/SQLITE_BUSY|database is locked/.test(text)) return true;
  }
  return false;
}

/** Another process (a running app) may hold the write lock for a moment: wait and try again. */
async function whenFree<T>(run: () => Promise<T>): Promise<T> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await run();
    } catch (e) {
      if (attempt >= 100 || !isBusy(e)) throw e;
      await new Promise((r) => setTimeout(r, 50 + Math.random() * 100));
    }
  }
}

/**
 * A public model deposited the way an author does it (lib/models.ts, lib/versions.ts) and
 * re-run by the verification worker, so its report is the server's own. `worker: "own"` (the
 * default) runs a worker here with the engine in-process; `"app"` leaves the jobs to a running
 * app's worker (same database). Returns the model's slug once every version has its report.
 */
export async function depositPublicModel(
  specTexts: string[],
  fields: { title: string; summary?: string; authors?: { name: string; orcid?: string }[]; doi?: string; visibility?: "public" | "private" },
  options: { worker?: "own" | "app" } = {},
): Promise<{ slug: string; ownerId: string }> {
  const { createModel } = await import("@/lib/models");
  const { addVersion } = await import("@/lib/versions");
  const { readReport } = await import("@/lib/reports");
  const { VerificationWorker } = await import("@/lib/worker/loop");
  const { verifySpecText } = await import("@/lib/engine/verify");
  const ownerId = await whenFree(seedUser);
  const owner = { id: ownerId, role: "author" };
  const model = await whenFree(() => createModel(owner, {
    title: fields.title,
    summary: fields.summary ?? "",
    authors: fields.authors ?? [],
    doi: fields.doi ?? null,
    visibility: fields.visibility ?? "public",
  }));
  const versionIds: string[] = [];
  for (const text of specTexts) {
    const added = await whenFree(() => addVersion(model.slug, text, owner));
    versionIds.push(added.version.id);
  }
  const worker =
    (options.worker ?? "own") === "own"
      ? new VerificationWorker({ pollMs: 50, runner: async ({ specText }) => verifySpecText(specText), log: () => {} })
      : null;
  worker?.start();
  try {
    const deadline = Date.now() + 120_000;
    for (const id of versionIds) {
      while ((await whenFree(() => readReport(id))) === null) {
        if (Date.now() > deadline) throw new Error(`no report for version ${id} within 120 s`);
        await new Promise((r) => setTimeout(r, 50));
      }
    }
  } finally {
    await worker?.stop();
  }
  return { slug: model.slug, ownerId };
}
