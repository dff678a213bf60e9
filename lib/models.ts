/**
 * Model entries: create, update, list an author's, read one with an access check. Also the
 * access rule every deposit module uses: a private model (with its versions, files and
 * reports) is visible to its owner, admins and editors of the venue it is submitted to; to
 * anyone else it does not exist (NotFound, never Forbidden, so its existence stays private).
 */
import "server-only";
import { and, asc, desc, eq, inArray, or } from "drizzle-orm";
import { db } from "@/db/client";
import { job, model, modelAuthor, report, venue, venueEditor, version } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { publicContentChanged } from "@/lib/public-cache";
import { Forbidden, NotFound, ValidationError } from "@/lib/errors";
import { zodDetails } from "@/lib/http";
import { toJobStatus, type JobRow } from "@/lib/types/jobs";
import {
  modelInputSchema,
  type ModelFields,
  type ModelInput,
  type ModelView,
  type VersionSummary,
  type Viewer,
} from "@/lib/types/deposit";

export type ModelRow = typeof model.$inferSelect;
export type VersionRow = typeof version.$inferSelect;

// ---------------------------------------------------------------------------
// Access
// ---------------------------------------------------------------------------

async function isVenueEditor(userId: string, venueId: string | null): Promise<boolean> {
  if (venueId === null) return false;
  const rows = await db
    .select({ userId: venueEditor.userId })
    .from(venueEditor)
    .where(and(eq(venueEditor.venueId, venueId), eq(venueEditor.userId, userId)));
  return rows.length > 0;
}

/** May `viewer` read this model? Public: anyone; private: owner, admin, editor of its venue. */
export async function canReadModel(row: ModelRow, viewer: Viewer): Promise<boolean> {
  if (row.visibility === "public") return true;
  if (viewer === null) return false;
  if (viewer.id === row.ownerId || viewer.role === "admin") return true;
  return isVenueEditor(viewer.id, row.venueId);
}

/** Only the owner (or an admin) changes a model and uploads to it. */
export function canEditModel(row: ModelRow, viewer: Viewer): boolean {
  return viewer !== null && (viewer.id === row.ownerId || viewer.role === "admin");
}

/** The model by id or slug if `viewer` may read it, else NotFound. */
export async function loadVisibleModel(idOrSlug: string, viewer: Viewer): Promise<ModelRow> {
  const rows = await db
    .select()
    .from(model)
    .where(or(eq(model.id, idOrSlug), eq(model.slug, idOrSlug)));
  const row = rows[0];
  if (row === undefined || !(await canReadModel(row, viewer))) throw new NotFound("model");
  return row;
}

/** The model if `viewer` may change it: NotFound when they cannot even see it, Forbidden when they only may read. */
export async function loadEditableModel(idOrSlug: string, viewer: Viewer): Promise<ModelRow> {
  const row = await loadVisibleModel(idOrSlug, viewer);
  if (!canEditModel(row, viewer)) throw new Forbidden("Only the model's owner may change it or upload to it.");
  return row;
}

/** A version with its model, if `viewer` may read the model, else NotFound("version"). */
export async function loadVisibleVersion(versionId: string, viewer: Viewer): Promise<{ version: VersionRow; model: ModelRow }> {
  const rows = await db.select().from(version).innerJoin(model, eq(version.modelId, model.id)).where(eq(version.id, versionId));
  const row = rows[0];
  if (row === undefined || !(await canReadModel(row.model, viewer))) throw new NotFound("version");
  return row;
}

// ---------------------------------------------------------------------------
// Views
// ---------------------------------------------------------------------------

export function parseModelInput(input: ModelInput): ModelFields {
  const result = modelInputSchema.safeParse(input);
  if (!result.success) throw new ValidationError("The model entry has invalid fields.", zodDetails(result.error));
  return result.data;
}

/** Version summaries (newest first) with verdict and job state, for the given versions. */
export async function summarizeVersions(rows: VersionRow[]): Promise<VersionSummary[]> {
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const reports = await db.select().from(report).where(inArray(report.versionId, ids));
  const jobs = await db.select().from(job).where(inArray(job.versionId, ids)).orderBy(asc(job.createdAt));
  const reportBy = new Map(reports.map((r) => [r.versionId, r]));
  const jobBy = new Map<string, JobRow>();
  for (const j of jobs) jobBy.set(j.versionId, j); // ascending, so the newest wins
  return [...rows]
    .sort((a, b) => b.number - a.number)
    .map((v) => {
      const r = reportBy.get(v.id);
      const j = jobBy.get(v.id);
      return {
        id: v.id,
        modelId: v.modelId,
        number: v.number,
        specSha256: v.specSha256,
        title: v.title,
        dynamicsKind: v.dynamicsKind,
        strategyNames: v.strategyNames === "" ? [] : v.strategyNames.split("\n"),
        createdAt: v.createdAt.toISOString(),
        uploadedBy: v.uploadedBy,
        verdict: r?.verdict ?? null,
        counts:
          r === undefined
            ? null
            : { confirmed: r.confirmedCount, contradicted: r.contradictedCount, inconclusive: r.inconclusiveCount },
        job: j === undefined ? null : toJobStatus(j),
      };
    });
}

async function toViews(rows: ModelRow[], viewer: Viewer): Promise<ModelView[]> {
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const authors = await db.select().from(modelAuthor).where(inArray(modelAuthor.modelId, ids)).orderBy(asc(modelAuthor.position));
  const versions = await summarizeVersions(await db.select().from(version).where(inArray(version.modelId, ids)));
  const venueIds = rows.map((r) => r.venueId).filter((v): v is string => v !== null);
  const venues = venueIds.length === 0 ? [] : await db.select().from(venue).where(inArray(venue.id, venueIds));
  const venueBy = new Map(venues.map((v) => [v.id, { id: v.id, slug: v.slug, name: v.name }]));
  return rows.map((m) => ({
    id: m.id,
    slug: m.slug,
    ownerId: m.ownerId,
    title: m.title,
    summary: m.summary,
    manuscriptTitle: m.manuscriptTitle,
    doi: m.doi,
    url: m.url,
    year: m.year,
    authors: authors
      .filter((a) => a.modelId === m.id)
      .map((a) => ({ name: a.name, orcid: a.orcid, affiliation: a.affiliation })),
    venue: m.venueId === null ? null : (venueBy.get(m.venueId) ?? null),
    visibility: m.visibility,
    createdAt: m.createdAt.toISOString(),
    updatedAt: m.updatedAt.toISOString(),
    versions: versions.filter((v) => v.modelId === m.id),
    canEdit: canEditModel(m, viewer),
  }));
}

async function toView(row: ModelRow, viewer: Viewer): Promise<ModelView> {
  const views = await toViews([row], viewer);
  const view = views[0];
  if (view === undefined) throw new NotFound("model");
  return view;
}

// ---------------------------------------------------------------------------
// Create, update, read
// ---------------------------------------------------------------------------

const SLUG_ALPHABET = "23456789abcdefghjkmnpqrstuvwxyz";

/** "rp-" and six characters without look-alikes (0/o, 1/l/i). */
export function newModelSlug(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(6));
  return `rp-${Array.from(bytes, (b) => SLUG_ALPHABET[b % SLUG_ALPHABET.length] ?? "x").join("")}`;
}

async function checkVenue(venueId: string | null | undefined): Promise<void> {
  if (venueId === null || venueId === undefined) return;
  const rows = await db.select({ id: venue.id }).from(venue).where(eq(venue.id, venueId));
  if (rows.length === 0) throw new ValidationError("The model entry has invalid fields.", [{ path: "/venueId", message: "No such venue." }]);
}

function columns(fields: ModelFields) {
  return {
    title: fields.title,
    summary: fields.summary,
    manuscriptTitle: fields.manuscriptTitle ?? null,
    doi: fields.doi ?? null,
    url: fields.url ?? null,
    year: fields.year ?? null,
    venueId: fields.venueId ?? null,
    visibility: fields.visibility,
  };
}

function authorRows(modelId: string, fields: ModelFields) {
  return fields.authors.map((a, position) => ({
    modelId,
    position,
    name: a.name,
    orcid: a.orcid ?? null,
    affiliation: a.affiliation ?? null,
  }));
}

export async function createModel(owner: { id: string; role: string }, input: ModelInput): Promise<ModelView> {
  const fields = parseModelInput(input);
  await checkVenue(fields.venueId);
  const id = crypto.randomUUID();
  await db.transaction(async (tx) => {
    await tx.insert(model).values({ id, slug: newModelSlug(), ownerId: owner.id, ...columns(fields) });
    const authors = authorRows(id, fields);
    if (authors.length > 0) await tx.insert(modelAuthor).values(authors);
    await recordAudit({ actorId: owner.id, action: "model.created", modelId: id, venueId: fields.venueId ?? null, detail: { title: fields.title } }, tx);
  });
  return getModel(id, owner);
}

/** Replaces the entry's fields (the whole form); versions are untouched. */
export async function updateModel(idOrSlug: string, actor: Viewer, input: ModelInput): Promise<ModelView> {
  const row = await loadEditableModel(idOrSlug, actor);
  const fields = parseModelInput(input);
  await checkVenue(fields.venueId);
  await db.transaction(async (tx) => {
    await tx.update(model).set(columns(fields)).where(eq(model.id, row.id));
    await tx.delete(modelAuthor).where(eq(modelAuthor.modelId, row.id));
    const authors = authorRows(row.id, fields);
    if (authors.length > 0) await tx.insert(modelAuthor).values(authors);
    await recordAudit(
      {
        actorId: actor?.id ?? null,
        action: "model.updated",
        modelId: row.id,
        venueId: fields.venueId ?? null,
        detail: { visibility: fields.visibility, previousVisibility: row.visibility },
      },
      tx,
    );
  });
  // Public before or after: its cached pages and reports go (a model made private 404s at once).
  if (row.visibility === "public" || fields.visibility === "public") await publicContentChanged(row.id);
  return getModel(row.id, actor);
}

/** One model with authors, venue and versions, or NotFound when `viewer` may not see it. */
export async function getModel(idOrSlug: string, viewer: Viewer): Promise<ModelView> {
  return toView(await loadVisibleModel(idOrSlug, viewer), viewer);
}

/** The owner's models, newest first, each with its versions (newest first) and their verdicts. */
export async function listModelsForOwner(owner: { id: string; role: string }): Promise<ModelView[]> {
  const rows = await db.select().from(model).where(eq(model.ownerId, owner.id)).orderBy(desc(model.createdAt), desc(model.id));
  return toViews(rows, owner);
}
