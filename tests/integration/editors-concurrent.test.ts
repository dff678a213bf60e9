/** Two processes deciding on the same versions at the same moment: exactly one decision lands per version. */
import "./editors-env";
import { spawn } from "node:child_process";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { auditEvent, decision } from "@/db/schema";
import { ALREADY_DECIDED_MESSAGE } from "@/lib/decisions";
import { addSubmitted, makeModel, makeUser, makeVenueWith, migrated } from "./editors-support";

beforeAll(async () => {
  await migrated();
});

function startDecider(editorId: string, slugs: string[]) {
  const child = spawn(
    process.execPath,
    ["--conditions=react-server", "--import", "tsx", path.join(import.meta.dirname, "editors-decider.ts"), editorId, ...slugs],
    { cwd: path.resolve(import.meta.dirname, "../.."), env: process.env, stdio: ["pipe", "pipe", "pipe"] },
  );
  let out = "";
  let err = "";
  let markReady: () => void = () => {};
  const ready = new Promise<void>((resolve) => (markReady = resolve));
  child.stdout.on("data", (d: Buffer) => {
    out += d.toString();
    if (out.startsWith("ready\n")) markReady();
  });
  child.stderr.on("data", (d: Buffer) => (err += d.toString()));
  const done = new Promise<Record<string, string>>((resolve, reject) => {
    child.on("error", reject);
    child.on("exit", (code) => {
      const last = out.trim().split("\n").pop() ?? "";
      if (code !== 0) reject(new Error(`decider exited with ${code}: ${err}`));
      else resolve(JSON.parse(last) as Record<string, string>);
    });
  });
  return { ready, go: () => child.stdin.end("go\n"), done };
}

describe("decisions from two processes at once", () => {
  it("lets exactly one land per version and tells the other it was already decided", async () => {
    const author = await makeUser("Iris", "author");
    const e1 = await makeUser("Jonas", "editor");
    const e2 = await makeUser("Kaia", "editor");
    const venue = await makeVenueWith("twin-desks", [e1, e2]);
    const slugs: string[] = [];
    const ids: string[] = [];
    for (let i = 0; i < 12; i++) {
      const m = await makeModel(author, venue.id);
      await addSubmitted(author, m, 1);
      slugs.push(m.slug);
      ids.push(m.id);
    }
    const a = startDecider(e1.id, slugs);
    const b = startDecider(e2.id, slugs);
    await Promise.all([a.ready, b.ready]);
    a.go();
    b.go();
    const [ra, rb] = await Promise.all([a.done, b.done]);
    for (const slug of slugs) {
      const outcomes = [ra[slug], rb[slug]];
      expect(outcomes.filter((o) => o === "ok"), `${slug}: ${JSON.stringify(outcomes)}`).toHaveLength(1);
      expect(outcomes.find((o) => o !== "ok")).toBe(`Conflict: ${ALREADY_DECIDED_MESSAGE(1)}`);
    }
    const rows = await db.select().from(decision).where(inArray(decision.modelId, ids));
    expect(rows).toHaveLength(slugs.length);
    const audits = await db.select().from(auditEvent).where(inArray(auditEvent.modelId, ids));
    expect(audits.filter((x) => x.action === "decision.recorded")).toHaveLength(slugs.length);
    // Each decision was written by one of the two editors (runs here split them about evenly; the line below says how).
    const winners = new Set(rows.map((r) => r.editorId));
    console.info(`decisions won: ${rows.filter((r) => r.editorId === e1.id).length} by one process, ${rows.filter((r) => r.editorId === e2.id).length} by the other`);
    expect([...winners].every((w) => w === e1.id || w === e2.id)).toBe(true);
    expect(await db.$count(decision, eq(decision.venueId, venue.id))).toBe(slugs.length);
  }, 120_000);
});
