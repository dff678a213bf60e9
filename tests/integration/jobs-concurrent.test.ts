import "./deposit-env";
import { spawn, type ChildProcess } from "node:child_process";
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

/** Enqueues `count` jobs, lets `workerIds` claim them all at once, and returns what each got. */
async function claimRound(count: number, workerIds: string[]): Promise<{ jobIds: string[]; results: { ids: string[] }[] }> {
  const owner = await makeUser("Concurrent");
  const jobIds: string[] = [];
  for (let i = 0; i < count; i++) {
    const { versionId } = await makeVersionRow(owner.id);
    jobIds.push((await enqueueJob(versionId)).id);
  }
  const claimers = workerIds.map(startClaimer);
  await Promise.all(claimers.map((c) => c.ready));
  for (const c of claimers) c.go();
  const results = (await Promise.all(claimers.map((c) => c.done))).map((ids) => ({ ids }));
  return { jobIds, results };
}

/** A process that keeps one core busy, so the claimers are preempted while they hold the write lock. */
function startCpuBurner(): ChildProcess {
  return spawn(process.execPath, ["-e", "for (;;) {}"], { stdio: "ignore" });
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

  // Under load a claimer meets SQLITE_BUSY now and then; its retried claim must still be the
  // only one (db/client.ts: a connection is not reused after a busy statement).
  it("still hands each job to exactly one of five worker processes while other processes load the CPU", async () => {
    const burners = [startCpuBurner(), startCpuBurner()];
    try {
      for (let round = 0; round < 2; round++) {
        const { jobIds, results } = await claimRound(100, ["q1", "q2", "q3", "q4", "q5"].map((w) => `${w}-r${round}`));
        const all = results.flatMap((r) => r.ids);
        expect(new Set(all).size).toBe(all.length);
        expect([...all].sort()).toEqual([...jobIds].sort());
        for (const id of jobIds) {
          const row = await getJob(id);
          expect(row?.state).toBe("running");
          expect(row?.attempts).toBe(1);
          expect(row?.leaseOwner).toMatch(new RegExp(`-r${round}$`));
        }
      }
    } finally {
      for (const b of burners) b.kill();
    }
  }, 240_000);
});
