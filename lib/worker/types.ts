/** What the main thread sends an engine thread, and what comes back. */
import type { BudgetLimits } from "@/lib/engine/budget";

export interface EngineTask {
  specText: string;
  budget?: BudgetLimits;
  /**
   * Testing crash recovery only: the thread sleeps this long before running, so a test can
   * kill the process mid-run. Set from `npm run worker -- --hold-ms N`, never by the app.
   */
  holdMs?: number;
}

export type ThreadMessage =
  | { ready: true }
  | { id: number; ok: true; result: unknown }
  | { id: number; ok: false; error: string };
