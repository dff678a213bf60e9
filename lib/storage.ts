/**
 * Content-addressed file store under env.uploadsDir: a blob lives at uploads/ab/cdef... (its
 * SHA-256 in hex, split after two characters), written to a temporary file first and renamed
 * into place, so a reader never sees half a file and two uploads of the same bytes share one.
 * The client's file name never reaches a path: it is cleaned for display and kept as metadata.
 *
 * Types are decided from the content, not from what the client says: PDF by "%PDF-", ZIP by
 * "PK\x03\x04" (or the empty archive's "PK\x05\x06"), CSV, plain text and JSON by being valid
 * UTF-8 without NUL bytes. The declared type (the file name's extension) must match.
 */
import "server-only";
import { createHash } from "node:crypto";
import { createReadStream } from "node:fs";
import { mkdir, open, readdir, rename, rm, stat } from "node:fs/promises";
import path from "node:path";
import { Readable } from "node:stream";
import { env } from "@/lib/env";
import { PayloadTooLarge, ValidationError } from "@/lib/errors";

export const SPEC_MAX_BYTES = 1_000_000;
export const SUPPLEMENT_MAX_BYTES = 50_000_000;

export type UploadPurpose = "spec" | "supplement";
type ContentKind = "pdf" | "zip" | "text";

interface TypeRule {
  extension: string;
  mediaType: string;
  kind: ContentKind;
  label: string;
}

/** What may be uploaded, by the file name's extension. */
export const UPLOAD_TYPES: Record<UploadPurpose, TypeRule[]> = {
  spec: [{ extension: ".json", mediaType: "application/json", kind: "text", label: "JSON" }],
  supplement: [
    { extension: ".csv", mediaType: "text/csv", kind: "text", label: "CSV" },
    { extension: ".txt", mediaType: "text/plain", kind: "text", label: "plain text" },
    { extension: ".pdf", mediaType: "application/pdf", kind: "pdf", label: "PDF" },
    { extension: ".zip", mediaType: "application/zip", kind: "zip", label: "ZIP" },
  ],
};

export function maxBytesFor(purpose: UploadPurpose): number {
  return purpose === "spec" ? SPEC_MAX_BYTES : SUPPLEMENT_MAX_BYTES;
}

function tooLarge(purpose: UploadPurpose): PayloadTooLarge {
  return purpose === "spec"
    ? new PayloadTooLarge(SPEC_MAX_BYTES, "The specification is larger than the limit of 1 MB.")
    : new PayloadTooLarge(SUPPLEMENT_MAX_BYTES, "The file is larger than the limit of 50 MB for a supplementary file.");
}

// Control characters (C0, DEL, C1) and the bidirectional overrides that can make a name read backwards.
const UNSAFE_NAME_CHARS = /[\u0000-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/g;

/**
 * The client's file name made safe to show: only the last path segment (after / or \), no
 * control or direction-override characters, at most 200 characters; "file" if nothing is left.
 * Never used to build a path.
 */
export function sanitizeFileName(name: string): string {
  const last = name.split(/[/\\]/).pop() ?? "";
  const cleaned = last.replace(UNSAFE_NAME_CHARS, "").replace(/\s+/g, " ").trim().slice(0, 200).trim();
  return cleaned === "" || cleaned === "." || cleaned === ".." ? "file" : cleaned;
}

/** The type rule for a (cleaned) name, or a ValidationError listing what is allowed. */
export function typeRuleFor(name: string, purpose: UploadPurpose): TypeRule {
  const lower = name.toLowerCase();
  const rule = UPLOAD_TYPES[purpose].find((r) => lower.endsWith(r.extension));
  if (rule === undefined) {
    const allowed = UPLOAD_TYPES[purpose].map((r) => r.extension).join(", ");
    throw new ValidationError(
      purpose === "spec"
        ? "A specification must be a .json file."
        : `Only CSV, plain-text, PDF and ZIP files can be attached (${allowed}).`,
      [{ path: "/file", message: `"${name}" has none of the extensions ${allowed}.` }],
    );
  }
  return rule;
}

/** The blob's path for a SHA-256 hex digest (refuses anything else, so no path can escape uploads/). */
export function blobPath(sha256: string): string {
  if (!/^[0-9a-f]{64}$/.test(sha256)) throw new Error(`not a sha-256 hex digest: ${JSON.stringify(sha256)}`);
  return path.join(env.uploadsDir, sha256.slice(0, 2), sha256.slice(2));
}

export interface StoredBlob {
  sha256: string;
  size: number;
  mediaType: string;
  /** The cleaned client name (display only). */
  originalName: string;
}

/** Tracks what the bytes look like while they stream past. */
class Sniffer {
  private head = new Uint8Array(0);
  private decoder = new TextDecoder("utf-8", { fatal: true });
  private utf8 = true;
  private nul = false;

  push(chunk: Uint8Array): void {
    if (this.head.length < 8) {
      const merged = new Uint8Array(Math.min(8, this.head.length + chunk.length));
      merged.set(this.head.subarray(0, merged.length));
      merged.set(chunk.subarray(0, merged.length - this.head.length), this.head.length);
      this.head = merged;
    }
    if (!this.nul && chunk.includes(0)) this.nul = true;
    if (this.utf8) {
      try {
        this.decoder.decode(chunk, { stream: true });
      } catch {
        this.utf8 = false;
      }
    }
  }

  kind(): ContentKind | "binary" {
    if (this.utf8) {
      try {
        this.decoder.decode(); // a sequence cut off at the end is invalid too
      } catch {
        this.utf8 = false;
      }
    }
    const h = this.head;
    if (h.length >= 5 && String.fromCharCode(...h.subarray(0, 5)) === "%PDF-") return "pdf";
    if (h.length >= 4 && h[0] === 0x50 && h[1] === 0x4b && ((h[2] === 0x03 && h[3] === 0x04) || (h[2] === 0x05 && h[3] === 0x06))) return "zip";
    return this.utf8 && !this.nul ? "text" : "binary";
  }
}

function mismatch(name: string, rule: TypeRule): ValidationError {
  const what =
    rule.kind === "pdf"
      ? "a PDF (it does not start with %PDF-)"
      : rule.kind === "zip"
        ? "a ZIP archive (it does not start with PK)"
        : `${rule.label === "plain text" ? "plain" : rule.label} text (it is not UTF-8 text without NUL bytes)`;
  return new ValidationError(`The content of "${name}" does not match its type: it is not ${what}.`, [
    { path: "/file", message: `Declared ${rule.label} by its name, but the content is not.` },
  ]);
}

/**
 * Streams an upload into the store with a running size cap: past the limit the stream is
 * cancelled and nothing is kept (the whole body is never buffered). Checks that the content
 * matches the type its name declares. Refuses an empty file.
 */
export async function storeUpload(
  body: ReadableStream<Uint8Array> | null,
  options: { name: string; purpose: UploadPurpose; declaredLength?: number | null },
): Promise<StoredBlob> {
  const originalName = sanitizeFileName(options.name);
  const rule = typeRuleFor(originalName, options.purpose);
  const max = maxBytesFor(options.purpose);
  if (options.declaredLength !== undefined && options.declaredLength !== null && options.declaredLength > max) throw tooLarge(options.purpose);
  if (body === null) throw new ValidationError("The upload has no content.", [{ path: "/file", message: "The request body is empty." }]);

  const tmpDir = path.join(env.uploadsDir, ".tmp");
  await mkdir(tmpDir, { recursive: true });
  const tmp = path.join(tmpDir, crypto.randomUUID());
  const handle = await open(tmp, "wx", 0o600);
  const hash = createHash("sha256");
  const sniffer = new Sniffer();
  let size = 0;
  const reader = body.getReader();
  let kept = false;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      size += value.byteLength;
      if (size > max) {
        await reader.cancel().catch(() => undefined);
        throw tooLarge(options.purpose);
      }
      hash.update(value);
      sniffer.push(value);
      await handle.write(value);
    }
    if (size === 0) throw new ValidationError(`"${originalName}" is empty.`, [{ path: "/file", message: "The file has no content." }]);
    const kind = sniffer.kind();
    if (kind !== rule.kind) throw mismatch(originalName, rule);
    await handle.sync();
    await handle.close();
    const sha256 = hash.digest("hex");
    const final = blobPath(sha256);
    await mkdir(path.dirname(final), { recursive: true });
    await rename(tmp, final); // same bytes already there: rename replaces them with identical ones
    kept = true;
    return { sha256, size, mediaType: rule.mediaType, originalName };
  } finally {
    if (!kept) {
      await handle.close().catch(() => undefined);
      await rm(tmp, { force: true });
    }
  }
}

/** Reads a request body as bytes with a running cap (for specs, which the engine needs whole). */
export async function readCapped(body: ReadableStream<Uint8Array> | null, purpose: UploadPurpose, declaredLength?: number | null): Promise<Uint8Array> {
  const max = maxBytesFor(purpose);
  if (declaredLength !== undefined && declaredLength !== null && declaredLength > max) throw tooLarge(purpose);
  if (body === null) return new Uint8Array(0);
  const chunks: Uint8Array[] = [];
  let size = 0;
  const reader = body.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > max) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge(purpose);
    }
    chunks.push(value);
  }
  const out = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

/** Decodes an uploaded spec: UTF-8 without NUL bytes (a leading byte-order mark is dropped), else a ValidationError. */
export function decodeSpecBytes(bytes: Uint8Array): string {
  if (bytes.length === 0) throw new ValidationError("The specification is empty.", [{ path: "", message: "The file has no content." }]);
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true, ignoreBOM: false }).decode(bytes);
  } catch {
    throw new ValidationError("The specification is not UTF-8 text.", [{ path: "", message: "JSON files must be UTF-8 text." }]);
  }
  if (text.includes("\u0000")) throw new ValidationError("The specification is not UTF-8 text.", [{ path: "", message: "The file holds NUL bytes." }]);
  return text;
}

/** Writes bytes already in memory (a validated spec) into the store; returns the digest. */
export async function storeBytes(bytes: Uint8Array): Promise<string> {
  const sha256 = createHash("sha256").update(bytes).digest("hex");
  const final = blobPath(sha256);
  try {
    await stat(final);
    return sha256;
  } catch {
    // not stored yet
  }
  const tmpDir = path.join(env.uploadsDir, ".tmp");
  await mkdir(tmpDir, { recursive: true });
  const tmp = path.join(tmpDir, crypto.randomUUID());
  const handle = await open(tmp, "wx", 0o600);
  try {
    await handle.write(bytes);
    await handle.sync();
  } finally {
    await handle.close();
  }
  await mkdir(path.dirname(final), { recursive: true });
  await rename(tmp, final);
  return sha256;
}

/** Deletes a blob (when the database row that would have referenced it was not written). */
export async function removeBlob(sha256: string): Promise<void> {
  await rm(blobPath(sha256), { force: true });
}

/** A web stream of a stored blob, for download responses. */
export function openBlob(sha256: string): ReadableStream<Uint8Array> {
  return Readable.toWeb(createReadStream(blobPath(sha256))) as ReadableStream<Uint8Array>;
}

/** The request's declared body length (Content-Length), or null when it has none or an unreadable one. */
export function declaredLength(request: Request): number | null {
  const value = request.headers.get("content-length");
  if (value === null || !/^\d+$/.test(value)) return null;
  return Number(value);
}

/**
 * Deletes temporary upload files older than `maxAgeMs` (left by a process killed mid-upload;
 * a live upload renames or removes its own). Returns how many were removed.
 */
export async function sweepTempUploads(maxAgeMs = 60 * 60 * 1000, now: number = Date.now()): Promise<number> {
  const tmpDir = path.join(env.uploadsDir, ".tmp");
  let names: string[];
  try {
    names = await readdir(tmpDir);
  } catch {
    return 0;
  }
  let removed = 0;
  for (const name of names) {
    const full = path.join(tmpDir, name);
    try {
      if (now - (await stat(full)).mtimeMs > maxAgeMs) {
        await rm(full, { force: true });
        removed += 1;
      }
    } catch {
      // gone meanwhile
    }
  }
  return removed;
}
