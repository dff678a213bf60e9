"use client";
/**
 * The editor's queue: filters, sorting and paging run on the server (GET
 * /api/v1/venues/[venue]/queue); this component keeps the controls, fetches each page and
 * mirrors the query in the address bar so a filtered view can be bookmarked or shared.
 */
import Link from "next/link";
import { useCallback, useEffect, useId, useRef, useState } from "react";
import { VerdictTag } from "@/components/status/VerdictTag";
import { Button, buttonClass } from "@/components/ui/Button";
import type { QueuePage, QueueSort, QueueStatus, QueueVerdict } from "@/lib/queue";
import { OUTCOME_WORDS, QUEUE_STATUS_ORDER, SORT_WORDS, STATUS_WORDS, formatDay, formatWhen } from "./labels";
import { StatusPill } from "./StatusPill";

export interface QueueControls {
  status: QueueStatus[];
  verdict: QueueVerdict[];
  q: string;
  author: string;
  version: string;
  minContradicted: string;
  submittedFrom: string;
  submittedTo: string;
  sort: QueueSort;
  dir: "asc" | "desc";
  page: number;
  pageSize: number;
}

const VERDICT_CHOICES: { value: QueueVerdict; label: string }[] = [
  { value: "confirmed", label: "Confirmed" },
  { value: "contradicted", label: "Contradicted" },
  { value: "inconclusive", label: "Inconclusive" },
  { value: "invalid", label: "Invalid" },
  { value: "pending", label: "Not checked yet" },
];

export function toSearch(c: QueueControls): URLSearchParams {
  const p = new URLSearchParams();
  if (c.status.length > 0) p.set("status", c.status.join(","));
  if (c.verdict.length > 0) p.set("verdict", c.verdict.join(","));
  if (c.q.trim() !== "") p.set("q", c.q.trim());
  if (c.author.trim() !== "") p.set("author", c.author.trim());
  if (c.version.trim() !== "") p.set("version", c.version.trim());
  if (c.minContradicted.trim() !== "") p.set("minContradicted", c.minContradicted.trim());
  if (c.submittedFrom !== "") p.set("submittedFrom", c.submittedFrom);
  if (c.submittedTo !== "") p.set("submittedTo", c.submittedTo);
  if (c.sort !== "submitted") p.set("sort", c.sort);
  if (c.dir !== "desc") p.set("dir", c.dir);
  if (c.page !== 1) p.set("page", String(c.page));
  if (c.pageSize !== 25) p.set("pageSize", String(c.pageSize));
  return p;
}

interface ApiError {
  error: { message: string; details?: { path: string; message: string }[] };
}

type Loaded = { kind: "page"; data: QueuePage } | { kind: "error"; message: string; details: string[] };

function SortHeader({ label, sortKey, c, onSort }: { label: string; sortKey: QueueSort; c: QueueControls; onSort: (s: QueueSort) => void }) {
  const active = c.sort === sortKey;
  return (
    <th scope="col" aria-sort={active ? (c.dir === "asc" ? "ascending" : "descending") : "none"} className="px-2.5 py-2 text-left font-semibold whitespace-nowrap">
      <button type="button" onClick={() => onSort(sortKey)} className={`inline-flex items-center gap-1 hover:text-tide ${active ? "text-ink" : "text-ink-soft"}`}>
        {label}
        <span aria-hidden="true" className="font-mono text-2xs">
          {active ? (c.dir === "asc" ? "▲" : "▼") : "△"}
        </span>
      </button>
    </th>
  );
}

function Counts({ counts }: { counts: { confirmed: number; contradicted: number; inconclusive: number } | null }) {
  if (counts === null) return <span className="text-ink-faint">–</span>;
  return (
    <span className="inline-flex gap-2 font-mono text-xs tabular-nums" aria-label={`${counts.confirmed} confirmed, ${counts.contradicted} contradicted, ${counts.inconclusive} inconclusive`}>
      <span className="text-confirmed" title="confirmed">{counts.confirmed}✓</span>
      <span className={counts.contradicted > 0 ? "font-bold text-contradicted" : "text-ink-faint"} title="contradicted">
        {counts.contradicted}✗
      </span>
      <span className={counts.inconclusive > 0 ? "text-inconclusive" : "text-ink-faint"} title="inconclusive">
        {counts.inconclusive}?
      </span>
    </span>
  );
}

export function QueueTable({ venueSlug, initial }: { venueSlug: string; initial: QueueControls }) {
  const [c, setC] = useState<QueueControls>(initial);
  // Text boxes apply after a pause in typing, so each keystroke does not fetch a page.
  const [draft, setDraft] = useState({ q: initial.q, author: initial.author, version: initial.version, minContradicted: initial.minContradicted });
  const [loaded, setLoaded] = useState<Loaded | null>(null);
  const [busy, setBusy] = useState(false);
  // Bumped to fetch the same page again (while some rows are still being checked).
  const [tick, setTick] = useState(0);
  const ids = useId();
  const first = useRef(true);

  useEffect(() => {
    const t = window.setTimeout(() => {
      setC((prev) =>
        prev.q === draft.q && prev.author === draft.author && prev.version === draft.version && prev.minContradicted === draft.minContradicted
          ? prev
          : { ...prev, ...draft, page: 1 },
      );
    }, 300);
    return () => window.clearTimeout(t);
  }, [draft]);

  useEffect(() => {
    const search = toSearch(c);
    const ctrl = new AbortController();
    setBusy(true);
    const qs = search.toString();
    if (!first.current) window.history.replaceState(null, "", qs === "" ? window.location.pathname : `?${qs}`);
    first.current = false;
    fetch(`/api/v1/venues/${encodeURIComponent(venueSlug)}/queue?${qs}`, { signal: ctrl.signal, headers: { accept: "application/json" } })
      .then(async (res) => {
        const body: unknown = await res.json();
        if (!res.ok) {
          const e = body as ApiError;
          setLoaded({ kind: "error", message: e.error.message, details: (e.error.details ?? []).map((d) => `${d.path.replace(/^\//, "")}: ${d.message}`) });
        } else {
          setLoaded({ kind: "page", data: body as QueuePage });
        }
      })
      .catch((e: unknown) => {
        if (e instanceof DOMException && e.name === "AbortError") return;
        setLoaded({ kind: "error", message: "The queue could not be loaded. Check your connection and try again.", details: [] });
      })
      .finally(() => {
        if (!ctrl.signal.aborted) setBusy(false);
      });
    return () => ctrl.abort();
  }, [c, venueSlug, tick]);

  const checking = loaded?.kind === "page" && loaded.data.rows.some((r) => r.status === "awaiting-check");
  useEffect(() => {
    if (!checking) return;
    const t = window.setTimeout(() => setTick((n) => n + 1), 5000);
    return () => window.clearTimeout(t);
  }, [checking, loaded]);

  const onSort = useCallback((s: QueueSort) => {
    setC((prev) => ({ ...prev, sort: s, dir: prev.sort === s && prev.dir === "desc" ? "asc" : prev.sort === s ? "desc" : s === "title" || s === "author" ? "asc" : "desc", page: 1 }));
  }, []);

  const toggle = <T extends string>(list: T[], v: T): T[] => (list.includes(v) ? list.filter((x) => x !== v) : [...list, v]);
  const page = loaded?.kind === "page" ? loaded.data : null;
  const statusCounts = page?.statusCounts;
  const filtered =
    c.status.length + c.verdict.length > 0 || c.q !== "" || c.author !== "" || c.version !== "" || c.minContradicted !== "" || c.submittedFrom !== "" || c.submittedTo !== "";

  return (
    <div className="flex flex-col gap-5">
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-2 text-xs font-semibold uppercase tracking-[0.12em] text-ink-faint">Status</legend>
        <div className="flex flex-wrap gap-2">
          {QUEUE_STATUS_ORDER.map((s) => {
            const on = c.status.includes(s);
            return (
              <button
                key={s}
                type="button"
                aria-pressed={on}
                onClick={() => setC((prev) => ({ ...prev, status: toggle(prev.status, s), page: 1 }))}
                className={`inline-flex items-center gap-2 rounded-full border px-3 py-1 text-sm ${on ? "border-tide bg-tide text-on-tide" : "border-line-strong bg-surface text-ink-soft hover:border-tide hover:text-tide"}`}
              >
                {STATUS_WORDS[s]}
                <span className={`rounded-full px-1.5 font-mono text-2xs ${on ? "bg-on-tide/20" : "bg-sunken"}`}>{statusCounts?.[s] ?? "·"}</span>
              </button>
            );
          })}
        </div>
      </fieldset>

      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${ids}-q`} className="text-sm font-semibold">Model title or short name</label>
          <input id={`${ids}-q`} type="search" className="rp-input" value={draft.q} onChange={(e) => setDraft({ ...draft, q: e.target.value })} placeholder="e.g. grazing" />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${ids}-author`} className="text-sm font-semibold">Author</label>
          <input id={`${ids}-author`} type="search" className="rp-input" value={draft.author} onChange={(e) => setDraft({ ...draft, author: e.target.value })} placeholder="name or e-mail" />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${ids}-verdict`} className="text-sm font-semibold">Re-run verdict</label>
          <select
            id={`${ids}-verdict`}
            className="rp-input"
            value={c.verdict[0] ?? ""}
            onChange={(e) => setC((prev) => ({ ...prev, verdict: e.target.value === "" ? [] : [e.target.value as QueueVerdict], page: 1 }))}
          >
            <option value="">Any verdict</option>
            {VERDICT_CHOICES.map((v) => (
              <option key={v.value} value={v.value}>
                {v.label}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${ids}-sort`} className="text-sm font-semibold">Sort by</label>
          <div className="flex gap-2">
            <select id={`${ids}-sort`} className="rp-input" value={c.sort} onChange={(e) => setC((prev) => ({ ...prev, sort: e.target.value as QueueSort, page: 1 }))}>
              {(Object.keys(SORT_WORDS) as QueueSort[]).map((s) => (
                <option key={s} value={s}>
                  {SORT_WORDS[s]}
                </option>
              ))}
            </select>
            <button
              type="button"
              className={buttonClass("secondary", "px-3 whitespace-nowrap")}
              onClick={() => setC((prev) => ({ ...prev, dir: prev.dir === "asc" ? "desc" : "asc", page: 1 }))}
              aria-label={c.dir === "asc" ? "Ascending; switch to descending" : "Descending; switch to ascending"}
            >
              {c.dir === "asc" ? "↑ asc" : "↓ desc"}
            </button>
          </div>
        </div>
      </div>

      <details className="rounded-[var(--radius-card)] border border-line bg-surface px-4 py-2">
        <summary className="cursor-pointer text-sm font-semibold text-ink-soft">More filters: version, contradicted claims, dates</summary>
        <div className="grid gap-3 py-3 sm:grid-cols-2 lg:grid-cols-4">
          <div className="flex flex-col gap-1">
            <label htmlFor={`${ids}-version`} className="text-sm font-semibold">Version number</label>
            <input id={`${ids}-version`} inputMode="numeric" className="rp-input" value={draft.version} onChange={(e) => setDraft({ ...draft, version: e.target.value })} />
          </div>
          <div className="flex flex-col gap-1">
            <label htmlFor={`${ids}-mincontra`} className="text-sm font-semibold">At least this many contradicted</label>
            <input id={`${ids}-mincontra`} inputMode="numeric" className="rp-input" value={draft.minContradicted} onChange={(e) => setDraft({ ...draft, minContradicted: e.target.value })} />
          </div>
          <div className="flex flex-col gap-1">
            <label htmlFor={`${ids}-from`} className="text-sm font-semibold">Submitted from</label>
            <input id={`${ids}-from`} type="date" className="rp-input" value={c.submittedFrom} onChange={(e) => setC((prev) => ({ ...prev, submittedFrom: e.target.value, page: 1 }))} />
          </div>
          <div className="flex flex-col gap-1">
            <label htmlFor={`${ids}-to`} className="text-sm font-semibold">Submitted up to</label>
            <input id={`${ids}-to`} type="date" className="rp-input" value={c.submittedTo} onChange={(e) => setC((prev) => ({ ...prev, submittedTo: e.target.value, page: 1 }))} />
          </div>
        </div>
      </details>

      <div className="flex flex-wrap items-center justify-between gap-3 text-sm text-ink-soft" aria-live="polite">
        <p data-testid="queue-summary">
          {page === null ? "Loading the queue…" : `${page.total} submission${page.total === 1 ? "" : "s"}${filtered ? " match" : ""}${page.total === 1 && filtered ? "es" : ""}`}
          {busy && page !== null ? " · updating…" : ""}
        </p>
        {filtered ? (
          <Button
            kind="quiet"
            className="px-2 py-1"
            onClick={() => {
              setDraft({ q: "", author: "", version: "", minContradicted: "" });
              setC({ ...initial, status: [], verdict: [], q: "", author: "", version: "", minContradicted: "", submittedFrom: "", submittedTo: "", page: 1 });
            }}
          >
            Clear filters
          </Button>
        ) : null}
      </div>

      {loaded?.kind === "error" ? (
        <div role="alert" className="rounded-[var(--radius-card)] border border-danger/40 bg-danger-wash px-4 py-3 text-sm">
          <p className="font-semibold">{loaded.message}</p>
          {loaded.details.length > 0 ? (
            <ul className="mt-1 list-disc pl-5 text-ink-soft">
              {loaded.details.map((d) => (
                <li key={d}>{d}</li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}

      <div className="relative overflow-x-auto rounded-[var(--radius-card)] border border-line bg-surface">
        <table className="w-full min-w-[48rem] border-collapse text-sm" data-testid="queue-table">
          <caption className="sr-only">Submissions, one row per model at its newest submitted version; open a title to review it</caption>
          <thead className="border-b border-line bg-sunken/60 text-xs">
            <tr>
              <SortHeader label="Model" sortKey="title" c={c} onSort={onSort} />
              <SortHeader label="Author" sortKey="author" c={c} onSort={onSort} />
              <SortHeader label="Version" sortKey="version" c={c} onSort={onSort} />
              <SortHeader label="Re-run" sortKey="verdict" c={c} onSort={onSort} />
              <SortHeader label="Claims ✓✗?" sortKey="contradicted" c={c} onSort={onSort} />
              <SortHeader label="Status" sortKey="status" c={c} onSort={onSort} />
              <SortHeader label="Submitted" sortKey="submitted" c={c} onSort={onSort} />
            </tr>
          </thead>
          <tbody>
            {page?.rows.map((r) => {
              const href = `/workspace/venues/${encodeURIComponent(venueSlug)}/review/${encodeURIComponent(r.model.slug)}/v/${r.version.number}`;
              return (
                <tr key={r.submissionId} className="border-b border-line last:border-b-0 hover:bg-sunken/40" data-testid="queue-row" data-model={r.model.slug}>
                  <td className="min-w-[11rem] max-w-[20rem] px-2.5 py-2.5">
                    <Link href={href} className="rp-link font-semibold" data-testid="queue-review-link">
                      {r.model.title}
                    </Link>
                    <span className="sr-only">, review version {r.version.number}</span>
                    <div className="font-mono text-2xs text-ink-faint">
                      {r.model.slug}
                      {r.model.visibility === "public" ? " · public" : " · private"}
                    </div>
                  </td>
                  <td className="max-w-[10rem] px-2.5 py-2.5">
                    <div className="truncate">{r.author.name}</div>
                    <div className="truncate text-2xs text-ink-faint" title={r.author.email}>
                      {r.author.email}
                    </div>
                  </td>
                  <td className="max-w-[8rem] px-2.5 py-2.5 font-mono text-xs">
                    v{r.version.number}
                    {r.previousDecision !== null ? (
                      <div className="font-sans text-2xs text-ink-faint" title={`Version ${r.previousDecision.number}: ${OUTCOME_WORDS[r.previousDecision.outcome]}`}>
                        after v{r.previousDecision.number}: {OUTCOME_WORDS[r.previousDecision.outcome].toLowerCase()}
                      </div>
                    ) : r.submittedVersions > 1 ? (
                      <div className="text-2xs text-ink-faint">{r.submittedVersions} sent</div>
                    ) : null}
                  </td>
                  <td className="px-2.5 py-2.5">{r.verdict === null ? <span className="text-xs text-ink-faint">not yet</span> : <VerdictTag verdict={r.verdict} size="sm" />}</td>
                  <td className="px-2.5 py-2.5">
                    <Counts counts={r.counts} />
                  </td>
                  <td className="px-2.5 py-2.5">
                    <StatusPill status={r.status} />
                  </td>
                  <td className="px-2.5 py-2.5 text-xs whitespace-nowrap text-ink-soft">
                    <time dateTime={r.submittedAt} title={formatWhen(r.submittedAt)}>
                      {formatDay(r.submittedAt)}
                    </time>
                  </td>
                </tr>
              );
            })}
            {page !== null && page.rows.length === 0 ? (
              <tr>
                <td colSpan={7} className="px-4 py-8 text-center text-ink-soft">
                  {filtered ? "No submission matches these filters." : "Nothing has been submitted to this venue yet."}
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>

      {page !== null && page.total > 0 ? (
        <nav aria-label="Queue pages" className="flex flex-wrap items-center justify-between gap-3 text-sm">
          <div className="flex items-center gap-2">
            <label htmlFor={`${ids}-size`} className="text-ink-soft">Rows per page</label>
            <select id={`${ids}-size`} className="rp-input w-auto py-1" value={c.pageSize} onChange={(e) => setC((prev) => ({ ...prev, pageSize: Number(e.target.value), page: 1 }))}>
              {[10, 25, 50, 100].map((n) => (
                <option key={n} value={n}>
                  {n}
                </option>
              ))}
            </select>
          </div>
          <div className="flex items-center gap-2">
            <Button kind="secondary" className="px-3 py-1" disabled={c.page <= 1} onClick={() => setC((prev) => ({ ...prev, page: prev.page - 1 }))}>
              ← Previous
            </Button>
            <span className="font-mono text-xs text-ink-soft">
              page {page.page} of {page.pages}
            </span>
            <Button kind="secondary" className="px-3 py-1" disabled={c.page >= page.pages} onClick={() => setC((prev) => ({ ...prev, page: prev.page + 1 }))}>
              Next →
            </Button>
          </div>
        </nav>
      ) : null}
    </div>
  );
}
