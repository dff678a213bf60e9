import "./deposit-env";
import os from "node:os";
import path from "node:path";
import { threadId } from "node:worker_threads";
import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { job, report, version } from "@/db/schema";
import type { Report } from "@/lib/engine/types";
import { enqueueJob, getJob } from "@/lib/jobs";
import { EnginePool, EngineThreadCrashed, EngineTimeout } from "@/lib/worker/pool";
import { VerificationWorker, type Notifier } from "@/lib/worker/loop";
import { verificationFinishedMail, versionPageUrl } from "@/lib/worker/notify";
import { makeUser, makeVersionRow, migrated } from "./deposit-support";

const taskModule = path.join(import.meta.dirname, "jobs-task-fixture.ts");

beforeAll(async () => {
  await migrated();
});

async function until(check: () => Promise<boolean>, timeoutMs = 20_000): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > end) throw new Error("condition not reached in time");
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe("engine thread pool", () => {
  it("runs tasks off the main thread, stops an overrunning one and recovers from a dead thread", async () => {
    const pool = new EnginePool({ size: 1, taskModule });
    try {
      const r = await pool.run<Report>({ specText: "ok" }, 20_000);
      expect(r.engine.version).toMatch(/^fixture-thread-\d+$/);
      expect(r.engine.version).not.toBe(`fixture-thread-${threadId}`);

      await expect(pool.run({ specText: "throw" }, 20_000)).rejects.toThrow("the fixture engine refused this spec");

      const t0 = Date.now();
      const spin = pool.run({ specText: "spin" }, 1500);
      await expect(spin).rejects.toBeInstanceOf(EngineTimeout);
      await expect(spin).rejects.toThrow("The verification did not finish within 2 s and was stopped.");
      expect(Date.now() - t0).toBeLessThan(10_000);

      await expect(pool.run({ specText: "exit" }, 20_000)).rejects.toBeInstanceOf(EngineThreadCrashed);
      await expect(pool.run({ specText: "exit" }, 20_000)).rejects.toThrow("The verification engine stopped unexpectedly: exit code 3");

      // A fresh thread takes over after both the timeout and the crash.
      expect((await pool.run<Report>({ specText: "ok" }, 20_000)).verdict).toBe("confirmed");
    } finally {
      await pool.close();
    }
    await expect(pool.run({ specText: "ok" }, 1000)).rejects.toThrow("the pool was closed");
  }, 60_000);

  // man 2 setpriority (NOTES): on Linux the nice value is a per-thread attribute.
  it.runIf(process.platform === "linux")("lowers the priority of its own threads only when asked to yield", async () => {
    const background = new EnginePool({ size: 1, taskModule, niceness: 10 });
    const foreground = new EnginePool({ size: 1, taskModule });
    try {
      expect((await background.run<Report>({ specText: "nice" }, 20_000)).notes).toEqual(["nice 10"]);
      expect((await foreground.run<Report>({ specText: "nice" }, 20_000)).notes).toEqual([`nice ${os.getPriority(0)}`]);
      // The calling (web server's) thread keeps its priority.
      expect(os.getPriority(0)).toBe(0);
    } finally {
      await Promise.all([background.close(), foreground.close()]);
    }
  }, 60_000);

  it("runs as many tasks at once as it has threads, and queues the rest", async () => {
    const pool = new EnginePool({ size: 2, taskModule });
    try {
      await Promise.all([pool.run({ specText: "ok" }, 20_000), pool.run({ specText: "ok" }, 20_000)]); // warm both
      const reports = await Promise.all([1, 2, 3].map(() => pool.run<Report>({ specText: "sleep:600" }, 20_000)));
      const starts = reports.map((r) => Number((r.notes?.[0] ?? "").replace("started ", ""))).sort((x, y) => x - y);
      const [first = 0, second = 0, third = 0] = starts;
      // Two threads: two sleeps start together, the third waits for a free thread (about 600 ms).
      expect(second - first).toBeLessThan(400);
      expect(third - first).toBeGreaterThanOrEqual(550);
    } finally {
      await pool.close();
    }
  }, 60_000);
});

describe("verification worker loop", () => {
  it("claims queued jobs, stores reports, retries failures and reports the final failure", async () => {
    const owner = await makeUser("Loop");
    const ok = await makeVersionRow(owner.id);
    const bad = await makeVersionRow(owner.id);
    await db.update(version).set({ specText: "throw" }).where(eq(version.id, bad.versionId));
    const okJob = await enqueueJob(ok.versionId);
    const badJob = await enqueueJob(bad.versionId);
    const events: Parameters<Notifier>[0][] = [];
    const worker = new VerificationWorker({
      workerId: "loop-test",
      taskModule,
      leaseMs: 5000,
      pollMs: 50,
      notify: async (e) => {
        events.push(e);
      },
      log: () => {},
    });
    worker.start();
    try {
      await until(async () => (await getJob(okJob.id))?.state === "finished");
      const stored = await db.select().from(report).where(eq(report.versionId, ok.versionId));
      expect(stored[0]?.verdict).toBe("confirmed");
      // Fast-forward the back-off of the failing job twice.
      for (let i = 0; i < 2; i++) {
        await until(async () => (await getJob(badJob.id))?.state === "queued" && (await getJob(badJob.id))?.attempts === i + 1);
        await db.update(job).set({ runAfter: new Date(0) }).where(eq(job.id, badJob.id));
        worker.poke();
      }
      await until(async () => (await getJob(badJob.id))?.state === "failed");
      const failed = await getJob(badJob.id);
      expect(failed?.attempts).toBe(3);
      expect(failed?.lastError).toBe("the fixture engine refused this spec");
      expect(events.map((e) => [e.job.id, e.outcome])).toEqual([
        [okJob.id, "finished"],
        [badJob.id, "failed"],
      ]);
    } finally {
      await worker.stop(1000);
    }
  }, 60_000);

  it("gives a running job back to the queue when stopped before it finishes", async () => {
    const owner = await makeUser("Stop");
    const v = await makeVersionRow(owner.id);
    await db.update(version).set({ specText: "sleep:20000" }).where(eq(version.id, v.versionId));
    const queued = await enqueueJob(v.versionId);
    const worker = new VerificationWorker({ workerId: "stop-test", taskModule, pollMs: 50, log: () => {} });
    worker.start();
    await until(async () => (await getJob(queued.id))?.state === "running");
    await worker.stop(200);
    const row = await getJob(queued.id);
    expect(row?.state).toBe("queued");
    expect(row?.attempts).toBe(0);
    expect(row?.leaseOwner).toBeNull();
  }, 60_000);
});

describe("author mail", () => {
  it("names the verdict and counts, or the final error, with the report link", () => {
    const url = versionPageUrl("rp-abc234", 2);
    expect(url).toBe("http://localhost:3000/workspace/models/rp-abc234/v/2");
    const done = verificationFinishedMail({
      to: "a@example.test",
      name: "Ada",
      modelTitle: "Seals",
      versionNumber: 2,
      url,
      outcome: { verdict: "inconclusive", confirmed: 2, contradicted: 0, inconclusive: 1 },
    });
    expect(done.subject).toBe('Restpoint: version 2 of "Seals" is inconclusive');
    expect(done.text).toBe(
      [
        "Hello Ada,",
        "",
        'The verification of version 2 of "Seals" has finished. Verdict: inconclusive.',
        "No claim was contradicted, but at least one could not be decided.",
        "Claims: 2 confirmed, 0 contradicted, 1 inconclusive.",
        "",
        "The report:",
        url,
        "",
        "Restpoint",
      ].join("\n"),
    );
    const failed = verificationFinishedMail({ to: "a@example.test", name: "Ada", modelTitle: "Seals", versionNumber: 3, url, outcome: { error: "The verification did not finish within 120 s and was stopped." } });
    expect(failed.subject).toBe('Restpoint: the verification of version 3 of "Seals" failed');
    expect(failed.text).toContain('The verification of version 3 of "Seals" failed after its last attempt.\nError: The verification did not finish within 120 s and was stopped.');
  });
});
