"use client";
/**
 * Watches one version's verification from its report endpoint and re-renders the page (which
 * then shows the report) the moment the job finishes; no reload needed.
 */
import { useRouter } from "next/navigation";
import { useEffect, useRef } from "react";
import useSWR from "swr";
import type { JobStatus } from "@/lib/types/jobs";
import { fetchJson } from "./api-client";
import { JobState } from "./JobState";
import { POLL_MS, reportKey } from "./keys";

interface ReportAnswer {
  state: "queued" | "running" | "finished" | "failed";
  job: JobStatus | null;
}

export function VersionStatus({ slug, number, initialJob }: { slug: string; number: number; initialJob: JobStatus | null }) {
  const router = useRouter();
  const { data } = useSWR<ReportAnswer>(reportKey(slug, number), fetchJson, {
    fallbackData: { state: initialJob?.state ?? "queued", job: initialJob },
    refreshInterval: (latest) => (latest === undefined || latest.state === "queued" || latest.state === "running" ? POLL_MS : 0),
  });
  const refreshed = useRef(false);
  useEffect(() => {
    if (data?.state === "finished" && !refreshed.current) {
      refreshed.current = true;
      router.refresh();
    }
  }, [data?.state, router]);

  const job = data?.job ?? initialJob;
  return (
    <div className="rp-card flex flex-col gap-2 p-5" data-testid="version-status" aria-live="polite">
      <p className="text-base">
        <JobState job={job} verdict={null} />
      </p>
      <p className="text-sm text-ink-soft">
        {data?.state === "failed"
          ? "Every attempt failed, so there is no report. Upload a corrected specification to try again."
          : data?.state === "finished"
            ? "Finished; loading the report…"
            : "The server re-runs the model in the background. This page shows the report as soon as it is ready; you may also leave and come back."}
      </p>
    </div>
  );
}
