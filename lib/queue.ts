/**
 * An editor's queue: the venue's submissions, one row per model (its newest submitted
 * version), sorted, filtered and paged in SQL so a venue with thousands of models answers
 * in milliseconds. The queue API and the queue page both go through `listQueue`.
 *
 * A row's `status` is the editorial state of that version: awaiting-check (the engine has
 * not finished), check-failed (the job gave up), awaiting-decision (report ready, nobody
 * decided), or the decision's outcome.
 */
import "server-only";
import { sql, type SQL } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { DECISION_OUTCOMES, type DecisionOutcome, type JobState, type Visibility } from "@/db/schema";
import type { Verdict } from "@/lib/engine/types";
import { parseWith } from "@/lib/http";

export const QUEUE_STATUSES = ["awaiting-check", "check-failed", "awaiting-decision", ...DECISION_OUTCOMES] as const;
export type QueueStatus = (typeof QUEUE_STATUSES)[number];

/** "pending" stands for "no report yet". */
export const QUEUE_VERDICTS = ["confirmed", "contradicted", "inconclusive", "invalid", "pending"] as const;
export type QueueVerdict = (typeof QUEUE_VERDICTS)[number];

export const QUEUE_SORTS = [
  "submitted",
  "uploaded",
  "decided",
  "title",
  "author",
  "version",
  "status",
  "verdict",
  "confirmed",
  "contradicted",
  "inconclusive",
] as const;
export type QueueSort = (typeof QUEUE_SORTS)[number];

export const MAX_PAGE_SIZE = 100;

/** A comma-separated list of allowed words ("verified,declined"); empty means "any". */
function listOf<T extends string>(allowed: readonly T[], what: string) {
  return z
    .string()
    .trim()
    .default("")
    .transform((s) => (s === "" ? [] : s.split(",").map((x) => x.trim()).filter((x) => x !== "")))
    .refine((xs) => xs.every((x) => (allowed as readonly string[]).includes(x)), {
      message: `Each ${what} must be one of: ${allowed.join(", ")}.`,
    })
    .transform((xs) => xs as T[]);
}

const isoDay = z
  .string()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "A date as YYYY-MM-DD.")
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), "Not a calendar date.")
  .optional();

const count = z.coerce.number().int("A whole number.").min(0, "At least 0.").max(100000, "At most 100000.").optional();

/** The queue's query string, as the API reads it (every field optional). */
export const queueQuerySchema = z.object({
  status: listOf(QUEUE_STATUSES, "status"),
  verdict: listOf(QUEUE_VERDICTS, "verdict"),
  /** Words in the model's title or short name. */
  q: z.string().trim().max(200, "At most 200 characters.").default(""),
  /** Words in the owner's name or e-mail address. */
  author: z.string().trim().max(200, "At most 200 characters.").default(""),
  version: z.coerce.number().int("A whole number.").min(1, "Versions start at 1.").optional(),
  minConfirmed: count,
  minContradicted: count,
  minInconclusive: count,
  submittedFrom: isoDay,
  submittedTo: isoDay,
  sort: z.enum(QUEUE_SORTS, { message: `Sort by one of: ${QUEUE_SORTS.join(", ")}.` }).default("submitted"),
  dir: z.enum(["asc", "desc"], { message: "Direction is asc or desc." }).default("desc"),
  page: z.coerce.number().int("A whole number.").min(1, "Pages start at 1.").default(1),
  pageSize: z.coerce.number().int("A whole number.").min(1, "At least 1.").max(MAX_PAGE_SIZE, `At most ${MAX_PAGE_SIZE}.`).default(25),
});
export type QueueQuery = z.output<typeof queueQuerySchema>;

/** Reads URLSearchParams (or a page's searchParams object) into a checked QueueQuery; 422 otherwise. */
export function parseQueueQuery(params: URLSearchParams | Record<string, string | string[] | undefined>): QueueQuery {
  const record: Record<string, string> = {};
  if (params instanceof URLSearchParams) {
    for (const [k, v] of params) record[k] = v;
  } else {
    for (const [k, v] of Object.entries(params)) {
      if (typeof v === "string") record[k] = v;
      else if (Array.isArray(v) && v[0] !== undefined) record[k] = v.join(",");
    }
  }
  // Empty inputs of a form mean "not set".
  for (const k of Object.keys(record)) if (record[k] === "") delete record[k];
  return parseWith(queueQuerySchema, record, "The queue query has invalid fields.");
}

export interface QueueRow {
  submissionId: string;
  submittedAt: string;
  status: QueueStatus;
  model: { id: string; slug: string; title: string; visibility: Visibility };
  version: { id: string; number: number; specSha256: string; uploadedAt: string };
  author: { id: string; name: string; email: string };
  verdict: Verdict | null;
  counts: { confirmed: number; contradicted: number; inconclusive: number } | null;
  jobState: JobState | null;
  decision: { outcome: DecisionOutcome; at: string; editorName: string | null } | null;
  /** Submitted versions of this model at this venue (so "v3 of 3 submitted"). */
  submittedVersions: number;
  /** The decision on the newest earlier version at this venue (a resubmission answers it). */
  previousDecision: { outcome: DecisionOutcome; number: number } | null;
}

export interface QueuePage {
  rows: QueueRow[];
  total: number;
  page: number;
  pageSize: number;
  pages: number;
  /** Rows per status over the whole venue (ignoring filters), for the filter controls. */
  statusCounts: Record<QueueStatus, number>;
  query: QueueQuery;
}

const SORT_SQL: Record<QueueSort, SQL> = {
  submitted: sql`submitted_at`,
  uploaded: sql`uploaded_at`,
  decided: sql`decided_at`,
  title: sql`model_title collate nocase`,
  author: sql`owner_name collate nocase`,
  version: sql`version_number`,
  status: sql`status`,
  verdict: sql`verdict`,
  confirmed: sql`confirmed_count`,
  contradicted: sql`contradicted_count`,
  inconclusive: sql`inconclusive_count`,
};

/** The newest submission of each model at the venue, with everything the queue shows. */
function base(venueId: string): SQL {
  return sql`
    select
      s.id as submission_id,
      s.created_at as submitted_at,
      m.id as model_id, m.slug as model_slug, m.title as model_title, m.visibility as visibility,
      v.id as version_id, v.number as version_number, v.spec_sha256 as spec_sha256, v.created_at as uploaded_at,
      u.id as owner_id, u.name as owner_name, u.email as owner_email,
      r.verdict as verdict, r.confirmed_count as confirmed_count, r.contradicted_count as contradicted_count,
      r.inconclusive_count as inconclusive_count,
      d.outcome as outcome, d.created_at as decided_at, e.name as editor_name,
      j.state as job_state,
      s.venue_id as venue_id,
      case
        when d.id is not null then d.outcome
        when r.id is not null then 'awaiting-decision'
        when j.state = 'failed' then 'check-failed'
        else 'awaiting-check'
      end as status
    from submission s
    join model m on m.id = s.model_id and m.venue_id = s.venue_id
    join version v on v.id = s.version_id
    join user u on u.id = m.owner_id
    left join report r on r.version_id = v.id
    left join decision d on d.version_id = v.id and d.venue_id = s.venue_id
    left join user e on e.id = d.editor_id
    left join job j on j.id = (select j2.id from job j2 where j2.version_id = v.id order by j2.created_at desc limit 1)
    where s.venue_id = ${venueId}
      and not exists (
        select 1 from submission s2 join version v2 on v2.id = s2.version_id
        where s2.venue_id = s.venue_id and s2.model_id = s.model_id and v2.number > v.number
      )`;
}

/** LIKE pattern for "contains", with the user's % and _ taken literally. */
function contains(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

function filters(q: QueueQuery): SQL {
  const parts: SQL[] = [sql`1 = 1`];
  if (q.status.length > 0) parts.push(sql`status in (${sql.join(q.status.map((s) => sql`${s}`), sql`, `)})`);
  if (q.verdict.length > 0) {
    const real = q.verdict.filter((v) => v !== "pending");
    const alts: SQL[] = [];
    if (real.length > 0) alts.push(sql`verdict in (${sql.join(real.map((v) => sql`${v}`), sql`, `)})`);
    if (q.verdict.includes("pending")) alts.push(sql`verdict is null`);
    parts.push(sql`(${sql.join(alts, sql` or `)})`);
  }
  for (const word of q.q.split(/\s+/).filter((w) => w !== "")) {
    const p = contains(word);
    parts.push(sql`(model_title like ${p} escape '\\' or model_slug like ${p} escape '\\')`);
  }
  for (const word of q.author.split(/\s+/).filter((w) => w !== "")) {
    const p = contains(word);
    parts.push(sql`(owner_name like ${p} escape '\\' or owner_email like ${p} escape '\\')`);
  }
  if (q.version !== undefined) parts.push(sql`version_number = ${q.version}`);
  if (q.minConfirmed !== undefined) parts.push(sql`coalesce(confirmed_count, 0) >= ${q.minConfirmed}`);
  if (q.minContradicted !== undefined) parts.push(sql`coalesce(contradicted_count, 0) >= ${q.minContradicted}`);
  if (q.minInconclusive !== undefined) parts.push(sql`coalesce(inconclusive_count, 0) >= ${q.minInconclusive}`);
  if (q.submittedFrom !== undefined) parts.push(sql`submitted_at >= ${Date.parse(`${q.submittedFrom}T00:00:00Z`)}`);
  if (q.submittedTo !== undefined) parts.push(sql`submitted_at < ${Date.parse(`${q.submittedTo}T00:00:00Z`) + 86_400_000}`);
  return sql.join(parts, sql` and `);
}

type Raw = Record<string, unknown>;

const str = (v: unknown): string => (typeof v === "string" ? v : String(v ?? ""));
const num = (v: unknown): number => (typeof v === "number" ? v : typeof v === "bigint" ? Number(v) : Number(v ?? 0));
const iso = (v: unknown): string => new Date(num(v)).toISOString();

/** "changes-requested 2" -> { outcome, number }. */
function previous(v: unknown): QueueRow["previousDecision"] {
  if (typeof v !== "string") return null;
  const m = /^(\S+) (\d+)$/.exec(v);
  if (m === null || m[1] === undefined || m[2] === undefined || !(DECISION_OUTCOMES as readonly string[]).includes(m[1])) return null;
  return { outcome: m[1] as DecisionOutcome, number: Number(m[2]) };
}

function toRow(r: Raw): QueueRow {
  const verdict = r.verdict === null || r.verdict === undefined ? null : (str(r.verdict) as Verdict);
  return {
    submissionId: str(r.submission_id),
    submittedAt: iso(r.submitted_at),
    status: str(r.status) as QueueStatus,
    model: { id: str(r.model_id), slug: str(r.model_slug), title: str(r.model_title), visibility: str(r.visibility) as Visibility },
    version: { id: str(r.version_id), number: num(r.version_number), specSha256: str(r.spec_sha256), uploadedAt: iso(r.uploaded_at) },
    author: { id: str(r.owner_id), name: str(r.owner_name), email: str(r.owner_email) },
    verdict,
    counts:
      verdict === null
        ? null
        : { confirmed: num(r.confirmed_count), contradicted: num(r.contradicted_count), inconclusive: num(r.inconclusive_count) },
    jobState: r.job_state === null || r.job_state === undefined ? null : (str(r.job_state) as JobState),
    decision:
      r.outcome === null || r.outcome === undefined
        ? null
        : {
            outcome: str(r.outcome) as DecisionOutcome,
            at: iso(r.decided_at),
            editorName: r.editor_name === null || r.editor_name === undefined ? null : str(r.editor_name),
          },
    submittedVersions: num(r.submitted_versions),
    previousDecision: previous(r.previous_decision),
  };
}

/** One page of the venue's queue. The caller has checked that the viewer works this venue. */
export async function listQueue(venueId: string, query: QueueQuery): Promise<QueuePage> {
  const where = filters(query);
  const dir = query.dir === "asc" ? sql`asc` : sql`desc`;
  // Ties broken by submission id so paging never repeats or skips a row.
  const order = sql`${SORT_SQL[query.sort]} ${dir} nulls last, submission_id ${dir}`;
  const offset = (query.page - 1) * query.pageSize;
  const [rows, counts] = await Promise.all([
    // Columns only the page shows are computed for the page's rows, after sorting and limiting.
    db.all<Raw>(sql`with q as (${base(venueId)})
      select p.*,
        (select count(*) from submission s3 where s3.venue_id = p.venue_id and s3.model_id = p.model_id) as submitted_versions,
        (select d4.outcome || ' ' || v4.number from decision d4 join version v4 on v4.id = d4.version_id
          where d4.venue_id = p.venue_id and d4.model_id = p.model_id and v4.number < p.version_number
          order by v4.number desc limit 1) as previous_decision
      from (select * from q where ${where} order by ${order} limit ${query.pageSize} offset ${offset}) p
      order by ${order}`),
    // One pass for both: rows per status over the whole venue, and how many of them match.
    db.all<Raw>(sql`with q as (${base(venueId)}) select status, count(*) as n, sum(case when ${where} then 1 else 0 end) as matched from q group by status`),
  ]);
  let total = 0;
  const statusCounts = Object.fromEntries(QUEUE_STATUSES.map((s) => [s, 0])) as Record<QueueStatus, number>;
  for (const s of counts) {
    total += num(s.matched);
    const key = str(s.status) as QueueStatus;
    if (key in statusCounts) statusCounts[key] = num(s.n);
  }
  return {
    rows: rows.map(toRow),
    total,
    page: query.page,
    pageSize: query.pageSize,
    pages: Math.max(1, Math.ceil(total / query.pageSize)),
    statusCounts,
    query,
  };
}
