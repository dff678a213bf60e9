/**
 * The stateless check API's own engine thread: a small EnginePool (lib/worker/pool.ts) apart
 * from the job worker's, so a reader's re-run never waits behind a long registered
 * verification, and the request path never runs the engine on the event loop. Work is bounded
 * three ways: a short engine budget, a thread timeout, and a cap on waiting requests (past it
 * the API says "busy" at once instead of queueing without end).
 */
import "server-only";
import type { Report } from "@/lib/engine/types";
import { AppError } from "@/lib/errors";
import { EnginePool, EngineTimeout } from "@/lib/worker/pool";

/** Largest spec body the check API reads: the engine's own limit of 1 MB (1 000 000 bytes). */
export { MAX_INPUT_BYTES as CHECK_MAX_BYTES } from "@/lib/engine/validate";

/** The engine's own budget for one check: inside it, slow claims come back inconclusive. */
export const CHECK_BUDGET = { wallClockMs: 4_000, maxSteps: 500_000 } as const;
/** Past this the thread is stopped (covers thread start-up plus the budget). */
export const CHECK_TIMEOUT_MS = 8_000;
export const CHECK_THREADS = 1;
/** Requests allowed to wait for a thread; more get 503 at once. */
export const CHECK_MAX_WAITING = 6;

/** The check could not be run now (all threads busy, or the run overran its time). */
export class CheckUnavailable extends AppError {
  readonly code: "check_busy" | "check_timeout";
  readonly status = 503;
  readonly retryAfterSeconds: number;
  constructor(kind: "busy" | "timeout") {
    super(
      kind === "busy"
        ? "The re-run service is busy with other readers' runs. Try again in a few seconds."
        : `The re-run took longer than the ${CHECK_TIMEOUT_MS / 1000} s allowed here and was stopped. Try a shorter duration or fewer samples.`,
    );
    this.name = "CheckUnavailable";
    this.code = kind === "busy" ? "check_busy" : "check_timeout";
    this.retryAfterSeconds = kind === "busy" ? 2 : 10;
  }
}

interface CheckState {
  pool: EnginePool | null;
  inFlight: number;
}

const globalForCheck = globalThis as unknown as { __restpointCheck?: CheckState };

function state(): CheckState {
  globalForCheck.__restpointCheck ??= { pool: null, inFlight: 0 };
  return globalForCheck.__restpointCheck;
}

/** Verifies a spec text on a check thread with the check budget. */
export async function runCheck(specText: string): Promise<Report> {
  const s = state();
  if (s.inFlight >= CHECK_THREADS + CHECK_MAX_WAITING) throw new CheckUnavailable("busy");
  s.pool ??= new EnginePool({ size: CHECK_THREADS });
  s.inFlight += 1;
  try {
    return await s.pool.run<Report>({ specText, budget: CHECK_BUDGET }, CHECK_TIMEOUT_MS);
  } catch (e) {
    if (e instanceof EngineTimeout) throw new CheckUnavailable("timeout");
    throw e;
  } finally {
    s.inFlight -= 1;
  }
}

/** Stops the check threads (tests, shutdown). */
export async function closeCheckPool(): Promise<void> {
  const s = state();
  const pool = s.pool;
  s.pool = null;
  await pool?.close();
}
