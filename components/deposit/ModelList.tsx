/**
 * An author's models as cards: title, short name, visibility, venue, and the newest version's
 * verdict or job state. Server-renderable; the workspace overview can show it too.
 */
import Link from "next/link";
import { StatusMark } from "@/components/report/StatusMark";
import type { ModelView } from "@/lib/types/deposit";
import { JobState } from "./JobState";

export function ModelList({ models }: { models: readonly ModelView[] }) {
  return (
    <ul className="flex flex-col gap-3" data-testid="model-list">
      {models.map((m) => {
        const latest = m.versions[0];
        return (
          <li key={m.id} className="rp-card flex flex-col gap-2 p-5 sm:flex-row sm:items-center sm:justify-between">
            <div className="min-w-0">
              <Link href={`/workspace/models/${m.slug}`} className="rp-link text-lg font-semibold">
                {m.title}
              </Link>
              <p className="text-xs text-ink-faint">
                <span className="font-mono">{m.slug}</span> · {m.visibility === "public" ? "public" : "private"}
                {m.venue === null ? "" : ` · venue: ${m.venue.name}`} · {m.versions.length}{" "}
                {m.versions.length === 1 ? "version" : "versions"}
              </p>
            </div>
            <div className="shrink-0 text-sm">
              {latest === undefined ? (
                <span className="text-ink-faint">No version yet</span>
              ) : (
                <span className="inline-flex items-center gap-2">
                  <span className="text-ink-faint">v{latest.number}</span>
                  {latest.verdict === null ? <JobState job={latest.job} verdict={null} /> : <StatusMark outcome={latest.verdict} />}
                </span>
              )}
            </div>
          </li>
        );
      })}
    </ul>
  );
}
