/**
 * Venues (journals or collections whose editors decide on submissions), the editors assigned
 * to them, and submissions: an author puts a version of their model before the model's venue.
 *
 * Callers check roles through lib/authz.ts first; these functions enforce the rules of the
 * data itself (who edits which venue, whose model may be submitted).
 */
import "server-only";
import { and, asc, count, desc, eq, inArray, sql } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { auditEvent, decision, model, submission, user, venue, venueEditor, version } from "@/db/schema";
import type { Executor } from "@/lib/audit";
import { Conflict, Forbidden, NotFound, ValidationError } from "@/lib/errors";
import { zodDetails } from "@/lib/http";

export interface Venue {
  id: string;
  slug: string;
  name: string;
  description: string;
}

/** Who is asking (an Actor or a deposit Viewer both fit). */
export interface VenueActor {
  id: string;
  role: string;
}

const columns = { id: venue.id, slug: venue.slug, name: venue.name, description: venue.description };

// ---------------------------------------------------------------------------
// Audit events of venue work
// ---------------------------------------------------------------------------

/**
 * The venue actions the trail records besides decisions. Written straight into the
 * append-only audit_event table (the shared writer's action list does not name them).
 */
export type VenueAuditAction = "venue.created" | "venue.editor-added" | "venue.editor-removed" | "version.submitted";

async function appendAudit(
  exec: Executor,
  e: { actorId: string; action: VenueAuditAction; venueId: string; modelId?: string; versionId?: string; detail: Record<string, unknown> },
): Promise<void> {
  await exec.insert(auditEvent).values({
    actorId: e.actorId,
    action: e.action,
    venueId: e.venueId,
    modelId: e.modelId ?? null,
    versionId: e.versionId ?? null,
    detail: JSON.stringify(e.detail),
  });
}

// ---------------------------------------------------------------------------
// Reading venues
// ---------------------------------------------------------------------------

export async function listVenues(): Promise<Venue[]> {
  return db.select(columns).from(venue).orderBy(asc(venue.name));
}

export async function getVenueBySlug(slug: string): Promise<Venue | null> {
  const [row] = await db.select(columns).from(venue).where(eq(venue.slug, slug)).limit(1);
  return row ?? null;
}

export async function getVenueById(id: string): Promise<Venue | null> {
  const [row] = await db.select(columns).from(venue).where(eq(venue.id, id)).limit(1);
  return row ?? null;
}

/** The venues `userId` is an editor of, by name. */
export async function listVenuesForEditor(userId: string): Promise<Venue[]> {
  return db
    .select(columns)
    .from(venueEditor)
    .innerJoin(venue, eq(venue.id, venueEditor.venueId))
    .where(eq(venueEditor.userId, userId))
    .orderBy(asc(venue.name));
}

export async function isEditorOf(userId: string, venueId: string): Promise<boolean> {
  const [row] = await db
    .select({ v: venueEditor.venueId })
    .from(venueEditor)
    .where(and(eq(venueEditor.userId, userId), eq(venueEditor.venueId, venueId)))
    .limit(1);
  return row !== undefined;
}

export interface EditorView {
  id: string;
  name: string;
  email: string;
}

/** The editors of a venue (name and address), for admin pages. */
export async function listEditors(venueId: string): Promise<EditorView[]> {
  return db
    .select({ id: user.id, name: user.name, email: user.email })
    .from(venueEditor)
    .innerJoin(user, eq(user.id, venueEditor.userId))
    .where(eq(venueEditor.venueId, venueId))
    .orderBy(asc(user.email));
}

export const NOT_EDITOR_MESSAGE = "You are not an editor of this venue.";

/**
 * The venue if `actor` may work its queue: its editors, and admins (who oversee every venue).
 * NotFound for an unknown slug, Forbidden for anyone else.
 */
export async function requireVenueAccess(actor: VenueActor, venueSlug: string): Promise<Venue> {
  const v = await getVenueBySlug(venueSlug);
  if (v === null) throw new NotFound("venue");
  if (actor.role === "admin") return v;
  if (!(await isEditorOf(actor.id, v.id))) throw new Forbidden(NOT_EDITOR_MESSAGE);
  return v;
}

export interface VenueSummary extends Venue {
  editors: EditorView[];
  /** Models whose newest submission here has no decision yet. */
  awaitingDecision: number;
  /** Models with at least one submission here. */
  models: number;
}

/** Venues with their editors and queue sizes: all of them (admin) or the given ones. */
export async function summarizeVenues(venues: Venue[]): Promise<VenueSummary[]> {
  if (venues.length === 0) return [];
  const ids = venues.map((v) => v.id);
  const editors = await db
    .select({ venueId: venueEditor.venueId, id: user.id, name: user.name, email: user.email })
    .from(venueEditor)
    .innerJoin(user, eq(user.id, venueEditor.userId))
    .where(inArray(venueEditor.venueId, ids))
    .orderBy(asc(user.email));
  // Newest submitted version of each model at each venue, and whether it has a decision.
  const latest = db
    .select({
      venueId: submission.venueId,
      modelId: submission.modelId,
      top: sql<number>`max(${version.number})`.as("top"),
    })
    .from(submission)
    .innerJoin(version, eq(version.id, submission.versionId))
    .innerJoin(model, and(eq(model.id, submission.modelId), eq(model.venueId, submission.venueId)))
    .where(inArray(submission.venueId, ids))
    .groupBy(submission.venueId, submission.modelId)
    .as("latest");
  const rows = await db
    .select({
      venueId: latest.venueId,
      models: count(),
      awaiting: sql<number>`sum(case when ${decision.id} is null then 1 else 0 end)`,
    })
    .from(latest)
    .innerJoin(version, and(eq(version.modelId, latest.modelId), eq(version.number, latest.top)))
    .leftJoin(decision, and(eq(decision.versionId, version.id), eq(decision.venueId, latest.venueId)))
    .groupBy(latest.venueId);
  const stats = new Map(rows.map((r) => [r.venueId, r]));
  return venues.map((v) => ({
    ...v,
    editors: editors.filter((e) => e.venueId === v.id).map(({ id, name, email }) => ({ id, name, email })),
    models: stats.get(v.id)?.models ?? 0,
    awaitingDecision: Number(stats.get(v.id)?.awaiting ?? 0),
  }));
}

// ---------------------------------------------------------------------------
// Creating venues and assigning editors (admin)
// ---------------------------------------------------------------------------

/** One schema for the admin form and the API. */
export const venueInputSchema = z.object({
  slug: z
    .string()
    .trim()
    .min(2, "At least 2 characters.")
    .max(60, "At most 60 characters.")
    .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, "Lower-case letters, digits and single hyphens, like tidewater-letters."),
  name: z.string().trim().min(1, "The venue needs a name.").max(200, "At most 200 characters."),
  description: z.string().trim().max(2000, "At most 2000 characters.").default(""),
});
export type VenueInput = z.input<typeof venueInputSchema>;

export const VENUE_SLUG_TAKEN = "A venue with this short name exists already.";

/** Creates a venue; Conflict when the slug is taken. */
export async function createVenue(actor: VenueActor, input: VenueInput): Promise<Venue> {
  const parsed = venueInputSchema.safeParse(input);
  if (!parsed.success) throw new ValidationError("The venue has invalid fields.", zodDetails(parsed.error));
  const fields = parsed.data;
  if ((await getVenueBySlug(fields.slug)) !== null) throw new Conflict(VENUE_SLUG_TAKEN);
  const id = crypto.randomUUID();
  try {
    await db.transaction(async (tx) => {
      await tx.insert(venue).values({ id, ...fields });
      await appendAudit(tx, { actorId: actor.id, action: "venue.created", venueId: id, detail: { slug: fields.slug, name: fields.name } });
    });
  } catch (e) {
    if (isUniqueViolation(e)) throw new Conflict(VENUE_SLUG_TAKEN);
    throw e;
  }
  return { id, slug: fields.slug, name: fields.name, description: fields.description };
}

/** Creates the venue or updates its name and description; returns it. Idempotent (demo seeding). */
export async function upsertVenue(input: { slug: string; name: string; description: string }): Promise<Venue> {
  await db
    .insert(venue)
    .values(input)
    .onConflictDoUpdate({ target: venue.slug, set: { name: input.name, description: input.description } });
  const v = await getVenueBySlug(input.slug);
  if (v === null) throw new NotFound("venue");
  return v;
}

/** Idempotent, no audit event (demo seeding). */
export async function addEditor(venueId: string, userId: string): Promise<void> {
  await db.insert(venueEditor).values({ venueId, userId }).onConflictDoNothing();
}

export const NO_ACCOUNT_MESSAGE = "No account has this e-mail address.";
export const ONLY_EDITORS_MESSAGE = "Only accounts with the editor or admin role can edit a venue; change the account's role first.";

/** Assigns the account with `email` as an editor of the venue (admin work). Idempotent. */
export async function assignEditor(actor: VenueActor, venueSlug: string, email: string): Promise<EditorView> {
  const v = await getVenueBySlug(venueSlug);
  if (v === null) throw new NotFound("venue");
  const address = email.trim().toLowerCase();
  const [account] = await db.select({ id: user.id, name: user.name, email: user.email, role: user.role }).from(user).where(eq(user.email, address)).limit(1);
  if (account === undefined) throw new ValidationError(NO_ACCOUNT_MESSAGE, [{ path: "/email", message: NO_ACCOUNT_MESSAGE }]);
  if (account.role !== "editor" && account.role !== "admin") {
    throw new ValidationError(ONLY_EDITORS_MESSAGE, [{ path: "/email", message: ONLY_EDITORS_MESSAGE }]);
  }
  await db.transaction(async (tx) => {
    const inserted = await tx.insert(venueEditor).values({ venueId: v.id, userId: account.id }).onConflictDoNothing().returning();
    if (inserted.length > 0) {
      await appendAudit(tx, { actorId: actor.id, action: "venue.editor-added", venueId: v.id, detail: { editorId: account.id, email: account.email } });
    }
  });
  return { id: account.id, name: account.name, email: account.email };
}

/** Removes an editor from the venue; NotFound when they were not one. */
export async function unassignEditor(actor: VenueActor, venueSlug: string, userId: string): Promise<void> {
  const v = await getVenueBySlug(venueSlug);
  if (v === null) throw new NotFound("venue");
  await db.transaction(async (tx) => {
    const removed = await tx
      .delete(venueEditor)
      .where(and(eq(venueEditor.venueId, v.id), eq(venueEditor.userId, userId)))
      .returning();
    if (removed.length === 0) throw new NotFound("editor", "This account is not an editor of the venue.");
    await appendAudit(tx, { actorId: actor.id, action: "venue.editor-removed", venueId: v.id, detail: { editorId: userId } });
  });
}

// ---------------------------------------------------------------------------
// Submissions
// ---------------------------------------------------------------------------

export interface SubmissionView {
  id: string;
  venue: { id: string; slug: string; name: string };
  modelId: string;
  versionId: string;
  versionNumber: number;
  submittedBy: string;
  createdAt: string;
}

export const NO_VENUE_MESSAGE = "Choose the venue in the model entry before submitting a version.";
export const OTHER_VENUE_MESSAGE = "The model entry names another venue; change it there first.";
export const NOT_OWNER_SUBMIT_MESSAGE = "Only the model's owner may submit its versions.";
export const OLDER_VERSION_MESSAGE = "A newer version of this model is submitted already; submit the newest version instead.";

/**
 * Puts version `number` of a model before the venue the model entry names (`venueSlug`, if
 * given, must be that venue). The owner (or an admin) submits; editors of the venue then see
 * it in their queue. Idempotent: submitting the same version again returns the existing
 * submission. The deposit workspace calls this after an upload to a model that has a venue.
 */
export async function submitVersion(
  actor: VenueActor,
  input: { model: string; number: number; venueSlug?: string },
): Promise<{ status: "created" | "existing"; submission: SubmissionView }> {
  const [m] = await db
    .select()
    .from(model)
    .where(sql`${model.id} = ${input.model} or ${model.slug} = ${input.model}`)
    .limit(1);
  const mayRead = m !== undefined && (m.visibility === "public" || m.ownerId === actor.id || actor.role === "admin" || (m.venueId !== null && (await isEditorOf(actor.id, m.venueId))));
  if (m === undefined || !mayRead) throw new NotFound("model");
  if (m.ownerId !== actor.id && actor.role !== "admin") throw new Forbidden(NOT_OWNER_SUBMIT_MESSAGE);
  if (m.venueId === null) throw new ValidationError(NO_VENUE_MESSAGE, [{ path: "/venue", message: NO_VENUE_MESSAGE }]);
  const v = await getVenueById(m.venueId);
  if (v === null) throw new ValidationError(NO_VENUE_MESSAGE, [{ path: "/venue", message: NO_VENUE_MESSAGE }]);
  if (input.venueSlug !== undefined && input.venueSlug !== v.slug) {
    throw new ValidationError(OTHER_VENUE_MESSAGE, [{ path: "/venue", message: OTHER_VENUE_MESSAGE }]);
  }
  const [ver] = await db
    .select({ id: version.id, number: version.number })
    .from(version)
    .where(and(eq(version.modelId, m.id), eq(version.number, input.number)))
    .limit(1);
  if (ver === undefined) throw new NotFound("version");

  const [existing] = await db
    .select()
    .from(submission)
    .where(and(eq(submission.venueId, v.id), eq(submission.versionId, ver.id)))
    .limit(1);
  const view = (row: typeof submission.$inferSelect): SubmissionView => ({
    id: row.id,
    venue: { id: v.id, slug: v.slug, name: v.name },
    modelId: row.modelId,
    versionId: row.versionId,
    versionNumber: ver.number,
    submittedBy: row.submittedBy,
    createdAt: row.createdAt.toISOString(),
  });
  if (existing !== undefined) return { status: "existing", submission: view(existing) };

  const [newer] = await db
    .select({ n: version.number })
    .from(submission)
    .innerJoin(version, eq(version.id, submission.versionId))
    .where(and(eq(submission.venueId, v.id), eq(submission.modelId, m.id), sql`${version.number} > ${ver.number}`))
    .limit(1);
  if (newer !== undefined) throw new Conflict(OLDER_VERSION_MESSAGE);

  try {
    const row = await db.transaction(async (tx) => {
      const [inserted] = await tx
        .insert(submission)
        .values({ venueId: v.id, modelId: m.id, versionId: ver.id, submittedBy: actor.id })
        .returning();
      if (inserted === undefined) throw new Error("submission insert returned no row");
      await appendAudit(tx, {
        actorId: actor.id,
        action: "version.submitted",
        venueId: v.id,
        modelId: m.id,
        versionId: ver.id,
        detail: { number: ver.number, venue: v.slug },
      });
      return inserted;
    });
    return { status: "created", submission: view(row) };
  } catch (e) {
    // A concurrent submit of the same version won: answer with that one.
    if (!isUniqueViolation(e)) throw e;
    const [again] = await db
      .select()
      .from(submission)
      .where(and(eq(submission.venueId, v.id), eq(submission.versionId, ver.id)))
      .limit(1);
    if (again === undefined) throw e;
    return { status: "existing", submission: view(again) };
  }
}

/** A model's submissions (newest version first), for the author's and editor's pages. */
export async function listSubmissionsForModel(modelId: string): Promise<SubmissionView[]> {
  const rows = await db
    .select({ s: submission, number: version.number, v: columns })
    .from(submission)
    .innerJoin(version, eq(version.id, submission.versionId))
    .innerJoin(venue, eq(venue.id, submission.venueId))
    .where(eq(submission.modelId, modelId))
    .orderBy(desc(version.number));
  return rows.map((r) => ({
    id: r.s.id,
    venue: { id: r.v.id, slug: r.v.slug, name: r.v.name },
    modelId: r.s.modelId,
    versionId: r.s.versionId,
    versionNumber: r.number,
    submittedBy: r.s.submittedBy,
    createdAt: r.s.createdAt.toISOString(),
  }));
}

/** The newest version of a model submitted to a venue (by version number), or null. */
export async function latestSubmittedVersion(venueId: string, modelId: string): Promise<{ versionId: string; number: number } | null> {
  const [row] = await db
    .select({ versionId: version.id, number: version.number })
    .from(submission)
    .innerJoin(version, eq(version.id, submission.versionId))
    .where(and(eq(submission.venueId, venueId), eq(submission.modelId, modelId)))
    .orderBy(desc(version.number))
    .limit(1);
  return row ?? null;
}

/** libSQL reports a broken UNIQUE constraint as SQLITE_CONSTRAINT(_UNIQUE); Drizzle may wrap it. */
export function isUniqueViolation(e: unknown): boolean {
  for (let cur: unknown = e, depth = 0; cur instanceof Error && depth < 5; cur = cur.cause, depth++) {
    const code = (cur as { code?: unknown }).code;
    if (code === "SQLITE_CONSTRAINT_UNIQUE" || code === "SQLITE_CONSTRAINT_PRIMARYKEY") return true;
    if (/UNIQUE constraint failed/i.test(cur.message)) return true;
  }
  return false;
}

// ---------------------------------------------------------------------------
// Review access: who may compare versions and read a model's audit trail
// ---------------------------------------------------------------------------

export const NOT_REVIEWER_MESSAGE = "Only the model's owner, the editors of its venue and admins may see this.";

export interface ReviewableModel {
  id: string;
  slug: string;
  title: string;
  ownerId: string;
  venueId: string | null;
  visibility: "private" | "public";
}

/**
 * The model if `actor` is its owner, an editor of its venue, or an admin. Someone else gets
 * NotFound for a private model (its existence stays private) and Forbidden for a public one.
 */
export async function loadModelForReview(actor: VenueActor, slugOrId: string): Promise<ReviewableModel> {
  const [m] = await db
    .select({ id: model.id, slug: model.slug, title: model.title, ownerId: model.ownerId, venueId: model.venueId, visibility: model.visibility })
    .from(model)
    .where(sql`${model.slug} = ${slugOrId} or ${model.id} = ${slugOrId}`)
    .limit(1);
  if (m === undefined) throw new NotFound("model");
  if (m.ownerId === actor.id || actor.role === "admin") return m;
  if (m.venueId !== null && (await isEditorOf(actor.id, m.venueId))) return m;
  if (m.visibility === "public") throw new Forbidden(NOT_REVIEWER_MESSAGE);
  throw new NotFound("model");
}
