/**
 * The worker inside the web process: instrumentation.ts calls startInlineWorker() once at
 * server start (unless RESTPOINT_INLINE_WORKER=0, when `npm run worker` processes do the work).
 */
import "server-only";
import { env } from "@/lib/env";
import { sweepTempUploads } from "@/lib/storage";
import { mailAuthor } from "./notify";
import { VerificationWorker, type WorkerOptions } from "./loop";

const slot = globalThis as unknown as { __restpointWorker?: VerificationWorker };

/**
 * Starts the one in-process worker (idempotent: a hot reload does not start a second).
 * Returns null, starting nothing, when RESTPOINT_INLINE_WORKER=0 leaves the work to
 * `npm run worker` processes.
 */
export function startInlineWorker(options: WorkerOptions = {}): VerificationWorker | null {
  if (env.RESTPOINT_INLINE_WORKER === "0") return null;
  if (slot.__restpointWorker === undefined) {
    const worker = new VerificationWorker({ notify: mailAuthor, concurrency: env.RESTPOINT_WORKER_THREADS, ...options });
    worker.start();
    // Uploads cut off by a crash leave temporary files; the server start is a good moment to clear them.
    void sweepTempUploads().catch((e: unknown) => console.warn("[restpoint] could not sweep temporary uploads:", e));
    slot.__restpointWorker = worker;
  }
  return slot.__restpointWorker;
}

/** Wakes the in-process worker after a new job was queued, so it need not wait for its next poll. */
export function pokeWorker(): void {
  slot.__restpointWorker?.poke();
}

/** Stops the in-process worker (see VerificationWorker.stop). */
export async function stopWorker(graceMs?: number): Promise<void> {
  const worker = slot.__restpointWorker;
  slot.__restpointWorker = undefined;
  await worker?.stop(graceMs);
}

export { VerificationWorker, type WorkerOptions } from "./loop";

