/**
 * Editors' decisions on a submitted version: verified, changes requested, or declined, each
 * with a comment. A decision is final (append-only, one per version and venue, enforced by
 * the unique index decision_version_venue_uq, so two editors deciding at once cannot both
 * land); it is written to the audit trail in the same transaction and mailed to the owner.
 * A "verified" decision makes a private model public (the deposit rules say an editor's
 * decision may publish it).
 */
import "server-only";
import { and, asc, desc, eq, inArray, or } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { DECISION_OUTCOMES, decision, model, report, user, venue, version, type DecisionOutcome } from "@/db/schema";
import { listAudit, recordAudit } from "@/lib/audit";
import { withBusyRetry } from "@/lib/jobs";
import type { ModelBadgeFacts, VersionBadgeFacts } from "@/lib/badges";
import type { Report, Verdict } from "@/lib/engine/types";
import { env } from "@/lib/env";
import { Conflict, Forbidden, NotFound, ValidationError } from "@/lib/errors";
import { zodDetails } from "@/lib/http";
import { publicContentChanged } from "@/lib/public-cache";
import { sendMail, type OutgoingMail } from "@/lib/mail";
import { diffSpecs, diffVerdicts, type ReportLike, type SpecDiff, type VerdictDiff } from "@/lib/spec-diff";
import {
  getVenueById,
  getVenueBySlug,
  isEditorOf,
  isUniqueViolation,
  latestSubmittedVersion,
  NOT_EDITOR_MESSAGE,
  type VenueActor,
} from "@/lib/venues";

/**
 * Decisions of this process, one at a time. libSQL's embedded driver waits for a busy
 * database synchronously, so two transactions interleaved on one event loop would block each
 * other until busy_timeout; in turn, the second sees the first's decision and gets a clear
 * Conflict. Across processes the unique index decides, and the loser gets the same Conflict.
 */
const lockSlot = globalThis as unknown as { __restpointDecisionLock?: Promise<void> };

async function oneAtATime<T>(fn: () => Promise<T>): Promise<T> {
  const previous = lockSlot.__restpointDecisionLock ?? Promise.resolve();
  let release = () => {};
  const mine = new Promise<void>((resolve) => {
    release = resolve;
  });
  lockSlot.__restpointDecisionLock = previous.then(() => mine);
  await previous;
  try {
    return await fn();
  } finally {
    release();
  }
}

/** Names the choices as the decision form labels them (components/editor/labels.ts OUTCOME_WORDS). */
export const OUTCOME_MISSING_MESSAGE = "Choose Verified, Changes requested or Declined.";
export const DECISION_INCOMPLETE_MESSAGES = {
  outcome: "Choose a decision before recording it.",
  comment: "Write a comment for the authors before recording the decision.",
  both: "Choose a decision and write a comment for the authors before recording it.",
  other: "The decision could not be recorded as sent: see the marked fields.",
} as const;

/** One plain sentence for the whole form, from the fields that failed. */
function incompleteMessage(paths: readonly string[]): string {
  const outcome = paths.includes("/outcome");
  const comment = paths.includes("/comment");
  if (outcome && comment) return DECISION_INCOMPLETE_MESSAGES.both;
  if (outcome) return DECISION_INCOMPLETE_MESSAGES.outcome;
  if (comment) return DECISION_INCOMPLETE_MESSAGES.comment;
  return DECISION_INCOMPLETE_MESSAGES.other;
}

export const decisionInputSchema = z.object({
  outcome: z.enum(DECISION_OUTCOMES, { message: OUTCOME_MISSING_MESSAGE }),
  comment: z
    .string({ message: "Write a comment for the authors." })
    .trim()
    .min(1, "Write a comment for the authors.")
    .max(5000, "At most 5000 characters."),
  /** The venue deciding; defaults to the venue the model entry names. */
  venue: z.string().trim().min(1).optional(),
});
/** Anything: a JSON body or form fields; recordDecision checks it with decisionInputSchema. */
export type DecisionInput = unknown;

export const OWN_MODEL_MESSAGE = "You cannot decide on your own model; another editor of the venue has to.";
export const NO_VENUE_DECISION_MESSAGE = "This model is not submitted to any venue.";
export const NOT_SUBMITTED_MESSAGE = (n: number, venueName: string) => `Version ${n} has not been submitted to ${venueName}.`;
export const NOT_LATEST_MESSAGE = (n: number, latest: number) =>
  `Version ${n} is not the latest submitted version of this model: version ${latest} is. Decide on version ${latest} instead.`;
export const ALREADY_DECIDED_MESSAGE = (n: number) => `A decision on version ${n} has already been recorded; decisions are final.`;
export const NO_REPORT_MESSAGE = (n: number) => `Version ${n} has no report yet; wait until the engine has re-run its claims before recording it as verified.`;
export const CONTRADICTED_MESSAGE = (n: number, verdict: string) =>
  `Version ${n} cannot be recorded as verified: its report is ${verdict}. Request changes or decline instead.`;

export const OUTCOME_LABELS: Record<DecisionOutcome, string> = {
  verified: "Verified",
  "changes-requested": "Changes requested",
  declined: "Declined",
};

export interface DecisionView {
  id: string;
  outcome: DecisionOutcome;
  comment: string;
  createdAt: string;
  versionNumber: number;
  venue: { id: string; slug: string; name: string };
  editor: { id: string; name: string };
}

/**
 * Records `actor`'s decision on version `number` of a model. Throws NotFound (the model is
 * private to others), Forbidden (not an editor of the venue, or the actor's own model),
 * Conflict (not the latest submitted version, or already decided), ValidationError.
 */
export async function recordDecision(
  actor: VenueActor,
  target: { model: string; number: number },
  input: DecisionInput,
): Promise<DecisionView> {
  const { view, ownerId, m, madePublic } = await oneAtATime(() => decide(actor, target, input));
  // Made public, or a public model's badge changed: its cached public pages go.
  if (m.visibility === "public") await publicContentChanged(m.id);
  await mailOwner(ownerId, m, view, madePublic);
  return view;
}

async function decide(
  actor: VenueActor,
  target: { model: string; number: number },
  input: DecisionInput,
): Promise<{
  view: DecisionView;
  ownerId: string;
  m: { id: string; slug: string; title: string; visibility: "private" | "public" };
  madePublic: boolean;
}> {
  const [m2] = await db
    .select()
    .from(model)
    .where(or(eq(model.slug, target.model), eq(model.id, target.model)))
    .limit(1);
  if (m2 === undefined) throw new NotFound("model");
  const editorOfModelVenue = m2.venueId !== null && (await isEditorOf(actor.id, m2.venueId));
  const mayRead = m2.visibility === "public" || m2.ownerId === actor.id || actor.role === "admin" || editorOfModelVenue;
  if (!mayRead) throw new NotFound("model");

  const parsed = decisionInputSchema.safeParse(input);
  if (!parsed.success) {
    const details = zodDetails(parsed.error);
    throw new ValidationError(incompleteMessage(details.map((d) => d.path)), details);
  }
  const fields = parsed.data;

  const v = fields.venue !== undefined ? await getVenueBySlug(fields.venue) : m2.venueId === null ? null : await getVenueById(m2.venueId);
  if (v === null) {
    if (fields.venue !== undefined) throw new NotFound("venue");
    throw new ValidationError(NO_VENUE_DECISION_MESSAGE, [{ path: "/venue", message: NO_VENUE_DECISION_MESSAGE }]);
  }
  if (!(await isEditorOf(actor.id, v.id))) throw new Forbidden(NOT_EDITOR_MESSAGE);
  if (m2.ownerId === actor.id) throw new Forbidden(OWN_MODEL_MESSAGE);

  const [ver] = await db
    .select({ id: version.id, number: version.number })
    .from(version)
    .where(and(eq(version.modelId, m2.id), eq(version.number, target.number)))
    .limit(1);
  if (ver === undefined) throw new NotFound("version");

  const latest = await latestSubmittedVersion(v.id, m2.id);
  const decidedAlready = await db.$count(decision, and(eq(decision.versionId, ver.id), eq(decision.venueId, v.id)));
  if (decidedAlready > 0) throw new Conflict(ALREADY_DECIDED_MESSAGE(ver.number));
  if (latest === null) throw new Conflict(NOT_SUBMITTED_MESSAGE(ver.number, v.name));
  if (latest.number !== ver.number) {
    // Either an older version, or one that was never put before this venue.
    if (latest.number > ver.number) throw new Conflict(NOT_LATEST_MESSAGE(ver.number, latest.number));
    throw new Conflict(NOT_SUBMITTED_MESSAGE(ver.number, v.name));
  }

  if (fields.outcome === "verified") {
    const [r] = await db.select({ verdict: report.verdict }).from(report).where(eq(report.versionId, ver.id)).limit(1);
    if (r === undefined) throw new Conflict(NO_REPORT_MESSAGE(ver.number));
    if (r.verdict === "contradicted" || r.verdict === "invalid") throw new Conflict(CONTRADICTED_MESSAGE(ver.number, r.verdict));
  }

  const id = crypto.randomUUID();
  const madePublic = fields.outcome === "verified" && m2.visibility === "private";
  try {
    // A write lock held elsewhere for longer than the busy timeout is waited out, not reported.
    await withBusyRetry(() => db.transaction(async (tx) => {
      await tx.insert(decision).values({
        id,
        venueId: v.id,
        modelId: m2.id,
        versionId: ver.id,
        editorId: actor.id,
        outcome: fields.outcome,
        comment: fields.comment,
      });
      if (madePublic) await tx.update(model).set({ visibility: "public" }).where(eq(model.id, m2.id));
      await recordAudit(
        {
          actorId: actor.id,
          action: "decision.recorded",
          modelId: m2.id,
          versionId: ver.id,
          venueId: v.id,
          detail: { outcome: fields.outcome, comment: fields.comment, number: ver.number, venue: v.slug, madePublic },
        },
        tx,
      );
    }));
  } catch (e) {
    if (isUniqueViolation(e)) throw new Conflict(ALREADY_DECIDED_MESSAGE(ver.number));
    throw e;
  }

  const [editor] = await db.select({ name: user.name }).from(user).where(eq(user.id, actor.id)).limit(1);
  const view: DecisionView = {
    id,
    outcome: fields.outcome,
    comment: fields.comment,
    createdAt: new Date().toISOString(),
    versionNumber: ver.number,
    venue: { id: v.id, slug: v.slug, name: v.name },
    editor: { id: actor.id, name: editor?.name ?? "" },
  };
  const visibility = madePublic ? "public" : m2.visibility;
  return { view, ownerId: m2.ownerId, m: { id: m2.id, slug: m2.slug, title: m2.title, visibility }, madePublic };
}

/** The mail the owner receives (exported for its test). */
export function decisionMail(
  to: { name: string; email: string },
  m: { slug: string; title: string },
  d: Pick<DecisionView, "outcome" | "comment" | "versionNumber" | "venue">,
  madePublic: boolean,
  baseUrl: string = env.authUrl,
): OutgoingMail {
  const url = `${baseUrl.replace(/\/$/, "")}/workspace/models/${encodeURIComponent(m.slug)}/v/${d.versionNumber}`;
  const lines = [
    `Hello ${to.name},`,
    "",
    `An editor of ${d.venue.name} recorded a decision on version ${d.versionNumber} of "${m.title}" (${m.slug}):`,
    "",
    `  ${OUTCOME_LABELS[d.outcome]}`,
    "",
    "Comment from the editor:",
    ...d.comment.split("\n").map((l) => `  ${l}`),
    "",
    ...(d.outcome === "changes-requested" ? ["Upload a new version of the spec to answer; it will be checked and put before the editors again.", ""] : []),
    ...(madePublic ? ["The model is now public in the Restpoint registry.", ""] : []),
    "The version and its report:",
    url,
    "",
    "Restpoint",
  ];
  return {
    to: to.email,
    subject: `${OUTCOME_LABELS[d.outcome]}: version ${d.versionNumber} of ${m.title}`,
    text: lines.join("\n"),
  };
}

async function mailOwner(ownerId: string, m: { slug: string; title: string }, d: DecisionView, madePublic: boolean): Promise<void> {
  const [owner] = await db.select({ name: user.name, email: user.email }).from(user).where(eq(user.id, ownerId)).limit(1);
  if (owner === undefined) return;
  try {
    await sendMail(decisionMail(owner, m, d, madePublic));
  } catch (e) {
    // The decision stands even when the mail server is down; the owner sees it in the workspace.
    console.error("[restpoint] decision mail failed:", e);
  }
}

/** Decisions on a model (newest first), for the version and review pages. No access check. */
export async function listDecisionsForModel(modelId: string): Promise<DecisionView[]> {
  const rows = await db
    .select({ d: decision, number: version.number, vSlug: venue.slug, vName: venue.name, editorName: user.name })
    .from(decision)
    .innerJoin(version, eq(version.id, decision.versionId))
    .innerJoin(venue, eq(venue.id, decision.venueId))
    .innerJoin(user, eq(user.id, decision.editorId))
    .where(eq(decision.modelId, modelId))
    .orderBy(desc(decision.createdAt), asc(decision.id));
  return rows.map((r) => ({
    id: r.d.id,
    outcome: r.d.outcome,
    comment: r.d.comment,
    createdAt: r.d.createdAt.toISOString(),
    versionNumber: r.number,
    venue: { id: r.d.venueId, slug: r.vSlug, name: r.vName },
    editor: { id: r.d.editorId, name: r.editorName },
  }));
}

/** The latest decided version of a model (for its badge), with its report's facts; null when none. */
export async function latestDecidedVersion(modelId: string): Promise<{
  number: number;
  versionId: string;
  specSha256: string;
  outcome: DecisionOutcome;
  venueName: string;
} | null> {
  const [row] = await db
    .select({ number: version.number, versionId: version.id, specSha256: version.specSha256, outcome: decision.outcome, venueName: venue.name })
    .from(decision)
    .innerJoin(version, eq(version.id, decision.versionId))
    .innerJoin(venue, eq(venue.id, decision.venueId))
    .where(eq(decision.modelId, modelId))
    .orderBy(desc(version.number), desc(decision.createdAt))
    .limit(1);
  return row ?? null;
}

// ---------------------------------------------------------------------------
// Badge facts
// ---------------------------------------------------------------------------

export interface BadgeSource {
  modelId: string;
  slug: string;
  ownerId: string;
  venueId: string | null;
  visibility: "private" | "public";
}

async function badgeModel(slug: string): Promise<BadgeSource | null> {
  const [m] = await db
    .select({ modelId: model.id, slug: model.slug, ownerId: model.ownerId, venueId: model.venueId, visibility: model.visibility })
    .from(model)
    .where(eq(model.slug, slug))
    .limit(1);
  return m ?? null;
}

async function versionFacts(versionId: string): Promise<{
  verdict: VersionBadgeFacts["verdict"];
  counts: VersionBadgeFacts["counts"];
  decision: DecisionOutcome | null;
  venueName: string | null;
}> {
  const [r] = await db
    .select({ verdict: report.verdict, confirmed: report.confirmedCount, contradicted: report.contradictedCount, inconclusive: report.inconclusiveCount })
    .from(report)
    .where(eq(report.versionId, versionId))
    .limit(1);
  const [d] = await db
    .select({ outcome: decision.outcome, venueName: venue.name })
    .from(decision)
    .innerJoin(venue, eq(venue.id, decision.venueId))
    .where(eq(decision.versionId, versionId))
    .orderBy(desc(decision.createdAt))
    .limit(1);
  return {
    verdict: r?.verdict ?? null,
    counts: r === undefined ? null : { confirmed: r.confirmed, contradicted: r.contradicted, inconclusive: r.inconclusive },
    decision: d?.outcome ?? null,
    venueName: d?.venueName ?? null,
  };
}

/**
 * What the version badge shows, and whether it can never change again: once the version has
 * its report and a decision (both append-only), its badge is immutable.
 */
export async function versionBadgeSource(
  slug: string,
  number: number,
): Promise<{ model: BadgeSource; facts: VersionBadgeFacts; final: boolean } | null> {
  const m = await badgeModel(slug);
  if (m === null) return null;
  const [v] = await db
    .select({ id: version.id, number: version.number, specSha256: version.specSha256 })
    .from(version)
    .where(and(eq(version.modelId, m.modelId), eq(version.number, number)))
    .limit(1);
  if (v === undefined) return null;
  const f = await versionFacts(v.id);
  return {
    model: m,
    facts: { slug: m.slug, number: v.number, specSha256: v.specSha256, ...f },
    final: f.verdict !== null && f.decision !== null,
  };
}

/** What the model badge shows: its latest decided version (by version number). */
export async function modelBadgeSource(slug: string): Promise<{ model: BadgeSource; facts: ModelBadgeFacts } | null> {
  const m = await badgeModel(slug);
  if (m === null) return null;
  const latest = await latestDecidedVersion(m.modelId);
  if (latest === null) return { model: m, facts: { slug: m.slug, latestDecided: null } };
  const f = await versionFacts(latest.versionId);
  return {
    model: m,
    facts: { slug: m.slug, latestDecided: { number: latest.number, specSha256: latest.specSha256, ...f } },
  };
}

// ---------------------------------------------------------------------------
// Audit trail and comparison of a model (callers check access with loadModelForReview)
// ---------------------------------------------------------------------------

export interface AuditLine {
  id: number;
  at: string;
  action: string;
  actor: { id: string; name: string } | null;
  versionNumber: number | null;
  venue: { slug: string; name: string } | null;
  detail: Record<string, unknown>;
}

/** The model's audit trail, oldest first, with actor names, version numbers and venues. */
export async function auditTrailForModel(modelId: string, limit = 500): Promise<AuditLine[]> {
  const entries = await listAudit({ modelId, limit });
  const userIds = [...new Set(entries.map((e) => e.actorId).filter((x): x is string => x !== null))];
  const versionIds = [...new Set(entries.map((e) => e.versionId).filter((x): x is string => x !== null))];
  const venueIds = [...new Set(entries.map((e) => e.venueId).filter((x): x is string => x !== null))];
  const users = userIds.length === 0 ? [] : await db.select({ id: user.id, name: user.name }).from(user).where(inArray(user.id, userIds));
  const versions = versionIds.length === 0 ? [] : await db.select({ id: version.id, number: version.number }).from(version).where(inArray(version.id, versionIds));
  const venues = venueIds.length === 0 ? [] : await db.select({ id: venue.id, slug: venue.slug, name: venue.name }).from(venue).where(inArray(venue.id, venueIds));
  const userBy = new Map(users.map((u) => [u.id, u]));
  const versionBy = new Map(versions.map((v) => [v.id, v.number]));
  const venueBy = new Map(venues.map((v) => [v.id, { slug: v.slug, name: v.name }]));
  return entries
    .map((e) => ({
      id: e.id,
      at: e.at,
      action: e.action,
      actor: e.actorId === null ? null : (userBy.get(e.actorId) ?? { id: e.actorId, name: "(deleted account)" }),
      versionNumber: e.versionId === null ? null : (versionBy.get(e.versionId) ?? null),
      venue: e.venueId === null ? null : (venueBy.get(e.venueId) ?? null),
      detail: e.detail,
    }))
    .sort((a, b) => a.id - b.id);
}

export interface Comparison {
  from: { number: number; specSha256: string; createdAt: string; verdict: Verdict | null };
  to: { number: number; specSha256: string; createdAt: string; verdict: Verdict | null };
  spec: SpecDiff;
  verdicts: VerdictDiff;
  /** A side whose stored text is not JSON (cannot happen for stored versions; kept honest). */
  unreadable: number[];
}

export const SAME_VERSION_MESSAGE = "Choose two different versions to compare.";

/** Spec and verdict diff between versions `from` and `to` of a model. */
export async function compareVersions(modelId: string, from: number, to: number): Promise<Comparison> {
  if (from === to) throw new ValidationError(SAME_VERSION_MESSAGE, [{ path: "/to", message: SAME_VERSION_MESSAGE }]);
  const rows = await db
    .select({ id: version.id, number: version.number, specSha256: version.specSha256, specText: version.specText, createdAt: version.createdAt })
    .from(version)
    .where(and(eq(version.modelId, modelId), inArray(version.number, [from, to])));
  const a = rows.find((r) => r.number === from);
  const b = rows.find((r) => r.number === to);
  if (a === undefined || b === undefined) throw new NotFound("version", `No version ${a === undefined ? from : to} of this model.`);
  const reports = await db.select({ versionId: report.versionId, json: report.reportJson }).from(report).where(inArray(report.versionId, [a.id, b.id]));
  const reportOf = (id: string): ReportLike | null => {
    const r = reports.find((x) => x.versionId === id);
    if (r === undefined) return null;
    const parsed = JSON.parse(r.json) as Report;
    return { verdict: parsed.verdict, claims: parsed.claims };
  };
  const unreadable: number[] = [];
  const parse = (text: string, n: number): unknown => {
    try {
      return JSON.parse(text);
    } catch {
      unreadable.push(n);
      return text;
    }
  };
  const ra = reportOf(a.id);
  const rb = reportOf(b.id);
  const d = diffSpecs(parse(a.specText, a.number), parse(b.specText, b.number));
  return {
    from: { number: a.number, specSha256: a.specSha256, createdAt: a.createdAt.toISOString(), verdict: ra?.verdict ?? null },
    to: { number: b.number, specSha256: b.specSha256, createdAt: b.createdAt.toISOString(), verdict: rb?.verdict ?? null },
    spec: { rows: d.rows, added: d.added, removed: d.removed, identical: d.identical },
    verdicts: diffVerdicts(ra, rb),
    unreadable,
  };
}
