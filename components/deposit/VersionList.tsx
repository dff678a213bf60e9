"use client";
/**
 * A model's versions with their verification state. Polls the API while any version is
 * queued or running, so a verdict appears without a reload; stops polling once all are done.
 */
import Link from "next/link";
import useSWR from "swr";
import { ScrollRegion, STACK_BODY, STACK_CELL, STACK_HEAD, STACK_ROW, STACK_TABLE } from "@/components/report/stacked-table";
import type { ModelView } from "@/lib/types/deposit";
import { fetchJson } from "./api-client";
import { isPending, JobState } from "./JobState";
import { modelKey, POLL_MS } from "./keys";

export function VersionList({ initial }: { initial: ModelView }) {
  const key = modelKey(initial.slug);
  const { data, error } = useSWR<{ model: ModelView }>(key, fetchJson, {
    fallbackData: { model: initial },
    refreshInterval: (latest) => (latest?.model.versions.some((v) => isPending(v.job, v.verdict)) === true ? POLL_MS : 0),
    revalidateOnFocus: true,
  });
  const versions = data?.model.versions ?? initial.versions;

  if (versions.length === 0) {
    return <p className="text-sm text-ink-soft">No version yet. Upload the model&rsquo;s specification to make v1.</p>;
  }
  return (
    <div className="space-y-2">
      {error !== undefined && (
        <p className="text-sm text-danger" role="alert">
          Could not refresh the status ({error instanceof Error ? error.message : "unknown error"}); retrying.
        </p>
      )}
      <ScrollRegion label="Versions">
        <table className={STACK_TABLE} data-testid="version-list">
          <caption className="sr-only">Versions of this model, newest first</caption>
          <thead className={STACK_HEAD}>
            <tr className="border-b border-line-strong text-xs uppercase tracking-wide text-ink-faint">
              <th scope="col" className="py-2 pr-4 font-semibold">Version</th>
              <th scope="col" className="py-2 pr-4 font-semibold">Uploaded</th>
              <th scope="col" className="py-2 pr-4 font-semibold">Verification</th>
              <th scope="col" className="py-2 font-semibold">Claims</th>
            </tr>
          </thead>
          <tbody className={STACK_BODY}>
            {versions.map((v) => (
              <tr key={v.id} className={STACK_ROW} data-version={v.number}>
                {/* The title gets a reading width, so it does not break one word per line. */}
                <th scope="row" className="min-w-[12rem] py-2 pr-4 font-normal max-sm:block max-sm:min-w-0 max-sm:p-0">
                  <Link className="rp-link font-semibold" href={`/workspace/models/${initial.slug}/v/${v.number}`}>
                    v{v.number}
                  </Link>
                  <span className="block text-xs text-ink-faint">{v.title}</span>
                </th>
                <td className={`py-2 pr-4 whitespace-nowrap max-sm:order-3 max-sm:text-xs max-sm:text-ink-soft ${STACK_CELL}`} data-label="Uploaded">
                  <time dateTime={v.createdAt}>{new Date(v.createdAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" })} UTC</time>
                </td>
                <td className={`py-2 pr-4 ${STACK_CELL}`} data-label="Verification" data-testid={`version-${v.number}-state`}>
                  <JobState job={v.job} verdict={v.verdict} />
                </td>
                <td className={`py-2 text-ink-soft ${STACK_CELL}`} data-label="Claims">
                  {v.counts === null
                    ? "—"
                    : `${v.counts.confirmed} confirmed, ${v.counts.contradicted} contradicted, ${v.counts.inconclusive} inconclusive`}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollRegion>
    </div>
  );
}
