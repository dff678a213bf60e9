/**
 * Immutable versions of a model. Every accepted spec upload becomes version N+1 with its
 * specSha256, its file and a queued verification job, all in one transaction. A spec that is
 * not JSON or breaks the format is refused with every problem (JSON pointer and line) and
 * leaves nothing behind; the same content as an existing version (by specSha256, so spacing
 * and key order do not count) is reported as identical and makes no new version.
 */
import "server-only";
import { and, eq, max } from "drizzle-orm";
import { db } from "@/db/client";
import { file, version } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { publicContentChanged } from "@/lib/public-cache";
import { specSha256 } from "@/lib/engine/canonical";
import type { GameSpec, ModelSpec, SpecError } from "@/lib/engine/types";
import { validateSpec } from "@/lib/engine/validate";
import { verifySpecText } from "@/lib/engine/verify";
import { NotFound, PayloadTooLarge, ValidationError } from "@/lib/errors";
import { enqueueJob, withBusyRetry } from "@/lib/jobs";
import { lineOfPointer, pointerLines } from "@/lib/json-lines";
import { loadEditableModel, loadVisibleModel, loadVisibleVersion, summarizeVersions, type VersionRow } from "@/lib/models";
import { sanitizeFileName, SPEC_MAX_BYTES, storeBytes } from "@/lib/storage";
import { removeUnreferenced, toFileInfo } from "@/lib/files";
import type { AddVersionResult, VersionSummary, VersionView, Viewer } from "@/lib/types/deposit";
import { pokeWorker } from "@/lib/worker";

/**
 * A spec that is not JSON: one problem at the root, worded and placed (line) by the engine's
 * own invalid report for unreadable text, so an upload and POST /api/v1/check say the same.
 * Call it only for text that failed to parse (verifySpecText would otherwise run the spec).
 */
export function notJsonError(text: string): ValidationError {
  const [problem = { path: "", message: "The file is not valid JSON." }] = verifySpecText(text).errors ?? [];
  return new ValidationError("The specification is not valid JSON; nothing was stored.", [problem]);
}

/** Adds line numbers from the uploaded text to the engine's pointer-only errors. */
export function withLines(text: string, errors: SpecError[]): SpecError[] {
  const lines = pointerLines(text);
  return errors.map((e) => {
    const line = lineOfPointer(lines, e.path);
    return line === undefined ? { ...e } : { ...e, line };
  });
}

/**
 * Parses and validates spec text the way an upload is checked (without storing anything):
 * returns the parsed spec or throws a ValidationError whose details are the problems with lines.
 */
export function checkSpecText(specText: string): ModelSpec {
  if (Buffer.byteLength(specText, "utf8") > SPEC_MAX_BYTES) {
    throw new PayloadTooLarge(SPEC_MAX_BYTES, "The specification is larger than the limit of 1 MB.");
  }
  let parsed: unknown;
  try {
    // A leading byte order mark is allowed, as the engine (which re-runs this same text) allows it.
    parsed = JSON.parse(specText.charCodeAt(0) === 0xfeff ? specText.slice(1) : specText);
  } catch {
    throw notJsonError(specText);
  }
  const errors = validateSpec(parsed);
  if (errors.length > 0) {
    throw new ValidationError(
      `The specification has ${errors.length === 1 ? "1 problem" : `${errors.length} problems`}; nothing was stored.`,
      withLines(specText, errors),
    );
  }
  return parsed as ModelSpec;
}

function strategyNamesOf(game: GameSpec): string[] {
  return game.kind === "symmetric" ? game.strategies : [...game.populations[0].strategies, ...game.populations[1].strategies];
}

async function summary(row: VersionRow): Promise<VersionSummary> {
  const [s] = await summarizeVersions([row]);
  if (s === undefined) throw new NotFound("version");
  return s;
}

async function findBySha(modelId: string, sha: string): Promise<VersionRow | undefined> {
  const rows = await db.select().from(version).where(and(eq(version.modelId, modelId), eq(version.specSha256, sha)));
  return rows[0];
}

function isUniqueViolation(e: unknown, index: string): boolean {
  for (let cur: unknown = e; cur instanceof Error; cur = cur.cause) {
    if (/UNIQUE constraint failed/.test(cur.message) && cur.message.includes(index)) return true;
  }
  return false;
}

/**
 * Uploads a spec as the model's next version (only its owner may). Throws ValidationError
 * (not JSON, or the format's rules: details carry pointer, message and line), PayloadTooLarge,
 * NotFound/Forbidden (access). Identical content returns { status: "identical" }.
 */
export async function addVersion(
  modelIdOrSlug: string,
  specText: string,
  uploader: Viewer,
  options: { fileName?: string } = {},
): Promise<AddVersionResult> {
  const m = await loadEditableModel(modelIdOrSlug, uploader);
  if (uploader === null) throw new NotFound("model"); // loadEditableModel refused anonymous already; this narrows the type
  const uploaderId = uploader.id;
  const spec = checkSpecText(specText);
  const sha = specSha256(spec);

  const existing = await findBySha(m.id, sha);
  if (existing !== undefined) return { status: "identical", version: await summary(existing) };

  const bytes = new TextEncoder().encode(specText);
  const blobSha = await storeBytes(bytes);
  const name = sanitizeFileName(options.fileName ?? "spec.json");
  for (let attempt = 0; ; attempt++) {
    try {
      const created = await withBusyRetry(() => db.transaction(async (tx) => {
        const top = await tx.select({ n: max(version.number) }).from(version).where(eq(version.modelId, m.id));
        const number = (top[0]?.n ?? 0) + 1;
        const versionId = crypto.randomUUID();
        const fileId = crypto.randomUUID();
        await tx.insert(file).values({
          id: fileId,
          sha256: blobSha,
          size: bytes.byteLength,
          mediaType: "application/json",
          originalName: name,
          modelId: m.id,
          versionId,
          purpose: "spec",
          uploadedBy: uploaderId,
        });
        const rows = await tx
          .insert(version)
          .values({
            id: versionId,
            modelId: m.id,
            number,
            specSha256: sha,
            specText,
            specFileId: fileId,
            title: spec.title,
            strategyNames: strategyNamesOf(spec.game).join("\n"),
            dynamicsKind: spec.dynamics?.kind ?? "replicator",
            uploadedBy: uploaderId,
          })
          .returning();
        await enqueueJob(versionId, { exec: tx });
        await recordAudit(
          { actorId: uploaderId, action: "version.uploaded", modelId: m.id, versionId, detail: { number, specSha256: sha, fileName: name } },
          tx,
        );
        const row = rows[0];
        if (row === undefined) throw new Error("addVersion: the insert returned no row");
        return row;
      }));
      pokeWorker();
      // The model page shows the newest version, and older version pages stop being the latest.
      if (m.visibility === "public") await publicContentChanged(m.id);
      return { status: "created", version: await summary(created) };
    } catch (e) {
      // Two uploads at once: the same content lost the race to the other, or a number clashed.
      if (isUniqueViolation(e, "spec_sha256")) {
        const winner = await findBySha(m.id, sha);
        if (winner !== undefined) {
          await removeUnreferenced(blobSha);
          return { status: "identical", version: await summary(winner) };
        }
      }
      if (isUniqueViolation(e, "version.number") && attempt < 3) continue;
      await removeUnreferenced(blobSha);
      throw e;
    }
  }
}

/** A model's versions, newest first. */
export async function listVersions(modelIdOrSlug: string, viewer: Viewer): Promise<VersionSummary[]> {
  const m = await loadVisibleModel(modelIdOrSlug, viewer);
  return summarizeVersions(await db.select().from(version).where(eq(version.modelId, m.id)));
}

async function toVersionView(row: VersionRow): Promise<VersionView> {
  const files = await db.select().from(file).where(eq(file.versionId, row.id));
  return {
    ...(await summary(row)),
    specText: row.specText,
    files: files.sort((a, b) => (a.purpose === b.purpose ? a.createdAt.getTime() - b.createdAt.getTime() : a.purpose === "spec" ? -1 : 1)).map(toFileInfo),
  };
}

/** Version `number` of a model (by id or slug), with its spec text and files. */
export async function getVersion(modelIdOrSlug: string, number: number, viewer: Viewer): Promise<VersionView> {
  const m = await loadVisibleModel(modelIdOrSlug, viewer);
  const rows = await db.select().from(version).where(and(eq(version.modelId, m.id), eq(version.number, number)));
  const row = rows[0];
  if (row === undefined) throw new NotFound("version");
  return toVersionView(row);
}

/** A version by its id, with its spec text and files. */
export async function getVersionById(versionId: string, viewer: Viewer): Promise<VersionView> {
  const { version: row } = await loadVisibleVersion(versionId, viewer);
  return toVersionView(row);
}
