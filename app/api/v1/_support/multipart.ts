/**
 * Streaming reader for multipart/form-data uploads (RFC 7578) that hands out the first file
 * part as a byte stream, without buffering the file: Request.formData() would hold a 50 MB
 * upload in memory before any size or type check could run. Fields before the file (Uppy's
 * metadata, a script's extras) are skipped, up to a small total.
 */
import { ValidationError } from "@/lib/errors";

export const MAX_FIELD_BYTES = 64 * 1024;
const MAX_HEADER_BYTES = 8 * 1024;

export interface FilePart {
  /** The form field's name. */
  field: string;
  /** The client's file name as sent (clean it before showing it; never use it as a path). */
  filename: string;
  contentType: string | null;
  stream: ReadableStream<Uint8Array>;
}

export const NOT_MULTIPART_MESSAGE = "Send the file as multipart/form-data with a boundary.";
export const NO_FILE_MESSAGE = "The form has no file part.";
export const TRUNCATED_MESSAGE = "The upload ended before the file did (the multipart body is cut off).";

function malformed(message: string): ValidationError {
  return new ValidationError(message, [{ path: "/file", message }], 400);
}

/** The boundary of a multipart/form-data content type, or null for any other type. */
export function multipartBoundary(contentType: string | null): string | null {
  if (contentType === null) return null;
  const [type, ...params] = contentType.split(";");
  if (type?.trim().toLowerCase() !== "multipart/form-data") return null;
  for (const p of params) {
    const m = /^\s*boundary\s*=\s*(?:"([^"]+)"|([^\s;]+))\s*$/i.exec(p);
    if (m !== null) return m[1] ?? m[2] ?? null;
  }
  return null;
}

/**
 * Reads Content-Disposition's name and filename (quoted, or RFC 5987 filename* in UTF-8).
 * Browsers write a quote in a name as %22 and never backslash-escape (WHATWG HTML, multipart
 * form data), so a backslash is an ordinary character here: a Windows path stays recognisable.
 */
export function parseDisposition(value: string): { name: string | null; filename: string | null } {
  const param = (key: string): string | null => {
    const m = new RegExp(`;\\s*${key}\\s*=\\s*(?:"([^"]*)"|([^;\\s]+))`, "i").exec(value);
    if (m === null) return null;
    return m[1] ?? m[2] ?? null;
  };
  const extended = param("filename\\*");
  let filename = param("filename");
  if (extended !== null) {
    const m = /^utf-8''(.*)$/i.exec(extended);
    if (m?.[1] !== undefined) {
      try {
        filename = decodeURIComponent(m[1]);
      } catch {
        // keep the plain filename
      }
    }
  }
  return { name: param("name"), filename };
}

class Bytes {
  private buf = Buffer.alloc(0);
  private ended = false;
  constructor(private readonly reader: ReadableStreamDefaultReader<Uint8Array>) {}

  get length(): number {
    return this.buf.length;
  }
  indexOf(marker: Buffer): number {
    return this.buf.indexOf(marker);
  }
  /** Reads one more chunk; false at the end of the body. */
  async fill(): Promise<boolean> {
    if (this.ended) return false;
    const { done, value } = await this.reader.read();
    if (done) {
      this.ended = true;
      return false;
    }
    this.buf = this.buf.length === 0 ? Buffer.from(value) : Buffer.concat([this.buf, value]);
    return true;
  }
  take(n: number): Buffer {
    const out = this.buf.subarray(0, n);
    this.buf = this.buf.subarray(n);
    return out;
  }
  skip(n: number): void {
    this.buf = this.buf.subarray(n);
  }
  cancel(): Promise<void> {
    return this.reader.cancel().catch(() => undefined);
  }
  /** Everything before `marker` (which is consumed), reading at most `limit` bytes; null if the body ends first. */
  async until(marker: Buffer, limit: number, tooLong: string): Promise<Buffer | null> {
    for (;;) {
      const at = this.indexOf(marker);
      if (at >= 0) {
        const out = Buffer.from(this.take(at));
        this.skip(marker.length);
        return out;
      }
      if (this.length > limit + marker.length) throw malformed(tooLong);
      if (!(await this.fill())) return null;
    }
  }
}

/**
 * The first part of `body` that carries a filename. The returned stream ends where the part
 * ends; reading it to its end is the caller's job (lib/storage caps the size as it reads).
 */
export async function firstFilePart(body: ReadableStream<Uint8Array> | null, contentType: string | null): Promise<FilePart> {
  const boundary = multipartBoundary(contentType);
  if (boundary === null) throw malformed(NOT_MULTIPART_MESSAGE);
  if (body === null) throw malformed(NO_FILE_MESSAGE);
  const bytes = new Bytes(body.getReader());
  const opening = Buffer.from(`--${boundary}`);
  const delimiter = Buffer.from(`\r\n--${boundary}`);
  const headerEnd = Buffer.from("\r\n\r\n");

  // Preamble, then the first delimiter line.
  if ((await bytes.until(opening, MAX_FIELD_BYTES, NO_FILE_MESSAGE)) === null) throw malformed(NO_FILE_MESSAGE);
  let skipped = 0;
  for (;;) {
    // After a delimiter: "--" closes the body, CRLF starts a part.
    while (bytes.length < 2) if (!(await bytes.fill())) throw malformed(TRUNCATED_MESSAGE);
    const after = bytes.take(2).toString("latin1");
    if (after === "--") {
      await bytes.cancel();
      throw malformed(NO_FILE_MESSAGE);
    }
    if (after !== "\r\n") throw malformed(TRUNCATED_MESSAGE);
    const head = await bytes.until(headerEnd, MAX_HEADER_BYTES, "A part's headers are too long.");
    if (head === null) throw malformed(TRUNCATED_MESSAGE);
    const headers = new Map<string, string>();
    for (const line of head.toString("utf8").split("\r\n")) {
      const colon = line.indexOf(":");
      if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim());
    }
    const disposition = parseDisposition(headers.get("content-disposition") ?? "");
    if (disposition.filename !== null) {
      return {
        field: disposition.name ?? "",
        filename: disposition.filename,
        contentType: headers.get("content-type") ?? null,
        stream: partStream(bytes, delimiter),
      };
    }
    // A plain field: skip its value, within a small total.
    const value = await bytes.until(delimiter, MAX_FIELD_BYTES - skipped, "The form's fields before the file are too large.");
    if (value === null) throw malformed(TRUNCATED_MESSAGE);
    skipped += value.length;
  }
}

/** The bytes up to `delimiter`, holding back a tail that might be the delimiter's start. */
function partStream(bytes: Bytes, delimiter: Buffer): ReadableStream<Uint8Array> {
  let finished = false;
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      for (;;) {
        const at = bytes.indexOf(delimiter);
        if (at >= 0) {
          if (at > 0) controller.enqueue(new Uint8Array(bytes.take(at)));
          finished = true;
          controller.close();
          await bytes.cancel();
          return;
        }
        const safe = bytes.length - (delimiter.length - 1);
        if (safe > 0) {
          controller.enqueue(new Uint8Array(bytes.take(safe)));
          return;
        }
        if (!(await bytes.fill())) {
          controller.error(malformed(TRUNCATED_MESSAGE));
          return;
        }
      }
    },
    async cancel() {
      if (!finished) await bytes.cancel();
    },
  });
}
