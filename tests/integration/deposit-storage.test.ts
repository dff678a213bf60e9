import "./deposit-env";
import { existsSync, mkdirSync, readdirSync, readFileSync, utimesSync, writeFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { Forbidden, NotFound, PayloadTooLarge, ValidationError } from "@/lib/errors";
import { attachSupplement, getFile, listFiles, openFile } from "@/lib/files";
import { createModel, updateModel } from "@/lib/models";
import { ALPINE_BUMBLEBEES } from "@/lib/demo/models";
import {
  blobPath,
  decodeSpecBytes,
  readCapped,
  sanitizeFileName,
  SPEC_MAX_BYTES,
  storeUpload,
  SUPPLEMENT_MAX_BYTES,
  sweepTempUploads,
} from "@/lib/storage";
import { addVersion } from "@/lib/versions";
import { uploadsDir } from "./deposit-env";
import { makeUser, migrated } from "./deposit-support";

beforeAll(async () => {
  await migrated();
});

const enc = new TextEncoder();

function streamOf(...chunks: (string | Uint8Array)[]): ReadableStream<Uint8Array> {
  return new ReadableStream({
    start(c) {
      for (const chunk of chunks) c.enqueue(typeof chunk === "string" ? enc.encode(chunk) : chunk);
      c.close();
    },
  });
}

/** An endless stream of 64 KiB chunks that counts how much was pulled from it. */
function endless(): { stream: ReadableStream<Uint8Array>; pulled: () => number; cancelled: () => boolean } {
  let pulled = 0;
  let cancelled = false;
  const chunk = new Uint8Array(64 * 1024).fill(0x61);
  const stream = new ReadableStream<Uint8Array>({
    pull(c) {
      pulled += chunk.byteLength;
      c.enqueue(chunk);
    },
    cancel() {
      cancelled = true;
    },
  }, { highWaterMark: 0 });
  return { stream, pulled: () => pulled, cancelled: () => cancelled };
}

function tmpFiles(): string[] {
  const dir = path.join(uploadsDir, ".tmp");
  return existsSync(dir) ? readdirSync(dir) : [];
}

async function caught(p: Promise<unknown>): Promise<unknown> {
  try {
    await p;
  } catch (e) {
    return e;
  }
  throw new Error("expected a rejection");
}

describe("file names", () => {
  it("keeps only a clean last segment for display", () => {
    expect(sanitizeFileName("../../etc/passwd")).toBe("passwd");
    expect(sanitizeFileName("..\\..\\windows\\system.ini")).toBe("system.ini");
    expect(sanitizeFileName("data\u0000.csv")).toBe("data.csv");
    expect(sanitizeFileName("a\r\nb\tc\u007f\u0085.txt")).toBe("abc.txt");
    expect(sanitizeFileName("report\u202Efdp.exe")).toBe("reportfdp.exe");
    expect(sanitizeFileName("  spaced   name.csv ")).toBe("spaced name.csv");
    expect(sanitizeFileName("../")).toBe("file");
    expect(sanitizeFileName("..")).toBe("file");
    expect(sanitizeFileName("x".repeat(300) + ".csv")).toHaveLength(200);
  });

  it("refuses anything but a sha-256 digest as a blob path", () => {
    expect(() => blobPath("../../etc/passwd")).toThrow(/not a sha-256 hex digest/);
    expect(blobPath("ab" + "0".repeat(62))).toBe(path.join(uploadsDir, "ab", "0".repeat(62)));
  });
});

describe("storing uploads", () => {
  it("stores by content hash under uploads/, never under the client's name", async () => {
    for (const hostile of ["../../etc/passwd.csv", "/etc/passwd.csv", "..\\..\\x.csv", "a\u0000/../../b.csv", "\u0001\u0002.csv"]) {
      const blob = await storeUpload(streamOf("a,b\n1,2\n"), { name: hostile, purpose: "supplement" });
      const where = blobPath(blob.sha256);
      expect(where.startsWith(uploadsDir + path.sep)).toBe(true);
      expect(path.relative(uploadsDir, where)).toBe(path.join(blob.sha256.slice(0, 2), blob.sha256.slice(2)));
      expect(readFileSync(where, "utf8")).toBe("a,b\n1,2\n");
      expect(blob.originalName).not.toMatch(/[/\\\u0000-\u001f]/);
      expect(blob.mediaType).toBe("text/csv");
    }
    expect(existsSync(path.join(uploadsDir, "..", "etc"))).toBe(false);
    expect(tmpFiles()).toEqual([]);
  });

  it("accepts real PDF, ZIP and text content across chunk boundaries", async () => {
    const pdf = await storeUpload(streamOf("%P", "DF-1.7\n%\u00e2\u00e3\n"), { name: "paper.PDF", purpose: "supplement" });
    expect([pdf.mediaType, pdf.size]).toEqual(["application/pdf", enc.encode("%PDF-1.7\n%\u00e2\u00e3\n").byteLength]);
    const zip = await storeUpload(streamOf(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0xff, 0xfe])), { name: "code.zip", purpose: "supplement" });
    expect(zip.mediaType).toBe("application/zip");
    // A multi-byte character split between two chunks is still valid UTF-8.
    const euro = enc.encode("price \u20ac\n");
    const txt = await storeUpload(streamOf(euro.subarray(0, 7), euro.subarray(7)), { name: "notes.txt", purpose: "supplement" });
    expect(txt.mediaType).toBe("text/plain");
  });

  it("refuses content that does not match its declared type, keeping nothing", async () => {
    const cases: [string, ReadableStream<Uint8Array>, string][] = [
      ["fake.pdf", streamOf("just text, not a PDF"), 'The content of "fake.pdf" does not match its type: it is not a PDF (it does not start with %PDF-).'],
      ["fake.zip", streamOf("%PDF-1.4"), 'The content of "fake.zip" does not match its type: it is not a ZIP archive (it does not start with PK).'],
      ["table.csv", streamOf(new Uint8Array([0x61, 0x00, 0x62])), 'The content of "table.csv" does not match its type: it is not CSV text (it is not UTF-8 text without NUL bytes).'],
      ["notes.txt", streamOf(new Uint8Array([0xff, 0xfe, 0x41])), 'The content of "notes.txt" does not match its type: it is not plain text (it is not UTF-8 text without NUL bytes).'],
      ["cut.txt", streamOf(new Uint8Array([0x41, 0xe2, 0x82])), 'The content of "cut.txt" does not match its type: it is not plain text (it is not UTF-8 text without NUL bytes).'],
    ];
    for (const [name, body, message] of cases) {
      const e = await caught(storeUpload(body, { name, purpose: "supplement" }));
      expect(e, name).toBeInstanceOf(ValidationError);
      expect((e as ValidationError).message).toBe(message);
    }
    expect(tmpFiles()).toEqual([]);
  });

  it("refuses types that are not allowed and empty files", async () => {
    const exe = await caught(storeUpload(streamOf("MZ"), { name: "tool.exe", purpose: "supplement" }));
    expect((exe as ValidationError).message).toBe("Only CSV, plain-text, PDF and ZIP files can be attached (.csv, .txt, .pdf, .zip).");
    expect((exe as ValidationError).problems).toEqual([{ path: "/file", message: '"tool.exe" has none of the extensions .csv, .txt, .pdf, .zip.' }]);
    const spec = await caught(storeUpload(streamOf("{}"), { name: "spec.yaml", purpose: "spec" }));
    expect((spec as ValidationError).message).toBe("A specification must be a .json file.");
    const empty = await caught(storeUpload(streamOf(), { name: "empty.csv", purpose: "supplement" }));
    expect((empty as ValidationError).message).toBe('"empty.csv" is empty.');
    const none = await caught(storeUpload(null, { name: "none.csv", purpose: "supplement" }));
    expect((none as ValidationError).message).toBe("The upload has no content.");
  });

  it("stops reading an oversize upload at the limit instead of buffering it", async () => {
    const { stream, pulled, cancelled } = endless();
    const e = await caught(storeUpload(stream, { name: "big.csv", purpose: "supplement" }));
    expect(e).toBeInstanceOf(PayloadTooLarge);
    expect((e as PayloadTooLarge).message).toBe("The file is larger than the limit of 50 MB for a supplementary file.");
    expect((e as PayloadTooLarge).limitBytes).toBe(SUPPLEMENT_MAX_BYTES);
    expect(cancelled()).toBe(true);
    expect(pulled()).toBeLessThanOrEqual(SUPPLEMENT_MAX_BYTES + 2 * 64 * 1024);
    expect(tmpFiles()).toEqual([]);

    // A declared length over the limit is refused before reading a byte.
    const second = endless();
    const early = await caught(storeUpload(second.stream, { name: "big.csv", purpose: "supplement", declaredLength: SUPPLEMENT_MAX_BYTES + 1 }));
    expect(early).toBeInstanceOf(PayloadTooLarge);
    expect(second.pulled()).toBe(0);
  }, 60_000);

  it("reads a spec body with the 1 MB cap and decodes it as UTF-8 without NUL", async () => {
    const third = endless();
    const e = await caught(readCapped(third.stream, "spec"));
    expect((e as PayloadTooLarge).message).toBe("The specification is larger than the limit of 1 MB.");
    expect(third.pulled()).toBeLessThanOrEqual(SPEC_MAX_BYTES + 2 * 64 * 1024);
    expect(await caught(readCapped(streamOf("{}"), "spec", SPEC_MAX_BYTES + 1))).toBeInstanceOf(PayloadTooLarge);
    expect(decodeSpecBytes(await readCapped(streamOf("\ufeff{", "}"), "spec"))).toBe("{}");
    expect((await caught(Promise.resolve().then(() => decodeSpecBytes(new Uint8Array([0x7b, 0xff, 0x7d]))))) as ValidationError).toMatchObject({
      message: "The specification is not UTF-8 text.",
    });
    expect(() => decodeSpecBytes(enc.encode("{\u0000}"))).toThrow("The specification is not UTF-8 text.");
    expect(() => decodeSpecBytes(new Uint8Array(0))).toThrow("The specification is empty.");
  });
});

describe("supplementary files", () => {
  it("attaches files to a version for its owner only, and hides them with a private model", async () => {
    const alice = await makeUser("Alice");
    const bob = await makeUser("Bob");
    const m = await createModel(alice, { title: "With data" });
    const { version } = await addVersion(m.id, JSON.stringify(ALPINE_BUMBLEBEES), alice, { fileName: "bees.json" });
    const info = await attachSupplement(version.id, alice, { body: streamOf("t,x\n0,0.1\n"), name: "../../runs.csv" });
    expect([info.originalName, info.mediaType, info.size, info.purpose]).toEqual(["runs.csv", "text/csv", 10, "supplement"]);
    const files = await listFiles(version.id, alice);
    expect(files.map((f) => [f.purpose, f.originalName])).toEqual([
      ["spec", "bees.json"],
      ["supplement", "runs.csv"],
    ]);
    const { stream } = await openFile(info.id, alice);
    expect(await new Response(stream).text()).toBe("t,x\n0,0.1\n");

    // Bob: the private model's version and file do not exist for him, and he reads no byte of an upload.
    const body = endless();
    expect(await caught(attachSupplement(version.id, bob, { body: body.stream, name: "x.csv" }))).toBeInstanceOf(NotFound);
    expect(body.pulled()).toBe(0);
    expect(await caught(listFiles(version.id, bob))).toBeInstanceOf(NotFound);
    const e = await caught(getFile(info.id, bob));
    expect(e).toBeInstanceOf(NotFound);
    expect((e as NotFound).message).toBe("No such file.");
    expect(await caught(getFile(info.id, null))).toBeInstanceOf(NotFound);

    // Once public, Bob reads the files but may not attach any.
    await updateModel(m.id, alice, { title: "With data", visibility: "public" });
    expect((await getFile(info.id, bob)).id).toBe(info.id);
    const forbidden = await caught(attachSupplement(version.id, bob, { body: streamOf("a"), name: "x.csv" }));
    expect(forbidden).toBeInstanceOf(Forbidden);
    expect((forbidden as Forbidden).message).toBe("Only the model's owner may attach files to it.");
  });
});

describe("temporary uploads", () => {
  it("sweeps temporary files left by a crash, keeping recent ones", async () => {
    const dir = path.join(uploadsDir, ".tmp");
    mkdirSync(dir, { recursive: true });
    writeFileSync(path.join(dir, "old"), "x");
    writeFileSync(path.join(dir, "new"), "y");
    const twoHoursAgo = (Date.now() - 2 * 3600_000) / 1000;
    utimesSync(path.join(dir, "old"), twoHoursAgo, twoHoursAgo);
    expect(await sweepTempUploads()).toBe(1);
    expect(readdirSync(dir)).toEqual(["new"]);
    expect(await sweepTempUploads(0, Date.now() + 1000)).toBe(1);
    expect(readdirSync(dir)).toEqual([]);
  });
});
