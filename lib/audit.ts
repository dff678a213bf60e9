/**
 * The audit trail: an append-only list of what happened to models, versions and venues
 * (uploads, token changes, job failures, editors' decisions). The database refuses UPDATE
 * and DELETE on audit_event (triggers in drizzle/0001), so this module only appends and reads.
 */
import "server-only";
import { and, desc, eq, type SQL } from "drizzle-orm";
import { db, type Database } from "@/db/client";
import { auditEvent } from "@/db/schema";

/** The database or an open transaction: writers take either so callers can join their own transaction. */
export type Executor = Database | Parameters<Parameters<Database["transaction"]>[0]>[0];

export const AUDIT_ACTIONS = [
  "model.created",
  "model.updated",
  "version.uploaded",
  "file.attached",
  "job.failed",
  "token.created",
  "token.revoked",
  "decision.recorded",
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

export interface AuditInput {
  actorId: string | null;
  action: AuditAction;
  modelId?: string | null;
  versionId?: string | null;
  venueId?: string | null;
  detail?: Record<string, unknown>;
}

export interface AuditEntry {
  id: number;
  at: string;
  actorId: string | null;
  action: string;
  modelId: string | null;
  versionId: string | null;
  venueId: string | null;
  detail: Record<string, unknown>;
}

/** Appends one event; pass the caller's transaction so the event commits (or not) with the change. */
export async function recordAudit(input: AuditInput, exec: Executor = db): Promise<void> {
  await exec.insert(auditEvent).values({
    actorId: input.actorId,
    action: input.action,
    modelId: input.modelId ?? null,
    versionId: input.versionId ?? null,
    venueId: input.venueId ?? null,
    detail: JSON.stringify(input.detail ?? {}),
  });
}

/** Newest first. Filter by model and/or venue; callers check that the viewer may see them. */
export async function listAudit(filter: {
  modelId?: string;
  venueId?: string;
  limit?: number;
}): Promise<AuditEntry[]> {
  const conditions: SQL[] = [];
  if (filter.modelId !== undefined) conditions.push(eq(auditEvent.modelId, filter.modelId));
  if (filter.venueId !== undefined) conditions.push(eq(auditEvent.venueId, filter.venueId));
  const rows = await db
    .select()
    .from(auditEvent)
    .where(conditions.length > 0 ? and(...conditions) : undefined)
    .orderBy(desc(auditEvent.id))
    .limit(filter.limit ?? 100);
  return rows.map((r) => ({
    id: r.id,
    at: r.at.toISOString(),
    actorId: r.actorId,
    action: r.action,
    modelId: r.modelId,
    versionId: r.versionId,
    venueId: r.venueId,
    detail: parseDetail(r.detail),
  }));
}

function parseDetail(text: string): Record<string, unknown> {
  try {
    const value: unknown = JSON.parse(text);
    return typeof value === "object" && value !== null && !Array.isArray(value)
      ? (value as Record<string, unknown>)
      : { value };
  } catch {
    return { raw: text };
  }
}
