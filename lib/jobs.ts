/**
 * The durable verification queue on the `job` table. Several worker processes may share one
 * libSQL database: a job is handed to exactly one of them by a single UPDATE (claimNext), and
 * the holder keeps a lease that it extends while it works (heartbeat). A worker that dies leaves
 * its lease to expire, after which another worker claims the job again.
 *
 * `attempts` counts claims, so a job whose worker keeps dying (a spec that crashes the process)
 * stops after `maxAttempts` like one whose runs throw.
 */
import "server-only";
import { and, asc, desc, eq, lt, or, sql, gte, lte } from "drizzle-orm";
import { db, isBusyError } from "@/db/client";
import { job, version } from "@/db/schema";
import type { Report } from "@/lib/engine/types";
import { recordAudit, type Executor } from "@/lib/audit";
import { NotFound } from "@/lib/errors";
import { loadVisibleVersion } from "@/lib/models";
import { publicContentChanged } from "@/lib/public-cache";
import { storeReport } from "@/lib/reports";
import type { Viewer } from "@/lib/types/deposit";
import { toJobStatus, type JobRow, type JobStatus } from "@/lib/types/jobs";

export { toJobStatus, type JobRow, type JobStatus } from "@/lib/types/jobs";
export { isBusyError } from "@/db/client";

export const DEFAULT_MAX_ATTEMPTS = 3;

/**
 * Runs `fn` again (up to 8 times, waiting 20 ms, 40 ms, ... up to 1 s) when SQLite answers
 * SQLITE_BUSY: another process, or another connection of this one, holds the write lock for a
 * moment. Waiting asynchronously lets this process's own open transaction finish meanwhile.
 * Running `fn` again is safe: a write that met SQLITE_BUSY changed nothing (in WAL mode the
 * write lock comes before the first change, and COMMIT does not wait for readers), and the
 * retry runs on a connection the busy statement never touched (db/client.ts).
 */
export async function withBusyRetry<T>(fn: () => Promise<T>): Promise<T> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await fn();
    } catch (e) {
      if (attempt >= 7 || !isBusyError(e)) throw e;
      const wait = Math.min(1000, 20 * 2 ** attempt) * (0.5 + Math.random());
      await new Promise((resolve) => setTimeout(resolve, wait));
    }
  }
}

/** Sentence kept as lastError when a job is taken over from a worker whose lease ran out. */
export const LEASE_EXPIRED_MESSAGE =
  "The previous attempt stopped without finishing (its worker stopped answering), so the run was started again.";

export function leaseExpiredTooOftenMessage(attempts: number): string {
  return `The verification was started ${attempts} times and its worker stopped answering each time; it was not retried again.`;
}

/** Back-off before the next attempt after a failed one: 2 s, then 8 s (common practice: exponential). */
export function defaultBackoffMs(attempts: number): number {
  return 2000 * 4 ** Math.max(0, attempts - 1);
}

/** Queues a verification of `versionId`; pass the caller's transaction to commit both together. */
export async function enqueueJob(
  versionId: string,
  options: { exec?: Executor; maxAttempts?: number; now?: number } = {},
): Promise<JobRow> {
  const exec = options.exec ?? db;
  const now = new Date(options.now ?? Date.now());
  const rows = await exec
    .insert(job)
    .values({
      versionId,
      maxAttempts: options.maxAttempts ?? DEFAULT_MAX_ATTEMPTS,
      runAfter: now,
      createdAt: now,
      updatedAt: now,
    })
    .returning();
  const row = rows[0];
  if (row === undefined) throw new Error("enqueueJob: the insert returned no row");
  return row;
}

/**
 * Marks as failed every job whose lease expired after its last allowed attempt (its worker
 * died each time). Returns those jobs so the caller can tell their authors.
 */
async function failAbandonedJobsOnce(now: number = Date.now()): Promise<JobRow[]> {
  const at = new Date(now);
  const abandoned = and(eq(job.state, "running"), lt(job.leaseExpiresAt, at), gte(job.attempts, job.maxAttempts));
  const candidates = await db.select().from(job).where(abandoned);
  const failed: JobRow[] = [];
  for (const candidate of candidates) {
    // The guard is repeated so a job another process failed or finished meanwhile is left alone.
    const rows = await db
      .update(job)
      .set({
        state: "failed",
        lastError: leaseExpiredTooOftenMessage(candidate.attempts),
        leaseOwner: null,
        leaseExpiresAt: null,
        finishedAt: at,
        updatedAt: at,
      })
      .where(and(eq(job.id, candidate.id), abandoned))
      .returning();
    const row = rows[0];
    if (row === undefined) continue;
    failed.push(row);
    await recordAudit({
      actorId: null,
      action: "job.failed",
      versionId: row.versionId,
      detail: { jobId: row.id, attempts: row.attempts, reason: "lease expired" },
    });
  }
  return failed;
}

/**
 * Hands the oldest claimable job to `workerId` with a lease of `leaseMs`, or returns null.
 * Claimable: queued and due (run_after <= now), or running under an expired lease with
 * attempts left. One UPDATE ... WHERE id = (SELECT ...) RETURNING: SQLite runs it under the
 * database's write lock, so two processes can never both get the same job. The row comes back
 * only once the statement has committed (the driver steps it to the end before returning), so
 * a returned job is durably this worker's; this holds because db/client.ts never runs it on a
 * connection where an earlier busy statement was left active (see BusyResetClient).
 */
async function claimNextOnce(workerId: string, leaseMs: number, now: number = Date.now()): Promise<JobRow | null> {
  const at = new Date(now);
  const claimable = or(
    and(eq(job.state, "queued"), lte(job.runAfter, at)),
    and(eq(job.state, "running"), lt(job.leaseExpiresAt, at), lt(job.attempts, job.maxAttempts)),
  );
  const next = db.select({ id: job.id }).from(job).where(claimable).orderBy(asc(job.runAfter), asc(job.createdAt), asc(job.id)).limit(1);
  const rows = await db
    .update(job)
    .set({
      state: "running",
      attempts: sql`${job.attempts} + 1`,
      leaseOwner: workerId,
      leaseExpiresAt: new Date(now + leaseMs),
      // A take-over says why the run started again; a fresh claim keeps what a failed attempt said.
      lastError: sql`CASE WHEN ${job.state} = 'running' THEN ${LEASE_EXPIRED_MESSAGE} ELSE ${job.lastError} END`,
      startedAt: at,
      updatedAt: at,
    })
    .where(and(sql`${job.id} = (${next})`, claimable))
    .returning();
  return rows[0] ?? null;
}

/** Extends the lease; false when `workerId` no longer holds the job (it expired and was taken over). */
async function heartbeatOnce(jobId: string, workerId: string, leaseMs: number, now: number = Date.now()): Promise<boolean> {
  const rows = await db
    .update(job)
    .set({ leaseExpiresAt: new Date(now + leaseMs), updatedAt: new Date(now) })
    .where(and(eq(job.id, jobId), eq(job.leaseOwner, workerId), eq(job.state, "running")))
    .returning({ id: job.id });
  return rows.length === 1;
}

/**
 * Stores the report (whole and per claim) and marks the job finished, in one transaction.
 * Returns false, storing nothing, when `workerId` lost the lease meanwhile.
 */
async function completeJobOnce(
  jobId: string,
  workerId: string,
  report: Report,
  durationMs: number,
  now: number = Date.now(),
): Promise<boolean> {
  return db.transaction(async (tx) => {
    const at = new Date(now);
    const rows = await tx
      .update(job)
      .set({ state: "finished", leaseOwner: null, leaseExpiresAt: null, finishedAt: at, updatedAt: at })
      .where(and(eq(job.id, jobId), eq(job.leaseOwner, workerId), eq(job.state, "running")))
      .returning();
    const row = rows[0];
    if (row === undefined) return false;
    await storeReport(tx, row.versionId, report, durationMs);
    return true;
  });
}

export type FailOutcome = "retry" | "failed" | "lost";

/**
 * Records a failed attempt: back to the queue after a back-off while attempts remain, else
 * `failed` with `message` kept as lastError for the author. "lost" when the lease was gone.
 */
async function failJobOnce(
  jobId: string,
  workerId: string,
  message: string,
  options: { now?: number; backoffMs?: (attempts: number) => number } = {},
): Promise<FailOutcome> {
  const now = options.now ?? Date.now();
  const backoff = options.backoffMs ?? defaultBackoffMs;
  return db.transaction(async (tx) => {
    const current = await tx
      .select()
      .from(job)
      .where(and(eq(job.id, jobId), eq(job.leaseOwner, workerId), eq(job.state, "running")));
    const row = current[0];
    if (row === undefined) return "lost";
    const at = new Date(now);
    const final = row.attempts >= row.maxAttempts;
    await tx
      .update(job)
      .set(
        final
          ? { state: "failed", lastError: message, leaseOwner: null, leaseExpiresAt: null, finishedAt: at, updatedAt: at }
          : {
              state: "queued",
              lastError: message,
              leaseOwner: null,
              leaseExpiresAt: null,
              runAfter: new Date(now + backoff(row.attempts)),
              updatedAt: at,
            },
      )
      .where(eq(job.id, jobId));
    if (final) {
      await recordAudit(
        { actorId: null, action: "job.failed", versionId: row.versionId, detail: { jobId, attempts: row.attempts, reason: message } },
        tx,
      );
    }
    return final ? "failed" : "retry";
  });
}

/**
 * Gives a job back untouched (a worker shutting down cleanly before it finished): queued at
 * once, and the claim does not count as an attempt.
 */
async function releaseJobOnce(jobId: string, workerId: string, now: number = Date.now()): Promise<boolean> {
  const rows = await db
    .update(job)
    .set({
      state: "queued",
      attempts: sql`max(${job.attempts} - 1, 0)`,
      leaseOwner: null,
      leaseExpiresAt: null,
      runAfter: new Date(now),
      updatedAt: new Date(now),
    })
    .where(and(eq(job.id, jobId), eq(job.leaseOwner, workerId), eq(job.state, "running")))
    .returning({ id: job.id });
  return rows.length === 1;
}

export async function getJob(jobId: string): Promise<JobRow | null> {
  const rows = await db.select().from(job).where(eq(job.id, jobId));
  return rows[0] ?? null;
}

/** The newest job of a version (a version normally has exactly one). */
export async function latestJobForVersion(versionId: string, exec: Executor = db): Promise<JobRow | null> {
  const rows = await exec.select().from(job).where(eq(job.versionId, versionId)).orderBy(desc(job.createdAt)).limit(1);
  return rows[0] ?? null;
}

/** A job's status for a viewer who may see its version (polling from the workspace or a script); else NotFound. */
export async function getJobStatus(jobId: string, viewer: Viewer): Promise<JobStatus> {
  const row = await getJob(jobId);
  if (row === null) throw new NotFound("job");
  try {
    await loadVisibleVersion(row.versionId, viewer);
  } catch (e) {
    if (e instanceof NotFound) throw new NotFound("job");
    throw e;
  }
  return toJobStatus(row);
}

// ---------------------------------------------------------------------------
// The queue's operations, each retried on SQLITE_BUSY (see withBusyRetry). The *Once
// functions above hold the documentation of what each does.
// ---------------------------------------------------------------------------

/** Fails jobs whose last allowed attempt's lease expired; returns them (see failAbandonedJobsOnce). */
export function failAbandonedJobs(now: number = Date.now()): Promise<JobRow[]> {
  return withBusyRetry(() => failAbandonedJobsOnce(now));
}

/** The oldest claimable job for `workerId` with a lease of `leaseMs`, or null (see claimNextOnce). */
export function claimNext(workerId: string, leaseMs: number, now: number = Date.now()): Promise<JobRow | null> {
  return withBusyRetry(() => claimNextOnce(workerId, leaseMs, now));
}

/** Extends the lease; false when `workerId` lost the job (see heartbeatOnce). */
export function heartbeat(jobId: string, workerId: string, leaseMs: number, now: number = Date.now()): Promise<boolean> {
  return withBusyRetry(() => heartbeatOnce(jobId, workerId, leaseMs, now));
}

/** Stores the report and finishes the job in one transaction; false when the lease was lost (see completeJobOnce). */
export async function completeJob(jobId: string, workerId: string, report: Report, durationMs: number, now: number = Date.now()): Promise<boolean> {
  const done = await withBusyRetry(() => completeJobOnce(jobId, workerId, report, durationMs, now));
  if (done) await reportStored(jobId);
  return done;
}

/** A public page showed the version as pending: revalidate it (skipped outside a request; see lib/public-cache.ts). */
async function reportStored(jobId: string): Promise<void> {
  try {
    const rows = await db.select({ modelId: version.modelId }).from(job).innerJoin(version, eq(job.versionId, version.id)).where(eq(job.id, jobId));
    const modelId = rows[0]?.modelId;
    if (modelId !== undefined) await publicContentChanged(modelId);
  } catch (e) {
    // The report is committed; a page left stale until its revalidate time is not worth failing the job.
    console.error(`revalidating the public pages after job ${jobId} failed:`, e);
  }
}

/** Records a failed attempt: "retry" (queued after a back-off), "failed" (final) or "lost" (see failJobOnce). */
export function failJob(
  jobId: string,
  workerId: string,
  message: string,
  options: { now?: number; backoffMs?: (attempts: number) => number } = {},
): Promise<FailOutcome> {
  return withBusyRetry(() => failJobOnce(jobId, workerId, message, options));
}

/** Gives a job back to the queue without counting the attempt (see releaseJobOnce). */
export function releaseJob(jobId: string, workerId: string, now: number = Date.now()): Promise<boolean> {
  return withBusyRetry(() => releaseJobOnce(jobId, workerId, now));
}
