/**
 * The worker inside the web process: instrumentation.ts calls startInlineWorker() once at
 * server start (unless RESTPOINT_INLINE_WORKER=0, when `npm run worker` processes do the work).
 */
import "server-only";
import type { Report } from "@/lib/engine/types";
import { env } from "@/lib/env";
import { RateLimited } from "@/lib/errors";
import { EnginePool } from "./pool";
import { mailAuthor } from "./notify";
import { VerificationWorker, type WorkerOptions } from "./loop";

const slot = globalThis as unknown as { __restpointWorker?: VerificationWorker; __restpointCheckPool?: EnginePool };

/**
 * Starts the one in-process worker (idempotent: a hot reload does not start a second).
 * Returns null, starting nothing, when RESTPOINT_INLINE_WORKER=0 leaves the work to
 * `npm run worker` processes.
 */
export function startInlineWorker(options: WorkerOptions = {}): VerificationWorker | null {
  if (env.RESTPOINT_INLINE_WORKER === "0") return null;
  if (slot.__restpointWorker === undefined) {
    const worker = new VerificationWorker({ notify: mailAuthor, ...options });
    worker.start();
    slot.__restpointWorker = worker;
  }
  return slot.__restpointWorker;
}

/** Wakes the in-process worker after a new job was queued, so it need not wait for its next poll. */
export function pokeWorker(): void {
  slot.__restpointWorker?.poke();
}

/** Stops the in-process worker (see VerificationWorker.stop) and the check thread. */
export async function stopWorker(graceMs?: number): Promise<void> {
  const worker = slot.__restpointWorker;
  const checks = slot.__restpointCheckPool;
  slot.__restpointWorker = undefined;
  slot.__restpointCheckPool = undefined;
  await worker?.stop(graceMs);
  await checks?.close();
}

export { VerificationWorker, type WorkerOptions } from "./loop";

/** Engine budget of a stateless check (POST /api/v1/check): shorter than a deposited version's. */
export const CHECK_BUDGET_MS = 5000;
/** Checks waiting or running at once before new ones are turned away. */
export const CHECK_BACKLOG_LIMIT = 4;

/**
 * Verifies spec text without storing anything, on a thread of its own (one, apart from the
 * job worker's, so checks never wait behind deposited versions and never block the server).
 * Throws RateLimited when CHECK_BACKLOG_LIMIT checks are already in hand.
 */
export async function verifyDetached(specText: string, pool?: EnginePool): Promise<Report> {
  const p = pool ?? (slot.__restpointCheckPool ??= new EnginePool({ size: 1 }));
  if (p.backlog >= CHECK_BACKLOG_LIMIT) throw new RateLimited(5, "The checker is busy with other specs; try again in a few seconds.");
  return p.run<Report>({ specText, budget: { wallClockMs: CHECK_BUDGET_MS } }, CHECK_BUDGET_MS + 15_000);
}
