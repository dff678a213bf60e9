/**
 * Verification reports: stored whole (report_json, exactly as the engine produced it) and per
 * claim (claim_result rows, for lists and queries without parsing JSON), with counts.
 */
import "server-only";
import { asc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { claimResult, report } from "@/db/schema";
import type { Report } from "@/lib/engine/types";
import type { Executor } from "@/lib/audit";
import { loadVisibleVersion } from "@/lib/models";
import type { ClaimCounts, ReportView, Viewer } from "@/lib/types/deposit";

export function countClaims(r: Report): ClaimCounts {
  const counts: ClaimCounts = { confirmed: 0, contradicted: 0, inconclusive: 0 };
  for (const c of r.claims) counts[c.status] += 1;
  return counts;
}

/** Writes the report and its claim rows; call inside the transaction that finishes the job. */
export async function storeReport(exec: Executor, versionId: string, r: Report, durationMs: number | null): Promise<string> {
  const id = crypto.randomUUID();
  const counts = countClaims(r);
  await exec.insert(report).values({
    id,
    versionId,
    verdict: r.verdict,
    engineVersion: r.engine.version,
    specSha256: r.specSha256,
    confirmedCount: counts.confirmed,
    contradictedCount: counts.contradicted,
    inconclusiveCount: counts.inconclusive,
    reportJson: JSON.stringify(r),
    durationMs: durationMs === null ? null : Math.round(durationMs),
  });
  if (r.claims.length > 0) {
    await exec.insert(claimResult).values(
      r.claims.map((c, position) => ({
        reportId: id,
        position,
        claimId: c.id,
        kind: c.kind,
        status: c.status,
        // JSON has no Infinity/NaN; a non-finite deviation is stored as unknown.
        deviation: c.deviation !== undefined && Number.isFinite(c.deviation) ? c.deviation : null,
        message: c.message,
      })),
    );
  }
  return id;
}

/** The report of a version the viewer may see; null while it is not verified yet; NotFound otherwise. */
export async function getReportForVersion(versionId: string, viewer: Viewer): Promise<ReportView | null> {
  await loadVisibleVersion(versionId, viewer);
  return readReport(versionId);
}

/** No access check: for the worker (mail) and for callers that checked already. */
export async function readReport(versionId: string): Promise<ReportView | null> {
  const rows = await db.select().from(report).where(eq(report.versionId, versionId));
  const row = rows[0];
  if (row === undefined) return null;
  const claims = await db.select().from(claimResult).where(eq(claimResult.reportId, row.id)).orderBy(asc(claimResult.position));
  return {
    id: row.id,
    versionId: row.versionId,
    verdict: row.verdict,
    engineVersion: row.engineVersion,
    specSha256: row.specSha256,
    counts: { confirmed: row.confirmedCount, contradicted: row.contradictedCount, inconclusive: row.inconclusiveCount },
    durationMs: row.durationMs,
    createdAt: row.createdAt.toISOString(),
    claims: claims.map((c) => ({
      position: c.position,
      claimId: c.claimId,
      kind: c.kind,
      status: c.status,
      deviation: c.deviation,
      message: c.message,
    })),
    report: JSON.parse(row.reportJson) as Report,
  };
}
