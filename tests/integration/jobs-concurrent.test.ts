import "./deposit-env";
import { spawn } from "node:child_process";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { enqueueJob, getJob } from "@/lib/jobs";
import { makeUser, makeVersionRow, migrated } from "./deposit-support";

beforeAll(async () => {
  await migrated();
});

interface Claimer {
  ready: Promise<void>;
  go: () => void;
  done: Promise<string[]>;
}

function startClaimer(workerId: string): Claimer {
  const child = spawn(
    process.execPath,
    ["--conditions=react-server", "--import", "tsx", path.join(import.meta.dirname, "jobs-claimer.ts"), workerId],
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
  const done = new Promise<string[]>((resolve, reject) => {
    child.on("error", reject);
    child.on("exit", (code) => {
      const last = out.trim().split("\n").pop() ?? "";
      if (code !== 0) reject(new Error(`claimer ${workerId} exited with ${code}: ${err}`));
      else resolve(JSON.parse(last) as string[]);
    });
  });
  return { ready, go: () => child.stdin.end("go\n"), done };
}

describe("claiming from several processes", () => {
  it("hands each job to exactly one of three concurrent worker processes", async () => {
    const owner = await makeUser("Concurrent");
    const jobIds: string[] = [];
    for (let i = 0; i < 150; i++) {
      const { versionId } = await makeVersionRow(owner.id);
      jobIds.push((await enqueueJob(versionId)).id);
    }
    // Start all three, wait until each is connected, then let them loose at once.
    const claimers = ["p1", "p2", "p3"].map(startClaimer);
    await Promise.all(claimers.map((c) => c.ready));
    for (const c of claimers) c.go();
    const results = (await Promise.all(claimers.map((c) => c.done))).map((ids) => ({ ids }));
    const all = results.flatMap((r) => r.ids);
    expect(new Set(all).size).toBe(all.length);
    expect([...all].sort()).toEqual([...jobIds].sort());
    for (const id of jobIds) {
      const row = await getJob(id);
      expect(row?.state).toBe("running");
      expect(row?.attempts).toBe(1);
    }
    // At least two processes got work, so the claims really interleaved.
    expect(results.filter((r) => r.ids.length > 0).length).toBeGreaterThanOrEqual(2);
  }, 120_000);
});
