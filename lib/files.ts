/**
 * Files of a model: each version's spec (written by lib/versions.ts) and the supplementary
 * files an author attaches to a version (data as CSV, a PDF, a ZIP of code, plain text).
 * Blobs live in the content-addressed store (lib/storage.ts); rows here carry the metadata.
 */
import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { file, model } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { withBusyRetry } from "@/lib/jobs";
import { Forbidden, NotFound } from "@/lib/errors";
import { canEditModel, canReadModel, loadVisibleModel, loadVisibleVersion } from "@/lib/models";
import { publicContentChanged } from "@/lib/public-cache";
import { openBlob, removeBlob, storeUpload } from "@/lib/storage";
import type { FileInfo, Viewer } from "@/lib/types/deposit";

export type FileRow = typeof file.$inferSelect;

export function toFileInfo(row: FileRow): FileInfo {
  return {
    id: row.id,
    modelId: row.modelId,
    versionId: row.versionId,
    purpose: row.purpose,
    sha256: row.sha256,
    size: row.size,
    mediaType: row.mediaType,
    originalName: row.originalName,
    uploadedBy: row.uploadedBy,
    createdAt: row.createdAt.toISOString(),
  };
}

/**
 * Streams a supplementary file into the store and attaches it to a version. The access check
 * comes before a single byte is read: NotFound when the uploader cannot see the version,
 * Forbidden when they may see it but not change it.
 */
export async function attachSupplement(
  versionId: string,
  uploader: Viewer,
  upload: { body: ReadableStream<Uint8Array> | null; name: string; declaredLength?: number | null },
): Promise<FileInfo> {
  const { model: m } = await loadVisibleVersion(versionId, uploader);
  if (uploader === null || !canEditModel(m, uploader)) throw new Forbidden("Only the model's owner may attach files to it.");
  const blob = await storeUpload(upload.body, { name: upload.name, purpose: "supplement", declaredLength: upload.declaredLength });
  try {
    const row = await withBusyRetry(() => db.transaction(async (tx) => {
      const rows = await tx
        .insert(file)
        .values({
          sha256: blob.sha256,
          size: blob.size,
          mediaType: blob.mediaType,
          originalName: blob.originalName,
          modelId: m.id,
          versionId,
          purpose: "supplement",
          uploadedBy: uploader.id,
        })
        .returning();
      const inserted = rows[0];
      if (inserted === undefined) throw new Error("attachSupplement: the insert returned no row");
      await recordAudit(
        {
          actorId: uploader.id,
          action: "file.attached",
          modelId: m.id,
          versionId,
          detail: { fileId: inserted.id, name: blob.originalName, sha256: blob.sha256, size: blob.size, mediaType: blob.mediaType },
        },
        tx,
      );
      return inserted;
    }));
    // A public version page lists its supplementary files: refresh its cached copy.
    if (m.visibility === "public") await publicContentChanged(m.id);
    return toFileInfo(row);
  } catch (e) {
    await removeUnreferenced(blob.sha256);
    throw e;
  }
}

/** Removes a blob that no file row references (after a failed transaction). */
export async function removeUnreferenced(sha256: string): Promise<void> {
  const refs = await db.select({ id: file.id }).from(file).where(eq(file.sha256, sha256)).limit(1);
  if (refs.length === 0) await removeBlob(sha256);
}

/** The files of a version (its spec first, then supplements in upload order). */
export async function listFiles(versionId: string, viewer: Viewer): Promise<FileInfo[]> {
  await loadVisibleVersion(versionId, viewer);
  const rows = await db.select().from(file).where(eq(file.versionId, versionId)).orderBy(asc(file.createdAt), asc(file.id));
  return rows.sort((a, b) => (a.purpose === b.purpose ? 0 : a.purpose === "spec" ? -1 : 1)).map(toFileInfo);
}

/** One file's metadata, or NotFound when the viewer may not see its model. */
export async function getFile(fileId: string, viewer: Viewer): Promise<FileInfo> {
  const rows = await db.select().from(file).innerJoin(model, eq(file.modelId, model.id)).where(eq(file.id, fileId));
  const row = rows[0];
  if (row === undefined || !(await canReadModel(row.model, viewer))) throw new NotFound("file");
  return toFileInfo(row.file);
}

/** Metadata and a byte stream for a download. */
export async function openFile(fileId: string, viewer: Viewer): Promise<{ info: FileInfo; stream: ReadableStream<Uint8Array> }> {
  const info = await getFile(fileId, viewer);
  return { info, stream: openBlob(info.sha256) };
}

/** Every file of a model the viewer may see. */
export async function listModelFiles(modelIdOrSlug: string, viewer: Viewer): Promise<FileInfo[]> {
  const m = await loadVisibleModel(modelIdOrSlug, viewer);
  const rows = await db.select().from(file).where(and(eq(file.modelId, m.id))).orderBy(asc(file.createdAt), asc(file.id));
  return rows.map(toFileInfo);
}
