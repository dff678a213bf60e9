/** Job status as the app shows it (timestamps as ISO strings, the same on server and client). */
import type { job, JobState } from "@/db/schema";

export type { JobState };

export interface JobStatus {
  id: string;
  versionId: string;
  state: JobState;
  attempts: number;
  maxAttempts: number;
  /** The last failure's sentence (kept after a retry succeeds, shown when the job failed). */
  lastError: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  /** When a queued job becomes claimable again (after a failed attempt's back-off). */
  runAfter: string;
}

/** A row of the job table as Drizzle reads it. */
export type JobRow = typeof job.$inferSelect;

export function toJobStatus(row: JobRow): JobStatus {
  return {
    id: row.id,
    versionId: row.versionId,
    state: row.state,
    attempts: row.attempts,
    maxAttempts: row.maxAttempts,
    lastError: row.lastError,
    createdAt: row.createdAt.toISOString(),
    startedAt: row.startedAt?.toISOString() ?? null,
    finishedAt: row.finishedAt?.toISOString() ?? null,
    runAfter: row.runAfter.toISOString(),
  };
}
