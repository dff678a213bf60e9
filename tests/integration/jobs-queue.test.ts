import "./deposit-env";
import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { auditEvent, claimResult, report } from "@/db/schema";
import {
  claimNext,
  completeJob,
  defaultBackoffMs,
  enqueueJob,
  failAbandonedJobs,
  failJob,
  getJob,
  heartbeat,
  isBusyError,
  LEASE_EXPIRED_MESSAGE,
  leaseExpiredTooOftenMessage,
  releaseJob,
  withBusyRetry,
} from "@/lib/jobs";
import { fakeReport, makeUser, makeVersionRow, migrated } from "./deposit-support";

let ownerId = "";

beforeAll(async () => {
  await migrated();
  ownerId = (await makeUser("Queue")).id;
});

/** Claims everything left so each test starts from an empty queue at its own clock. */
async function drain(now: number): Promise<void> {
  while ((await claimNext("drain", 10 ** 12, now)) !== null) {
    /* keep claiming */
  }
}

describe("job queue", () => {
  it("hands a queued job to one worker with a lease, and to nobody else", async () => {
    const t0 = Date.now();
    await drain(t0 + 10 ** 9);
    const { versionId } = await makeVersionRow(ownerId);
    const queued = await enqueueJob(versionId, { now: t0 });
    expect(queued.state).toBe("queued");
    expect(queued.attempts).toBe(0);

    const claimed = await claimNext("worker-a", 30_000, t0 + 10);
    expect(claimed?.id).toBe(queued.id);
    expect(claimed?.state).toBe("running");
    expect(claimed?.attempts).toBe(1);
    expect(claimed?.leaseOwner).toBe("worker-a");
    expect(claimed?.leaseExpiresAt?.getTime()).toBe(t0 + 10 + 30_000);
    expect(await claimNext("worker-b", 30_000, t0 + 20)).toBeNull();
  });

  it("does not hand out a job before its run_after time", async () => {
    const t0 = Date.now() + 10 ** 9;
    await drain(t0 + 10 ** 9);
    const { versionId } = await makeVersionRow(ownerId);
    await enqueueJob(versionId, { now: t0 + 10 ** 9 + 5000 });
    expect(await claimNext("w", 1000, t0 + 10 ** 9 + 4999)).toBeNull();
    expect((await claimNext("w", 1000, t0 + 10 ** 9 + 5000))?.versionId).toBe(versionId);
  });

  it("lets another worker take a job over when the lease expires, and ignores the first worker afterwards", async () => {
    const t0 = Date.now() + 3 * 10 ** 9;
    await drain(t0);
    const { versionId } = await makeVersionRow(ownerId);
    const queued = await enqueueJob(versionId, { now: t0 });
    await claimNext("worker-a", 1000, t0);

    // A heartbeat keeps the lease alive past its first expiry.
    expect(await heartbeat(queued.id, "worker-a", 1000, t0 + 900)).toBe(true);
    expect(await claimNext("worker-b", 1000, t0 + 1500)).toBeNull();

    // Silence after t0 + 1900: expired at t0 + 1901, so worker-b takes it over.
    const taken = await claimNext("worker-b", 1000, t0 + 1901);
    expect(taken?.id).toBe(queued.id);
    expect(taken?.attempts).toBe(2);
    expect(taken?.lastError).toBe(LEASE_EXPIRED_MESSAGE);

    expect(await heartbeat(queued.id, "worker-a", 1000, t0 + 1950)).toBe(false);
    expect(await completeJob(queued.id, "worker-a", fakeReport(), 5, t0 + 1960)).toBe(false);
    expect(await db.select().from(report).where(eq(report.versionId, versionId))).toHaveLength(0);

    const r = fakeReport("contradicted", [
      { id: "a", kind: "rest-point", status: "confirmed", message: "ok", deviation: 1e-9 },
      { id: "b", kind: "ess", status: "contradicted", message: "not stable" },
      { id: "c", kind: "final-state", status: "inconclusive", message: "budget", deviation: Number.POSITIVE_INFINITY },
    ]);
    expect(await completeJob(queued.id, "worker-b", r, 12.4, t0 + 1970)).toBe(true);
    const done = await getJob(queued.id);
    expect(done?.state).toBe("finished");
    expect(done?.leaseOwner).toBeNull();
    expect(done?.finishedAt?.getTime()).toBe(t0 + 1970);

    const stored = await db.select().from(report).where(eq(report.versionId, versionId));
    expect(stored).toHaveLength(1);
    const row = stored[0];
    expect(row?.verdict).toBe("contradicted");
    expect([row?.confirmedCount, row?.contradictedCount, row?.inconclusiveCount]).toEqual([1, 1, 1]);
    expect(row?.durationMs).toBe(12);
    expect(JSON.parse(row?.reportJson ?? "null")).toEqual(JSON.parse(JSON.stringify(r)));
    const claims = await db.select().from(claimResult).where(eq(claimResult.reportId, row?.id ?? ""));
    expect(claims.map((c) => [c.position, c.claimId, c.status, c.deviation])).toEqual([
      [0, "a", "confirmed", 1e-9],
      [1, "b", "contradicted", null],
      [2, "c", "inconclusive", null],
    ]);
    // A finished job is never handed out again.
    expect(await claimNext("worker-c", 1000, t0 + 10 ** 6)).toBeNull();
  });

  it("retries a failed attempt after a back-off and marks the job failed after three, keeping the error", async () => {
    const t0 = Date.now() + 5 * 10 ** 9;
    await drain(t0);
    const { versionId } = await makeVersionRow(ownerId);
    const queued = await enqueueJob(versionId, { now: t0 });
    let t = t0;
    for (let attempt = 1; attempt <= 3; attempt++) {
      const claimed = await claimNext("w", 60_000, t);
      expect(claimed?.id).toBe(queued.id);
      expect(claimed?.attempts).toBe(attempt);
      const outcome = await failJob(queued.id, "w", `engine crashed (${attempt})`, { now: t + 1 });
      expect(outcome).toBe(attempt < 3 ? "retry" : "failed");
      const row = await getJob(queued.id);
      expect(row?.lastError).toBe(`engine crashed (${attempt})`);
      if (attempt < 3) {
        expect(row?.state).toBe("queued");
        expect(row?.runAfter.getTime()).toBe(t + 1 + defaultBackoffMs(attempt));
        // Not before the back-off has passed.
        expect(await claimNext("w", 60_000, t + defaultBackoffMs(attempt))).toBeNull();
        t = t + 1 + defaultBackoffMs(attempt);
      }
    }
    const failed = await getJob(queued.id);
    expect(failed?.state).toBe("failed");
    expect(failed?.attempts).toBe(3);
    expect(failed?.finishedAt).not.toBeNull();
    expect(await claimNext("w", 60_000, t + 10 ** 8)).toBeNull();
    const audit = await db.select().from(auditEvent).where(eq(auditEvent.versionId, versionId));
    expect(audit.map((a) => a.action)).toEqual(["job.failed"]);
    expect(JSON.parse(audit[0]?.detail ?? "{}")).toMatchObject({ jobId: queued.id, attempts: 3, reason: "engine crashed (3)" });
    // The audit trail refuses edits.
    await expect(db.update(auditEvent).set({ action: "x" }).where(eq(auditEvent.versionId, versionId))).rejects.toMatchObject({
      cause: { message: expect.stringMatching(/audit_event is append-only/) },
    });
    await expect(db.delete(auditEvent).where(eq(auditEvent.versionId, versionId))).rejects.toMatchObject({
      cause: { message: expect.stringMatching(/audit_event is append-only/) },
    });
  });

  it("uses the back-off in the defaults: 2 s then 8 s", () => {
    expect([defaultBackoffMs(1), defaultBackoffMs(2)]).toEqual([2000, 8000]);
  });

  it("fails a job whose worker died on every allowed attempt", async () => {
    const t0 = Date.now() + 7 * 10 ** 9;
    await drain(t0);
    const { versionId } = await makeVersionRow(ownerId);
    const queued = await enqueueJob(versionId, { now: t0 });
    for (let i = 0; i < 3; i++) expect((await claimNext(`w${i}`, 100, t0 + i * 1000))?.attempts).toBe(i + 1);
    // Third lease expired at t0 + 2100, no attempts left: not claimable, and the reaper fails it.
    expect(await claimNext("w3", 100, t0 + 5000)).toBeNull();
    const failed = await failAbandonedJobs(t0 + 5000);
    expect(failed.map((j) => j.id)).toEqual([queued.id]);
    const row = await getJob(queued.id);
    expect(row?.state).toBe("failed");
    expect(row?.lastError).toBe(leaseExpiredTooOftenMessage(3));
    expect(row?.lastError).toBe("The verification was started 3 times and its worker stopped answering each time; it was not retried again.");
    expect(await failAbandonedJobs(t0 + 6000)).toEqual([]);
  });

  it("gives a job back without counting the attempt when a worker shuts down cleanly", async () => {
    const t0 = Date.now() + 9 * 10 ** 9;
    await drain(t0);
    const { versionId } = await makeVersionRow(ownerId);
    const queued = await enqueueJob(versionId, { now: t0 });
    await claimNext("w", 60_000, t0);
    expect(await releaseJob(queued.id, "other", t0 + 1)).toBe(false);
    expect(await releaseJob(queued.id, "w", t0 + 1)).toBe(true);
    const row = await getJob(queued.id);
    expect(row?.state).toBe("queued");
    expect(row?.attempts).toBe(0);
    expect((await claimNext("w2", 60_000, t0 + 2))?.id).toBe(queued.id);
    expect(await failJob(queued.id, "w", "not mine")).toBe("lost");
  });
});

describe("waiting out a locked database", () => {
  const busy = () => Object.assign(new Error("SQLITE_BUSY: database is locked"), { code: "SQLITE_BUSY" });

  it("recognises SQLITE_BUSY anywhere in the cause chain", () => {
    expect(isBusyError(busy())).toBe(true);
    expect(isBusyError(new Error("Failed query: update job ...", { cause: busy() }))).toBe(true);
    expect(isBusyError(new Error("UNIQUE constraint failed"))).toBe(false);
    expect(isBusyError("database is locked")).toBe(false);
  });

  it("retries a busy operation until it goes through, but not other errors, and gives up after 8 tries", async () => {
    let calls = 0;
    expect(
      await withBusyRetry(async () => {
        calls += 1;
        if (calls < 3) throw busy();
        return "done";
      }),
    ).toBe("done");
    expect(calls).toBe(3);

    calls = 0;
    await expect(
      withBusyRetry(async () => {
        calls += 1;
        throw new Error("no such table: job");
      }),
    ).rejects.toThrow("no such table: job");
    expect(calls).toBe(1);

    calls = 0;
    await expect(
      withBusyRetry(async () => {
        calls += 1;
        throw busy();
      }),
    ).rejects.toThrow("database is locked");
    expect(calls).toBe(8);
  }, 30_000);
});
