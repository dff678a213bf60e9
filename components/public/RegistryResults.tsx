/** One page of registry results: a card per model, then links to the other pages. */
import Link from "next/link";
import { VerdictTag } from "@/components/status/VerdictTag";
import type { RegistryPage, RegistryQuery } from "@/lib/registry";
import { dynamicsLabel } from "./labels";

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });

/** The search's URL with another page number; defaults are left out so URLs stay short. */
export function pageHref(query: RegistryQuery, page: number): string {
  const params = new URLSearchParams();
  for (const key of ["q", "title", "author", "doi", "strategy", "dynamics", "verdict"] as const) {
    const v = query[key];
    if (v !== undefined) params.set(key, v);
  }
  if (query.sort !== "recent") params.set("sort", query.sort);
  if (query.pageSize !== 20) params.set("pageSize", String(query.pageSize));
  if (page > 1) params.set("page", String(page));
  const s = params.toString();
  return s === "" ? "/models" : `/models?${s}`;
}

export function RegistryResults({ result }: { result: RegistryPage }) {
  const { entries, total, page, pageCount, query } = result;
  const first = (page - 1) * result.pageSize + 1;
  const searching = (["q", "title", "author", "doi", "strategy", "dynamics", "verdict"] as const).some((k) => query[k] !== undefined);
  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm text-ink-soft" role="status" data-testid="registry-count">
        {total === 0
          ? searching
            ? "No public model matches this search."
            : "There are no public models yet."
          : entries.length === 0
            ? `Page ${page} is past the end: ${total} ${total === 1 ? "model matches" : "models match"}.`
            : `${total} ${total === 1 ? "model" : "models"}; showing ${first}–${first + entries.length - 1}.`}
      </p>
      <ul className="flex flex-col gap-3" data-testid="registry-results">
        {entries.map((e) => (
          <li key={e.slug} className="rp-card flex flex-col gap-2 p-4 sm:p-5">
            <div className="flex flex-wrap items-start justify-between gap-2">
              <h2 className="min-w-0 text-lg font-semibold break-words">
                <Link href={`/models/${encodeURIComponent(e.slug)}`} className="text-ink hover:text-tide hover:underline">
                  {e.title}
                </Link>
              </h2>
              {e.verdict === null ? (
                <span className="rounded-full border border-line px-2 py-0.5 text-xs text-ink-soft">Awaiting re-run</span>
              ) : (
                <VerdictTag verdict={e.verdict} />
              )}
            </div>
            {e.authors.length > 0 && <p className="text-sm text-ink-soft">{e.authors.join(", ")}</p>}
            {e.summary !== "" && <p className="line-clamp-2 text-sm break-words">{e.summary}</p>}
            <dl className="flex flex-wrap gap-x-5 gap-y-1 text-xs text-ink-soft">
              <div className="flex gap-1">
                <dt>Strategies:</dt>
                <dd className="text-ink">{e.strategyNames.join(", ")}</dd>
              </div>
              <div className="flex gap-1">
                <dt>Dynamics:</dt>
                <dd className="text-ink">{dynamicsLabel(e.dynamicsKind)}</dd>
              </div>
              <div className="flex gap-1">
                {/* Said in words: "Version: 1, 2 Dec" read as versions 1 and 2. */}
                <dt className="sr-only">Newest version</dt>
                <dd className="text-ink" data-testid="registry-version">
                  Version {e.latestVersion} · deposited <time dateTime={e.updatedAt}>{dateFormat.format(new Date(e.updatedAt))}</time>
                </dd>
              </div>
              {e.doi !== null && (
                <div className="flex gap-1">
                  <dt>DOI:</dt>
                  <dd className="font-mono text-ink break-all">{e.doi}</dd>
                </div>
              )}
            </dl>
          </li>
        ))}
      </ul>
      {pageCount > 1 && (
        <nav aria-label="Result pages" className="flex flex-wrap items-center justify-between gap-3 text-sm">
          {page > 1 ? (
            <Link href={pageHref(query, Math.min(page - 1, pageCount))} rel="prev" className="font-semibold text-tide hover:underline">
              ← Previous
            </Link>
          ) : (
            <span />
          )}
          <span className="text-ink-soft">
            Page {page} of {pageCount}
          </span>
          {page < pageCount ? (
            <Link href={pageHref(query, page + 1)} rel="next" className="font-semibold text-tide hover:underline">
              Next →
            </Link>
          ) : (
            <span />
          )}
        </nav>
      )}
    </div>
  );
}
