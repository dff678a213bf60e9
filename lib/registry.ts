/**
 * The public registry: search over every public model, with filters and paging done in SQL.
 * A model is listed by its newest version (title, strategies, dynamics kind, verdict); private
 * models never appear, so nothing here can reveal that one exists.
 *
 * The query schema is shared by the registry page (search params) and GET /api/v1/registry.
 */
import "server-only";
import { sql, type SQL } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { VERDICTS } from "@/db/schema";
import type { CitationInput } from "@/lib/citation";
import type { GameSpec, ModelSpec, Report, Verdict } from "@/lib/engine/types";
import { env } from "@/lib/env";
import { NotFound, ValidationError } from "@/lib/errors";
import { zodDetails } from "@/lib/http";
import { getModel } from "@/lib/models";
import { readReport } from "@/lib/reports";
import { readableSpec } from "@/lib/spec-view";
import type { FileInfo, ModelView, VersionSummary } from "@/lib/types/deposit";
import { getVersionById } from "@/lib/versions";

export const DYNAMICS_KINDS = ["replicator", "replicator-mutator", "logit", "brown-von-neumann-nash", "smith"] as const;
/** "pending": the newest version has no report yet. */
export const VERDICT_FILTERS = [...VERDICTS, "pending"] as const;
export const REGISTRY_SORTS = ["recent", "title"] as const;
export const MAX_PAGE_SIZE = 100;
export const DEFAULT_PAGE_SIZE = 20;

const text = (label: string) =>
  z
    .string()
    .trim()
    .max(200, `${label}: at most 200 characters.`)
    .optional()
    .transform((s) => (s === undefined || s === "" ? undefined : s));

/** One schema for the search form, the page's search params and the API's query string. */
export const registryQuerySchema = z.object({
  /** Free text: matched against titles, authors, DOI, manuscript title and strategy names. */
  q: text("Search"),
  title: text("Title"),
  author: text("Author"),
  doi: text("DOI"),
  strategy: text("Strategy"),
  dynamics: z.enum(DYNAMICS_KINDS, { error: `Dynamics: one of ${DYNAMICS_KINDS.join(", ")}.` }).optional(),
  verdict: z.enum(VERDICT_FILTERS, { error: `Verdict: one of ${VERDICT_FILTERS.join(", ")}.` }).optional(),
  sort: z.enum(REGISTRY_SORTS, { error: `Sort: one of ${REGISTRY_SORTS.join(", ")}.` }).default("recent"),
  page: z.coerce.number({ error: "Page: a whole number from 1." }).int("Page: a whole number from 1.").min(1, "Page: a whole number from 1.").max(100_000, "Page: at most 100000.").default(1),
  pageSize: z.coerce
    .number({ error: `Page size: a whole number from 1 to ${MAX_PAGE_SIZE}.` })
    .int(`Page size: a whole number from 1 to ${MAX_PAGE_SIZE}.`)
    .min(1, `Page size: a whole number from 1 to ${MAX_PAGE_SIZE}.`)
    .max(MAX_PAGE_SIZE, `Page size: a whole number from 1 to ${MAX_PAGE_SIZE}.`)
    .default(DEFAULT_PAGE_SIZE),
});

export type RegistryQuery = z.output<typeof registryQuerySchema>;
export type RegistryQueryInput = z.input<typeof registryQuerySchema>;

/**
 * Reads a query from URL search params (or a page's searchParams object). Empty fields count
 * as absent; a field given twice uses its first value. Throws a 400 ValidationError listing
 * every bad field.
 */
export function parseRegistryQuery(params: URLSearchParams | Record<string, string | string[] | undefined>): RegistryQuery {
  const raw: Record<string, string> = {};
  const entries: [string, string | string[] | undefined][] =
    params instanceof URLSearchParams ? [...params.keys()].map((k) => [k, params.get(k) ?? undefined]) : Object.entries(params);
  for (const [k, v] of entries) {
    const value = Array.isArray(v) ? v[0] : v;
    if (value !== undefined && value !== "") raw[k] = value;
  }
  const result = registryQuerySchema.safeParse(raw);
  if (!result.success) throw new ValidationError("The search has invalid fields.", zodDetails(result.error), 400);
  return result.data;
}

export interface RegistryEntry {
  slug: string;
  title: string;
  summary: string;
  authors: string[];
  doi: string | null;
  manuscriptTitle: string | null;
  year: number | null;
  latestVersion: number;
  strategyNames: string[];
  dynamicsKind: string;
  /** The newest version's verdict; null while it waits for its re-run. */
  verdict: Verdict | null;
  /** When the newest version was registered (ISO). */
  updatedAt: string;
}

export interface RegistryPage {
  query: RegistryQuery;
  entries: RegistryEntry[];
  total: number;
  page: number;
  pageSize: number;
  pageCount: number;
}

/** LIKE pattern for a substring, with the pattern characters of the user's text escaped. */
function contains(s: string): string {
  return `%${s.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** The version column holds the strategy names joined by newlines (as lib/versions.ts writes it). */
export function splitStrategyNames(stored: string): string[] {
  return stored
    .split(/\n/)
    .map((s) => s.trim())
    .filter((s) => s !== "");
}

const authorMatch = (pattern: string): SQL =>
  sql`exists (select 1 from model_author a where a.model_id = m.id and a.name like ${pattern} escape '\\')`;

function conditions(q: RegistryQuery): SQL[] {
  const where: SQL[] = [sql`m.visibility = 'public'`];
  if (q.q !== undefined) {
    // Every word must appear somewhere; a DOI or a strategy name with spaces still matches as a whole phrase too.
    const words = q.q.split(/\s+/).filter((w) => w !== "").slice(0, 10);
    for (const word of words) {
      const p = contains(word);
      where.push(
        sql`(m.title like ${p} escape '\\' or v.title like ${p} escape '\\' or coalesce(m.doi, '') like ${p} escape '\\'
          or coalesce(m.manuscript_title, '') like ${p} escape '\\' or v.strategy_names like ${p} escape '\\'
          or ${authorMatch(p)})`,
      );
    }
  }
  if (q.title !== undefined) {
    const p = contains(q.title);
    where.push(sql`(m.title like ${p} escape '\\' or v.title like ${p} escape '\\')`);
  }
  if (q.author !== undefined) where.push(authorMatch(contains(q.author)));
  if (q.doi !== undefined) {
    const doi = q.doi.replace(/^https?:\/\/(dx\.)?doi\.org\//i, "");
    where.push(sql`coalesce(m.doi, '') like ${contains(doi)} escape '\\'`);
  }
  if (q.strategy !== undefined) where.push(sql`v.strategy_names like ${contains(q.strategy)} escape '\\'`);
  if (q.dynamics !== undefined) where.push(sql`v.dynamics_kind = ${q.dynamics}`);
  if (q.verdict === "pending") where.push(sql`r.verdict is null`);
  else if (q.verdict !== undefined) where.push(sql`r.verdict = ${q.verdict}`);
  return where;
}

interface Row {
  id: string;
  slug: string;
  title: string;
  summary: string;
  doi: string | null;
  manuscript_title: string | null;
  year: number | null;
  number: number;
  strategy_names: string;
  dynamics_kind: string;
  verdict: Verdict | null;
  created_at: number;
  total: number;
}

/** One page of public models matching `query`, newest first (or by title), with the total count. */
export async function searchRegistry(query: RegistryQuery): Promise<RegistryPage> {
  const where = sql.join(conditions(query), sql` and `);
  const order = query.sort === "title" ? sql`m.title collate nocase asc, m.slug asc` : sql`v.created_at desc, m.slug asc`;
  const offset = (query.page - 1) * query.pageSize;
  // The newest version of each model: the unique (model_id, number) index answers the max() per model.
  const from = sql`from model m
    join version v on v.model_id = m.id and v.number = (select max(v2.number) from version v2 where v2.model_id = m.id)
    left join report r on r.version_id = v.id
    where ${where}`;
  const rows = await db.all<Row>(sql`select m.id, m.slug, m.title, m.summary, m.doi, m.manuscript_title, m.year, v.number,
      v.strategy_names, v.dynamics_kind, r.verdict, v.created_at, count(*) over () as total
    ${from} order by ${order} limit ${query.pageSize} offset ${offset}`);
  let total = rows[0]?.total ?? 0;
  if (rows.length === 0 && offset > 0) {
    const counted = await db.all<{ n: number }>(sql`select count(*) as n ${from}`);
    total = counted[0]?.n ?? 0;
  }
  const authors = await authorsOf(rows.map((r) => r.id));
  return {
    query,
    entries: rows.map((r) => ({
      slug: r.slug,
      title: r.title,
      summary: r.summary,
      authors: authors.get(r.id) ?? [],
      doi: r.doi,
      manuscriptTitle: r.manuscript_title,
      year: r.year,
      latestVersion: r.number,
      strategyNames: splitStrategyNames(r.strategy_names),
      dynamicsKind: r.dynamics_kind,
      verdict: r.verdict,
      updatedAt: new Date(r.created_at).toISOString(),
    })),
    total,
    page: query.page,
    pageSize: query.pageSize,
    pageCount: Math.max(1, Math.ceil(total / query.pageSize)),
  };
}

async function authorsOf(modelIds: string[]): Promise<Map<string, string[]>> {
  const out = new Map<string, string[]>();
  if (modelIds.length === 0) return out;
  const rows = await db.all<{ model_id: string; name: string }>(
    sql`select model_id, name from model_author where model_id in (${sql.join(
      modelIds.map((id) => sql`${id}`),
      sql`, `,
    )}) order by model_id, position`,
  );
  for (const r of rows) {
    const list = out.get(r.model_id) ?? [];
    list.push(r.name);
    out.set(r.model_id, list);
  }
  return out;
}

/** Every public model's versions, for the sitemap: slug, version number, registration time. */
export async function publicVersionsForSitemap(limit = 50_000): Promise<{ slug: string; number: number; createdAt: Date; latest: boolean }[]> {
  const rows = await db.all<{ slug: string; number: number; created_at: number; latest: number }>(sql`
    select m.slug, v.number, v.created_at,
      v.number = (select max(v2.number) from version v2 where v2.model_id = m.id) as latest
    from model m join version v on v.model_id = m.id
    where m.visibility = 'public'
    order by m.slug, v.number limit ${limit}`);
  return rows.map((r) => ({ slug: r.slug, number: r.number, createdAt: new Date(r.created_at), latest: r.latest === 1 }));
}

// ---------------------------------------------------------------------------
// One public model version, for the public pages and downloads
// ---------------------------------------------------------------------------

export interface PublicVersion {
  model: ModelView;
  /** The version shown (the newest when no number was asked for). */
  version: VersionSummary;
  specText: string;
  /** The spec as far as the views can draw it; null for an unreadable one. */
  readable: { spec: ModelSpec; game: GameSpec } | null;
  /** The server's own stored re-run; null until it has finished. */
  report: Report | null;
  /** True when the newest version is shown. */
  latest: boolean;
  /** The version's supplementary files (downloads through /api/v1/files/[id]). */
  supplements: FileInfo[];
}

/**
 * A public model's version for anonymous readers. Unknown and private models, and unknown
 * version numbers, are all the same NotFound: nothing tells them apart. `number` is the path
 * segment as typed; anything but a positive whole number is unknown.
 */
export async function loadPublicVersion(slug: string, number?: string): Promise<PublicVersion> {
  const model = await getModel(slug, null);
  // getModel also accepts an internal id; public URLs use the slug only.
  if (model.slug !== slug) throw new NotFound("model");
  const newest = model.versions[0];
  let version = newest;
  if (number !== undefined) {
    if (!/^[1-9][0-9]{0,8}$/.test(number)) throw new NotFound("version");
    version = model.versions.find((v) => v.number === Number(number));
  }
  if (version === undefined) throw new NotFound("version");
  const view = await getVersionById(version.id, null);
  const stored = await readReport(version.id);
  return {
    model,
    version,
    specText: view.specText,
    readable: readableSpec(view.specText),
    report: stored?.report ?? null,
    latest: version.id === newest?.id,
    supplements: view.files.filter((f) => f.purpose === "supplement"),
  };
}

/** The absolute URL of a public page, from the app's configured origin. */
export function publicUrl(pathname: string): string {
  return `${env.authUrl.replace(/\/+$/, "")}${pathname}`;
}

export function versionPath(slug: string, number: number): string {
  return `/models/${encodeURIComponent(slug)}/v/${number}`;
}

/** The report API's address for a version (what the page's figures are drawn from). */
export function reportApiPath(slug: string, number: number): string {
  return `/api/v1/models/${encodeURIComponent(slug)}/versions/${number}/report`;
}

/** The citation facts of a public version (lib/citation.ts renders them). */
export function citationOf(p: PublicVersion): CitationInput {
  return {
    slug: p.model.slug,
    versionNumber: p.version.number,
    title: p.version.title,
    authors: p.model.authors.map((a) => ({ name: a.name })),
    registeredAt: new Date(p.version.createdAt),
    specSha256: p.version.specSha256,
    url: publicUrl(versionPath(p.model.slug, p.version.number)),
    manuscript: { title: p.model.manuscriptTitle, doi: p.model.doi, year: p.model.year },
  };
}
