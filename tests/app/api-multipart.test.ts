import { describe, expect, it } from "vitest";
import {
  firstFilePart,
  multipartBoundary,
  NO_FILE_MESSAGE,
  NOT_MULTIPART_MESSAGE,
  parseDisposition,
  TRUNCATED_MESSAGE,
} from "@/app/api/v1/_support/multipart";
import { ValidationError } from "@/lib/errors";

async function readAll(stream: ReadableStream<Uint8Array>): Promise<Buffer> {
  const chunks: Uint8Array[] = [];
  const reader = stream.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}

/** A body re-delivered in chunks of `size` bytes, to cross every boundary position. */
function rechunk(bytes: Uint8Array, size: number): ReadableStream<Uint8Array> {
  let at = 0;
  return new ReadableStream({
    pull(c) {
      if (at >= bytes.length) return c.close();
      c.enqueue(bytes.slice(at, at + size));
      at += size;
    },
  });
}

async function encoded(form: FormData): Promise<{ bytes: Uint8Array; type: string }> {
  const req = new Request("http://x/", { method: "POST", body: form });
  return { bytes: new Uint8Array(await req.arrayBuffer()), type: req.headers.get("content-type") ?? "" };
}

describe("multipartBoundary / parseDisposition", () => {
  it("reads the boundary of multipart/form-data only", () => {
    expect(multipartBoundary('multipart/form-data; boundary="a b"')).toBe("a b");
    expect(multipartBoundary("Multipart/Form-Data; charset=utf-8; boundary=xyz")).toBe("xyz");
    expect(multipartBoundary("application/json")).toBeNull();
    expect(multipartBoundary("multipart/form-data")).toBeNull();
    expect(multipartBoundary(null)).toBeNull();
  });
  it("reads quoted and RFC 5987 file names, keeping backslashes", () => {
    expect(parseDisposition('form-data; name="file"; filename="C:\\data\\a b.csv"')).toEqual({ name: "file", filename: "C:\\data\\a b.csv" });
    expect(parseDisposition("form-data; name=spec; filename=\"x.json\"; filename*=UTF-8''n%C3%A4me.json")).toEqual({ name: "spec", filename: "näme.json" });
    expect(parseDisposition('form-data; name="title"')).toEqual({ name: "title", filename: null });
  });
});

describe("firstFilePart", () => {
  // Bytes that look like parts of a delimiter, CRLFs and all 256 byte values.
  const tricky = Buffer.concat([Buffer.from("\r\n--\r\n-\r\n--x"), Buffer.from(Array.from({ length: 256 }, (_, i) => i)), Buffer.from("\r\n")]);

  it("skips the fields before the file and returns the file's exact bytes, whatever the chunking", async () => {
    const form = new FormData();
    form.append("name", "observations.csv");
    form.append("relativePath", "null");
    form.append("file", new Blob([tricky], { type: "text/csv" }), "observations.csv");
    form.append("after", "ignored");
    const { bytes, type } = await encoded(form);
    for (const size of [1, 2, 3, 7, 64, 100000]) {
      const part = await firstFilePart(rechunk(bytes, size), type);
      expect(part.field).toBe("file");
      expect(part.filename).toBe("observations.csv");
      expect(part.contentType).toBe("text/csv");
      expect(Buffer.compare(await readAll(part.stream), tricky)).toBe(0);
    }
  });

  it("refuses a body that is not multipart, and a form without a file", async () => {
    await expect(firstFilePart(rechunk(new Uint8Array(4), 4), "application/json")).rejects.toThrow(NOT_MULTIPART_MESSAGE);
    const form = new FormData();
    form.append("title", "no file here");
    const { bytes, type } = await encoded(form);
    const err = await firstFilePart(rechunk(bytes, 5), type).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ValidationError);
    expect((err as ValidationError).message).toBe(NO_FILE_MESSAGE);
    expect((err as ValidationError).status).toBe(400);
  });

  it("errors the file stream when the body is cut off inside the file", async () => {
    const form = new FormData();
    form.append("file", new Blob([Buffer.alloc(5000, 65)]), "big.txt");
    const { bytes, type } = await encoded(form);
    const part = await firstFilePart(rechunk(bytes.slice(0, 3000), 512), type);
    await expect(readAll(part.stream)).rejects.toThrow(TRUNCATED_MESSAGE);
  });

  it("refuses a part whose headers run on without end", async () => {
    const body = new TextEncoder().encode(`--b\r\nContent-Disposition: form-data; name="file"; filename="x.txt"\r\nX-Pad: ${"p".repeat(9000)}`);
    await expect(firstFilePart(rechunk(body, 1024), "multipart/form-data; boundary=b")).rejects.toThrow("A part's headers are too long.");
  });

  it("refuses oversized fields before the file", async () => {
    const form = new FormData();
    form.append("padding", "p".repeat(70 * 1024));
    form.append("file", new Blob(["x"]), "x.txt");
    const { bytes, type } = await encoded(form);
    await expect(firstFilePart(rechunk(bytes, 4096), type)).rejects.toThrow("The form's fields before the file are too large.");
  });
});
