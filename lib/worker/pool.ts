/**
 * A fixed-size pool of worker_threads that run engine tasks off the main thread, so a long
 * verification never blocks the web server's event loop. Each task has a wall-clock guard: a
 * thread that overruns it is terminated (the only way to stop synchronous numerics) and
 * replaced by a fresh one.
 */
import path from "node:path";
import { Worker } from "node:worker_threads";
import type { EngineTask, ThreadMessage } from "./types";

export class EngineTimeout extends Error {
  constructor(readonly limitMs: number) {
    super(`The verification did not finish within ${Math.round(limitMs / 1000)} s and was stopped.`);
    this.name = "EngineTimeout";
  }
}

export class EngineThreadCrashed extends Error {
  constructor(detail: string) {
    super(`The verification engine stopped unexpectedly: ${detail}`);
    this.name = "EngineThreadCrashed";
  }
}

/** Resolved at run time from the working folder (the app's root) so no bundler rewrites it. */
export function defaultThreadEntry(): string {
  return path.join(process.cwd(), "lib", "worker", "engine-thread.mjs");
}

interface Pending {
  id: number;
  task: EngineTask;
  timeoutMs: number;
  resolve: (value: unknown) => void;
  reject: (error: Error) => void;
}

class Slot {
  private worker: Worker | null = null;
  private ready: Promise<void> | null = null;
  current: { pending: Pending; timer: NodeJS.Timeout } | null = null;

  constructor(
    private readonly entry: string,
    private readonly taskModule: string | undefined,
    private readonly niceness: number,
    private readonly onIdle: () => void,
  ) {}

  private spawn(): Promise<void> {
    // No inherited flags: the entry sets up its own loader, and a parent's flags (an inspector
    // port, --input-type, a loader of the Next server) can break or clash in a thread.
    const worker = new Worker(this.entry, { workerData: { taskModule: this.taskModule, niceness: this.niceness }, execArgv: [] });
    this.worker = worker;
    this.ready = new Promise<void>((resolve, reject) => {
      worker.once("error", reject);
      worker.once("message", (m: ThreadMessage) => {
        worker.off("error", reject);
        if ("ready" in m) resolve();
        else reject(new EngineThreadCrashed("the thread sent a result before it was ready"));
      });
    });
    worker.on("message", (m: ThreadMessage) => {
      if ("ready" in m || this.current === null || m.id !== this.current.pending.id) return;
      const { pending, timer } = this.current;
      clearTimeout(timer);
      this.current = null;
      if (m.ok) pending.resolve(m.result);
      else pending.reject(new Error(m.error));
      this.onIdle();
    });
    worker.on("error", (e) => this.fail(new EngineThreadCrashed(e.message)));
    worker.on("exit", (code) => {
      if (this.worker === worker) {
        this.worker = null;
        this.ready = null;
      }
      this.fail(new EngineThreadCrashed(`exit code ${code}`));
    });
    return this.ready;
  }

  private fail(error: Error): void {
    if (this.current === null) return;
    const { pending, timer } = this.current;
    clearTimeout(timer);
    this.current = null;
    pending.reject(error);
    this.onIdle();
  }

  async start(pending: Pending): Promise<void> {
    const timer = setTimeout(() => {
      const worker = this.worker;
      this.fail(new EngineTimeout(pending.timeoutMs));
      this.worker = null;
      this.ready = null;
      void worker?.terminate();
    }, pending.timeoutMs);
    this.current = { pending, timer };
    try {
      if (this.worker === null || this.ready === null) await this.spawn();
      else await this.ready;
      if (this.current?.pending !== pending) return; // timed out while starting
      this.worker?.postMessage({ id: pending.id, task: pending.task });
    } catch (e) {
      if (this.current?.pending === pending) {
        this.worker = null;
        this.ready = null;
        this.fail(new EngineThreadCrashed(e instanceof Error ? e.message : String(e)));
      }
    }
  }

  async close(): Promise<void> {
    const worker = this.worker;
    this.worker = null;
    this.ready = null;
    this.fail(new EngineThreadCrashed("the pool was closed"));
    await worker?.terminate();
  }
}

export interface EnginePoolOptions {
  /** Number of threads (each runs one task at a time). */
  size: number;
  /** Thread entry file; default lib/worker/engine-thread.mjs under the working folder. */
  entry?: string;
  /** Task module the threads import (tests swap in their own); default the engine task. */
  taskModule?: string;
  /**
   * Nice value each thread gives itself (0 to 19; higher yields more). Background verification
   * uses it so the web server's own thread wins the CPU while jobs run; the readers' check API
   * runs at normal priority because a request waits on it.
   */
  niceness?: number;
}

export class EnginePool {
  private readonly slots: Slot[];
  private readonly queue: Pending[] = [];
  private nextId = 1;
  private closed = false;

  constructor(options: EnginePoolOptions) {
    const entry = options.entry ?? defaultThreadEntry();
    const size = Math.max(1, Math.floor(options.size));
    this.slots = Array.from({ length: size }, () => new Slot(entry, options.taskModule, options.niceness ?? 0, () => this.dispatch()));
  }

  get size(): number {
    return this.slots.length;
  }

  /** Tasks running or waiting for a thread. */
  get backlog(): number {
    return this.queue.length + this.slots.filter((s) => s.current !== null).length;
  }

  /** Runs `task` on a free thread (queued while all are busy); rejects with EngineTimeout past `timeoutMs`. */
  run<T = unknown>(task: EngineTask, timeoutMs: number): Promise<T> {
    if (this.closed) return Promise.reject(new EngineThreadCrashed("the pool was closed"));
    return new Promise<T>((resolve, reject) => {
      this.queue.push({ id: this.nextId++, task, timeoutMs, resolve: (v) => resolve(v as T), reject });
      this.dispatch();
    });
  }

  private dispatch(): void {
    for (const slot of this.slots) {
      if (this.queue.length === 0) return;
      if (slot.current !== null) continue;
      const pending = this.queue.shift();
      if (pending !== undefined) void slot.start(pending);
    }
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const pending of this.queue.splice(0)) pending.reject(new EngineThreadCrashed("the pool was closed"));
    await Promise.all(this.slots.map((s) => s.close()));
  }
}
