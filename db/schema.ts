/**
 * The whole database, one table per concept. Types only: importing this never opens a
 * connection (the client lives in db/client.ts).
 *
 * Conventions: text ids (random UUIDs, or better-auth's own ids), timestamps as integer
 * milliseconds (`timestamp_ms`), snake_case column names, camelCase keys.
 * Rows that record history (versions, reports, decisions, audit events) are never updated
 * or deleted; the migration adds triggers that enforce it for the audit trail.
 */
import { sql } from "drizzle-orm";
import {
  index,
  integer,
  primaryKey,
  real,
  sqliteTable,
  text,
  uniqueIndex,
} from "drizzle-orm/sqlite-core";

const id = () =>
  text("id")
    .primaryKey()
    .$defaultFn(() => crypto.randomUUID());
const createdAt = () =>
  integer("created_at", { mode: "timestamp_ms" })
    .notNull()
    .default(sql`(unixepoch('subsec') * 1000)`);
const updatedAt = () =>
  integer("updated_at", { mode: "timestamp_ms" })
    .notNull()
    .default(sql`(unixepoch('subsec') * 1000)`)
    .$onUpdate(() => new Date());

// ---------------------------------------------------------------------------
// Accounts (better-auth's tables, with the admin plugin's fields)
// ---------------------------------------------------------------------------

export const ROLES = ["author", "editor", "admin"] as const;
export type Role = (typeof ROLES)[number];

export const user = sqliteTable("user", {
  id: text("id").primaryKey(),
  name: text("name").notNull(),
  email: text("email").notNull().unique(),
  emailVerified: integer("email_verified", { mode: "boolean" }).notNull().default(false),
  image: text("image"),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
  role: text("role").notNull().default("author"),
  banned: integer("banned", { mode: "boolean" }).default(false),
  banReason: text("ban_reason"),
  banExpires: integer("ban_expires", { mode: "timestamp_ms" }),
});

export const session = sqliteTable(
  "session",
  {
    id: text("id").primaryKey(),
    expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
    token: text("token").notNull().unique(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ipAddress: text("ip_address"),
    userAgent: text("user_agent"),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    impersonatedBy: text("impersonated_by"),
  },
  (t) => [index("session_user_idx").on(t.userId)],
);

export const account = sqliteTable(
  "account",
  {
    id: text("id").primaryKey(),
    accountId: text("account_id").notNull(),
    providerId: text("provider_id").notNull(),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    accessToken: text("access_token"),
    refreshToken: text("refresh_token"),
    idToken: text("id_token"),
    accessTokenExpiresAt: integer("access_token_expires_at", { mode: "timestamp_ms" }),
    refreshTokenExpiresAt: integer("refresh_token_expires_at", { mode: "timestamp_ms" }),
    scope: text("scope"),
    password: text("password"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("account_user_idx").on(t.userId)],
);

export const verification = sqliteTable(
  "verification",
  {
    id: text("id").primaryKey(),
    identifier: text("identifier").notNull(),
    value: text("value").notNull(),
    expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("verification_identifier_idx").on(t.identifier)],
);

/** better-auth's rate-limit store (`rateLimit.storage: "database"`), shared by every app process. */
export const rateLimit = sqliteTable("rate_limit", {
  id: text("id").primaryKey(),
  key: text("key").notNull().unique(),
  count: integer("count").notNull(),
  lastRequest: integer("last_request").notNull(),
});

/** Personal API tokens: only a SHA-256 of the secret is stored; `prefix` lets a user tell them apart. */
export const apiToken = sqliteTable(
  "api_token",
  {
    id: id(),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    prefix: text("prefix").notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    createdAt: createdAt(),
    lastUsedAt: integer("last_used_at", { mode: "timestamp_ms" }),
    revokedAt: integer("revoked_at", { mode: "timestamp_ms" }),
  },
  (t) => [index("api_token_user_idx").on(t.userId)],
);

// ---------------------------------------------------------------------------
// Venues and their editors
// ---------------------------------------------------------------------------

export const venue = sqliteTable("venue", {
  id: id(),
  slug: text("slug").notNull().unique(),
  name: text("name").notNull(),
  description: text("description").notNull().default(""),
  createdAt: createdAt(),
});

export const venueEditor = sqliteTable(
  "venue_editor",
  {
    venueId: text("venue_id")
      .notNull()
      .references(() => venue.id, { onDelete: "cascade" }),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.venueId, t.userId] }), index("venue_editor_user_idx").on(t.userId)],
);

// ---------------------------------------------------------------------------
// Models, immutable versions, files
// ---------------------------------------------------------------------------

export const VISIBILITIES = ["private", "public"] as const;
export type Visibility = (typeof VISIBILITIES)[number];

export const model = sqliteTable(
  "model",
  {
    id: id(),
    /** Short public handle used in URLs, e.g. "rp-7f3k2q". */
    slug: text("slug").notNull().unique(),
    ownerId: text("owner_id")
      .notNull()
      .references(() => user.id),
    title: text("title").notNull(),
    summary: text("summary").notNull().default(""),
    manuscriptTitle: text("manuscript_title"),
    doi: text("doi"),
    url: text("url"),
    year: integer("year"),
    venueId: text("venue_id").references(() => venue.id),
    visibility: text("visibility", { enum: VISIBILITIES }).notNull().default("private"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("model_owner_idx").on(t.ownerId),
    index("model_venue_idx").on(t.venueId),
    index("model_visibility_idx").on(t.visibility),
  ],
);

export const modelAuthor = sqliteTable(
  "model_author",
  {
    modelId: text("model_id")
      .notNull()
      .references(() => model.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    name: text("name").notNull(),
    orcid: text("orcid"),
    affiliation: text("affiliation"),
  },
  (t) => [primaryKey({ columns: [t.modelId, t.position] })],
);

/** Every stored blob: kept under uploads/ by content hash; `originalName` is metadata only. */
export const file = sqliteTable(
  "file",
  {
    id: id(),
    sha256: text("sha256").notNull(),
    size: integer("size").notNull(),
    mediaType: text("media_type").notNull(),
    originalName: text("original_name").notNull(),
    modelId: text("model_id").references(() => model.id, { onDelete: "cascade" }),
    /** The version a supplementary file was attached to, or the version whose spec this is. */
    versionId: text("version_id"),
    purpose: text("purpose", { enum: ["spec", "supplement"] }).notNull(),
    uploadedBy: text("uploaded_by")
      .notNull()
      .references(() => user.id),
    createdAt: createdAt(),
  },
  (t) => [index("file_model_idx").on(t.modelId), index("file_sha_idx").on(t.sha256)],
);

/** Immutable: a new spec upload makes a new row with the next number. */
export const version = sqliteTable(
  "version",
  {
    id: id(),
    modelId: text("model_id")
      .notNull()
      .references(() => model.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    specSha256: text("spec_sha256").notNull(),
    /** The spec exactly as uploaded (for line numbers and downloads). */
    specText: text("spec_text").notNull(),
    specFileId: text("spec_file_id").references(() => file.id),
    /** Copied from the spec at upload, for search without parsing JSON. */
    title: text("title").notNull(),
    strategyNames: text("strategy_names").notNull().default(""),
    dynamicsKind: text("dynamics_kind").notNull().default("replicator"),
    uploadedBy: text("uploaded_by")
      .notNull()
      .references(() => user.id),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("version_model_number_uq").on(t.modelId, t.number),
    uniqueIndex("version_model_sha_uq").on(t.modelId, t.specSha256),
  ],
);

// ---------------------------------------------------------------------------
// Verification: durable jobs, reports, per-claim results
// ---------------------------------------------------------------------------

export const JOB_STATES = ["queued", "running", "finished", "failed"] as const;
export type JobState = (typeof JOB_STATES)[number];

export const job = sqliteTable(
  "job",
  {
    id: id(),
    versionId: text("version_id")
      .notNull()
      .references(() => version.id, { onDelete: "cascade" }),
    state: text("state", { enum: JOB_STATES }).notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    maxAttempts: integer("max_attempts").notNull().default(3),
    /** Which worker holds the lease, and until when; an expired lease may be claimed again. */
    leaseOwner: text("lease_owner"),
    leaseExpiresAt: integer("lease_expires_at", { mode: "timestamp_ms" }),
    /** Not to be claimed before this time (back-off after a failed attempt). */
    runAfter: integer("run_after", { mode: "timestamp_ms" }).notNull().default(sql`0`),
    lastError: text("last_error"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    startedAt: integer("started_at", { mode: "timestamp_ms" }),
    finishedAt: integer("finished_at", { mode: "timestamp_ms" }),
  },
  (t) => [index("job_state_idx").on(t.state, t.runAfter), index("job_version_idx").on(t.versionId)],
);

export const VERDICTS = ["confirmed", "contradicted", "inconclusive", "invalid"] as const;

export const report = sqliteTable(
  "report",
  {
    id: id(),
    versionId: text("version_id")
      .notNull()
      .references(() => version.id, { onDelete: "cascade" }),
    verdict: text("verdict", { enum: VERDICTS }).notNull(),
    engineVersion: text("engine_version").notNull(),
    specSha256: text("spec_sha256").notNull(),
    confirmedCount: integer("confirmed_count").notNull().default(0),
    contradictedCount: integer("contradicted_count").notNull().default(0),
    inconclusiveCount: integer("inconclusive_count").notNull().default(0),
    /** The report exactly as the engine produced it (restpoint/report@1 JSON). */
    reportJson: text("report_json").notNull(),
    durationMs: integer("duration_ms"),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("report_version_uq").on(t.versionId)],
);

export const claimResult = sqliteTable(
  "claim_result",
  {
    reportId: text("report_id")
      .notNull()
      .references(() => report.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    claimId: text("claim_id").notNull(),
    kind: text("kind").notNull(),
    status: text("status", { enum: ["confirmed", "contradicted", "inconclusive"] }).notNull(),
    deviation: real("deviation"),
    message: text("message").notNull(),
  },
  (t) => [primaryKey({ columns: [t.reportId, t.position] })],
);

// ---------------------------------------------------------------------------
// Editorial work: submissions, decisions, the audit trail
// ---------------------------------------------------------------------------

/** A version put before a venue; the newest submission of a model is the one editors decide on. */
export const submission = sqliteTable(
  "submission",
  {
    id: id(),
    venueId: text("venue_id")
      .notNull()
      .references(() => venue.id),
    modelId: text("model_id")
      .notNull()
      .references(() => model.id, { onDelete: "cascade" }),
    versionId: text("version_id")
      .notNull()
      .references(() => version.id, { onDelete: "cascade" }),
    submittedBy: text("submitted_by")
      .notNull()
      .references(() => user.id),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("submission_venue_version_uq").on(t.venueId, t.versionId),
    index("submission_venue_idx").on(t.venueId, t.createdAt),
    index("submission_model_idx").on(t.modelId),
  ],
);

export const DECISION_OUTCOMES = ["verified", "changes-requested", "declined"] as const;
export type DecisionOutcome = (typeof DECISION_OUTCOMES)[number];

/** One decision per version and venue (the unique index makes a second, concurrent one fail). */
export const decision = sqliteTable(
  "decision",
  {
    id: id(),
    venueId: text("venue_id")
      .notNull()
      .references(() => venue.id),
    modelId: text("model_id")
      .notNull()
      .references(() => model.id, { onDelete: "cascade" }),
    versionId: text("version_id")
      .notNull()
      .references(() => version.id, { onDelete: "cascade" }),
    editorId: text("editor_id")
      .notNull()
      .references(() => user.id),
    outcome: text("outcome", { enum: DECISION_OUTCOMES }).notNull(),
    comment: text("comment").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("decision_version_venue_uq").on(t.versionId, t.venueId),
    index("decision_model_idx").on(t.modelId, t.createdAt),
  ],
);

/** Append-only: triggers in the migrations refuse UPDATE and DELETE. */
export const auditEvent = sqliteTable(
  "audit_event",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    at: createdAt(),
    actorId: text("actor_id"),
    action: text("action").notNull(),
    modelId: text("model_id"),
    versionId: text("version_id"),
    venueId: text("venue_id"),
    /** JSON with the details of what happened. */
    detail: text("detail").notNull().default("{}"),
  },
  (t) => [index("audit_model_idx").on(t.modelId, t.at), index("audit_venue_idx").on(t.venueId, t.at)],
);

// ---------------------------------------------------------------------------
// Mail captured by the local fake SMTP server (development and tests)
// ---------------------------------------------------------------------------

export const capturedMail = sqliteTable(
  "captured_mail",
  {
    id: id(),
    messageId: text("message_id"),
    from: text("from_address").notNull(),
    to: text("to_addresses").notNull(),
    subject: text("subject").notNull(),
    text: text("text_body").notNull().default(""),
    html: text("html_body"),
    raw: text("raw").notNull(),
    receivedAt: createdAt(),
  },
  (t) => [index("captured_mail_received_idx").on(t.receivedAt)],
);
