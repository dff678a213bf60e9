/** A version's verification state as icon + word: waiting, running, failed, or its verdict. */
import type { Verdict } from "@/lib/engine/types";
import type { JobStatus } from "@/lib/types/jobs";
import { StatusMark } from "@/components/report/StatusMark";

export function isPending(job: JobStatus | null, verdict: Verdict | null): boolean {
  return verdict === null && job !== null && (job.state === "queued" || job.state === "running");
}

function Spinner() {
  return (
    <svg viewBox="0 0 16 16" className="size-4 animate-spin motion-reduce:animate-none" fill="none" stroke="currentColor" strokeWidth="1.8" aria-hidden="true">
      <path d="M8 1.5a6.5 6.5 0 1 1-6.5 6.5" strokeLinecap="round" />
    </svg>
  );
}

export function JobState({ job, verdict }: { job: JobStatus | null; verdict: Verdict | null }) {
  if (verdict !== null) return <StatusMark outcome={verdict} />;
  if (job === null) return <span className="text-ink-faint">Not queued</span>;
  switch (job.state) {
    case "queued":
      return (
        <span className="inline-flex items-center gap-1.5 text-ink-soft" data-job-state="queued">
          <svg viewBox="0 0 16 16" className="size-4" fill="none" stroke="currentColor" strokeWidth="1.6" aria-hidden="true">
            <circle cx="8" cy="8" r="6.4" />
            <path d="M8 4.5V8l2.4 1.6" strokeLinecap="round" />
          </svg>
          {job.attempts > 0 ? `Queued again (attempt ${job.attempts + 1} of ${job.maxAttempts})` : "Queued"}
        </span>
      );
    case "running":
      return (
        <span className="inline-flex items-center gap-1.5 text-tide" data-job-state="running">
          <Spinner />
          Running{job.attempts > 1 ? ` (attempt ${job.attempts} of ${job.maxAttempts})` : ""}
        </span>
      );
    case "failed":
      return (
        <span className="inline-flex flex-col text-danger" data-job-state="failed">
          <span className="inline-flex items-center gap-1.5 font-medium">
            <svg viewBox="0 0 16 16" className="size-4" fill="none" stroke="currentColor" strokeWidth="1.8" aria-hidden="true">
              <circle cx="8" cy="8" r="6.4" />
              <path d="M5.5 5.5l5 5" />
            </svg>
            Verification failed after {job.attempts} {job.attempts === 1 ? "attempt" : "attempts"}
          </span>
          {job.lastError !== null && <span className="text-xs">{job.lastError}</span>}
        </span>
      );
    case "finished":
      // Finished but no report row yet: the next poll will show the verdict.
      return <span className="text-ink-soft" data-job-state="finished">Finished</span>;
  }
}
