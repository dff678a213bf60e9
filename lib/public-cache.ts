/**
 * What the public side caches, and the one call that drops it when public content changes.
 *
 * - The public model and version pages are incremental static pages (ISR, `revalidate` in
 *   their files). `publicContentChanged(modelId)` revalidates every URL of the model at once,
 *   so a model made private answers 404 on the next request.
 * - The report API keeps the serialized JSON of finished public reports in a small bounded
 *   in-process map (a version's report never changes once stored). A hit is served only after
 *   a one-row check that the model is still public, so other processes' changes cannot leak.
 *
 * revalidatePath needs a Next request context (a server action or route handler). The worker
 * loop runs outside one (in the web process, or as `npm run worker`); there the call is skipped
 * and the pages' own `revalidate` bounds how long they show a report as pending.
 */
import "server-only";
import { createHash } from "node:crypto";
import { eq, or, sql } from "drizzle-orm";
import { revalidatePath } from "next/cache";
import { db } from "@/db/client";
import { model, version } from "@/db/schema";

/** Seconds a public page may be served before it is re-rendered, when no change revalidated it. */
export const PUBLIC_PAGE_REVALIDATE_SECONDS = 30;

const MAX_ENTRIES = 256;
const MAX_TOTAL_BYTES = 32 * 1024 * 1024;
/** One report bigger than this is served uncached rather than evict everything else. */
const MAX_ENTRY_BYTES = 4 * 1024 * 1024;

export interface CachedReport {
  modelId: string;
  versionId: string;
  /** The JSON answer, encoded once: a hit then sends bytes without re-encoding the text. */
  body: Uint8Array<ArrayBuffer>;
  etag: string;
}

// Map keeps insertion order: re-inserting on a hit makes the first key the least recently used.
const bySlugNumber = new Map<string, CachedReport>();
let totalBytes = 0;

function keyOf(slug: string, number: number): string {
  return `${slug}\n${number}`;
}

function drop(key: string): void {
  const old = bySlugNumber.get(key);
  if (old === undefined) return;
  bySlugNumber.delete(key);
  totalBytes -= old.body.byteLength;
}

/** A strong validator of the bytes sent (If-None-Match gives 304). */
export function etagOf(body: Uint8Array): string {
  return `"${createHash("sha256").update(body).digest("base64url").slice(0, 32)}"`;
}

// Prepared once: a cache hit costs this one primary-key read and no query building.
const visibilityOf = db
  .select({ visibility: model.visibility })
  .from(model)
  .where(eq(model.id, sql.placeholder("id")))
  .limit(1)
  .prepare();

/** The cached report of a public model's version, or null (not cached, or the model is no longer public). */
export async function cachedPublicReport(slug: string, number: number): Promise<CachedReport | null> {
  const key = keyOf(slug, number);
  const hit = bySlugNumber.get(key);
  if (hit === undefined) return null;
  // Cheap on a primary key, and it makes the cache safe even when another process changed visibility.
  const rows = await visibilityOf.execute({ id: hit.modelId });
  if (rows[0]?.visibility !== "public") {
    drop(key);
    return null;
  }
  bySlugNumber.delete(key);
  bySlugNumber.set(key, hit);
  return hit;
}

/** Remembers a finished report of a public model; returns the entry (cached or not) to send. */
export function rememberPublicReport(slug: string, number: number, entry: { modelId: string; versionId: string; body: string }): CachedReport {
  const body = new TextEncoder().encode(entry.body);
  const full: CachedReport = { modelId: entry.modelId, versionId: entry.versionId, body, etag: etagOf(body) };
  if (body.byteLength > MAX_ENTRY_BYTES) return full;
  const key = keyOf(slug, number);
  drop(key);
  bySlugNumber.set(key, full);
  totalBytes += body.byteLength;
  while (bySlugNumber.size > MAX_ENTRIES || totalBytes > MAX_TOTAL_BYTES) {
    const oldest = bySlugNumber.keys().next();
    if (oldest.done === true) break;
    drop(oldest.value);
  }
  return full;
}

/** How many reports are cached (for tests). */
export function cachedReportCount(): number {
  return bySlugNumber.size;
}

function isOutsideRequest(e: unknown): boolean {
  return e instanceof Error && e.message.includes("static generation store missing");
}

/**
 * Call after a change a reader can see (fields, visibility, a new version, a stored report, a
 * decision): drops the model's cached reports and revalidates its public page and every version
 * page (a new version changes which one is "latest" on the older pages too).
 */
export async function publicContentChanged(modelId: string): Promise<void> {
  for (const [key, entry] of bySlugNumber) if (entry.modelId === modelId) drop(key);
  const rows = await db
    .select({ slug: model.slug, number: version.number })
    .from(model)
    .leftJoin(version, eq(version.modelId, model.id))
    .where(eq(model.id, modelId));
  const slug = rows[0]?.slug;
  if (slug === undefined) return;
  const base = `/models/${encodeURIComponent(slug)}`;
  const paths = [base, ...rows.flatMap((r) => (r.number === null ? [] : [`${base}/v/${r.number}`]))];
  try {
    for (const p of paths) revalidatePath(p);
    revalidatePath("/sitemap.xml");
  } catch (e) {
    // The worker loop: no request context; PUBLIC_PAGE_REVALIDATE_SECONDS bounds the staleness.
    if (!isOutsideRequest(e)) throw e;
  }
}

/** The model's id when `idOrSlug` names a public model, else null (no access question for the public). */
export async function publicModelIdOf(idOrSlug: string): Promise<string | null> {
  const rows = await db
    .select({ id: model.id, visibility: model.visibility })
    .from(model)
    .where(or(eq(model.id, idOrSlug), eq(model.slug, idOrSlug)))
    .limit(1);
  const row = rows[0];
  return row !== undefined && row.visibility === "public" ? row.id : null;
}
