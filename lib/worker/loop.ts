/**
 * The verification worker: claims jobs from the durable queue, runs each through a runner (by
 * default the engine thread pool), keeps the lease alive while it runs, stores the report or
 * records the failure, and tells the author. Several of these may run in several processes
 * against one database; the queue makes sure each job has one holder at a time.
 */
import "server-only";
import os from "node:os";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { version } from "@/db/schema";
import type { Report } from "@/lib/engine/types";
import { claimNext, completeJob, failAbandonedJobs, failJob, heartbeat, releaseJob, type JobRow } from "@/lib/jobs";
import { EnginePool } from "./pool";

/** Runs one job's spec and returns the engine's report (throws to fail the attempt). */
export type Runner = (input: { job: JobRow; specText: string }) => Promise<Report>;

/** Called after a job reached an end state: finished (with its report) or failed (with its error). */
export type Notifier = (event: { job: JobRow; outcome: "finished"; report: Report } | { job: JobRow; outcome: "failed"; error: string }) => Promise<void>;

export interface WorkerOptions {
  /** Identifies the lease holder; default host:pid:random. */
  workerId?: string;
  /** Jobs run at the same time (and threads in the default pool). Default 1. */
  concurrency?: number;
  /** Lease length; a heartbeat renews it every leaseMs / 3. Default 60 s. */
  leaseMs?: number;
  /** Wait between looks at an empty queue. Default 1 s. */
  pollMs?: number;
  /** Hard wall-clock limit of one run (the engine's own budget is 10 s). Default 120 s. */
  runTimeoutMs?: number;
  /** Default: the engine in a worker_threads pool of `concurrency` threads. */
  runner?: Runner;
  notify?: Notifier;
  /** Task module for the default pool's threads (tests swap in their own); default the engine. */
  taskModule?: string;
  /** Crash-recovery tests only: each engine run first sleeps this long (see EngineTask.holdMs). */
  holdMs?: number;
  log?: (line: string) => void;
}

export function defaultWorkerId(): string {
  return `${os.hostname()}:${process.pid}:${crypto.randomUUID().slice(0, 8)}`;
}

export class VerificationWorker {
  readonly workerId: string;
  private readonly concurrency: number;
  private readonly leaseMs: number;
  private readonly pollMs: number;
  private readonly runTimeoutMs: number;
  private readonly runner: Runner;
  private readonly notify: Notifier | undefined;
  private readonly log: (line: string) => void;
  private readonly pool: EnginePool | null;
  private readonly active = new Map<string, Promise<void>>();
  private running = false;
  private loopDone: Promise<void> | null = null;
  private wake: (() => void) | null = null;

  constructor(options: WorkerOptions = {}) {
    this.workerId = options.workerId ?? defaultWorkerId();
    this.concurrency = Math.max(1, options.concurrency ?? 1);
    this.leaseMs = options.leaseMs ?? 60_000;
    this.pollMs = options.pollMs ?? 1000;
    this.runTimeoutMs = options.runTimeoutMs ?? 120_000;
    this.notify = options.notify;
    this.log = options.log ?? ((line) => console.log(`[restpoint worker ${this.workerId}] ${line}`));
    if (options.runner !== undefined) {
      this.runner = options.runner;
      this.pool = null;
    } else {
      // Background work: the engine threads yield the CPU to the web server's requests.
      const pool = new EnginePool({ size: this.concurrency, taskModule: options.taskModule, niceness: 10 });
      const holdMs = options.holdMs;
      this.pool = pool;
      this.runner = ({ specText }) => pool.run<Report>({ specText, holdMs }, this.runTimeoutMs + (holdMs ?? 0));
    }
  }

  start(): void {
    if (this.running) return;
    this.running = true;
    this.loopDone = this.loop();
  }

  /** Nudges an idle loop to look at the queue now (after an upload, say). */
  poke(): void {
    this.wake?.();
  }

  /**
   * Stops claiming; waits up to `graceMs` for running jobs, then gives back those still running
   * (queued again at once, the attempt not counted) and stops the threads.
   */
  async stop(graceMs = 10_000): Promise<void> {
    if (!this.running) return;
    this.running = false;
    this.wake?.();
    await this.loopDone;
    const inFlight = [...this.active.keys()];
    const settled = Promise.all(this.active.values()).then(() => true);
    const timedOut = new Promise<boolean>((resolve) => setTimeout(() => resolve(false), graceMs).unref());
    if (!(await Promise.race([settled, timedOut]))) {
      for (const jobId of inFlight) {
        if (this.active.has(jobId) && (await releaseJob(jobId, this.workerId))) this.log(`gave job ${jobId} back to the queue`);
      }
    }
    await this.pool?.close();
  }

  /** Waits `ms`, or until `alsoUntil` settles, or until poke()/stop() wakes the loop. */
  private async sleep(ms: number, alsoUntil?: Promise<unknown>): Promise<void> {
    await new Promise<void>((resolve) => {
      const timer = setTimeout(resolve, ms);
      const done = () => {
        clearTimeout(timer);
        resolve();
      };
      this.wake = done;
      alsoUntil?.then(done, done);
    });
    this.wake = null;
  }

  private async loop(): Promise<void> {
    while (this.running) {
      try {
        if (this.active.size >= this.concurrency) {
          await this.sleep(this.leaseMs, Promise.race(this.active.values()));
          continue;
        }
        for (const failed of await failAbandonedJobs()) {
          await this.tell({ job: failed, outcome: "failed", error: failed.lastError ?? "" });
        }
        const claimed = await claimNext(this.workerId, this.leaseMs);
        if (claimed === null) {
          await this.sleep(this.pollMs);
          continue;
        }
        const work = this.process(claimed).finally(() => this.active.delete(claimed.id));
        this.active.set(claimed.id, work);
      } catch (e) {
        // A database hiccup (locked, restarting server) must not end the loop.
        this.log(`queue error: ${e instanceof Error ? e.message : String(e)}`);
        await this.sleep(this.pollMs);
      }
    }
  }

  private async process(claimed: JobRow): Promise<void> {
    const started = performance.now();
    let lost = false;
    const beat = setInterval(() => {
      heartbeat(claimed.id, this.workerId, this.leaseMs)
        .then((held) => {
          if (!held) lost = true;
        })
        .catch((e: unknown) => this.log(`heartbeat failed for job ${claimed.id}: ${e instanceof Error ? e.message : String(e)}`));
    }, Math.max(50, Math.floor(this.leaseMs / 3)));
    try {
      const rows = await db.select({ specText: version.specText }).from(version).where(eq(version.id, claimed.versionId));
      const specText = rows[0]?.specText;
      if (specText === undefined) throw new Error("The version to verify no longer exists.");
      this.log(`job ${claimed.id} attempt ${claimed.attempts}: running`);
      const report = await this.runner({ job: claimed, specText });
      clearInterval(beat);
      if (lost || !(await completeJob(claimed.id, this.workerId, report, performance.now() - started))) {
        this.log(`job ${claimed.id}: lease lost to another worker, result dropped`);
        return;
      }
      this.log(`job ${claimed.id}: ${report.verdict}`);
      await this.tell({ job: claimed, outcome: "finished", report });
    } catch (e) {
      clearInterval(beat);
      if (!this.running) {
        // Interrupted by a shutdown (the pool closing): give the job back rather than count a failure.
        await releaseJob(claimed.id, this.workerId);
        return;
      }
      const message = e instanceof Error ? e.message : String(e);
      const outcome = await failJob(claimed.id, this.workerId, message);
      this.log(`job ${claimed.id} attempt ${claimed.attempts}: ${message} (${outcome})`);
      if (outcome === "failed") await this.tell({ job: claimed, outcome: "failed", error: message });
    }
  }

  private async tell(event: Parameters<Notifier>[0]): Promise<void> {
    if (this.notify === undefined) return;
    try {
      await this.notify(event);
    } catch (e) {
      // The result is stored; a mail that cannot go out is logged, not retried as a job.
      this.log(`could not notify about job ${event.job.id}: ${e instanceof Error ? e.message : String(e)}`);
    }
  }
}
