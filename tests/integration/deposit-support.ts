/** Rows and objects the deposit and job tests build on (import ./deposit-env first). */
import { db } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { model, user, venue, venueEditor, version } from "@/db/schema";
import { REPORT_FORMAT, type ClaimResult, type Report, type Verdict } from "@/lib/engine/types";

export async function migrated(): Promise<void> {
  await migrateDatabase();
}

export async function makeUser(name: string, role: "author" | "editor" | "admin" = "author"): Promise<{ id: string; role: string; email: string }> {
  const id = crypto.randomUUID();
  const email = `${name.toLowerCase()}-${id.slice(0, 8)}@example.test`;
  await db.insert(user).values({ id, name, email, role });
  return { id, role, email };
}

export async function makeVenue(slug: string, editorIds: string[] = []): Promise<string> {
  const id = crypto.randomUUID();
  await db.insert(venue).values({ id, slug: `${slug}-${id.slice(0, 6)}`, name: slug });
  for (const userId of editorIds) await db.insert(venueEditor).values({ venueId: id, userId });
  return id;
}

/** A model with one version inserted directly (for queue tests that need no spec checking). */
export async function makeVersionRow(ownerId: string, n = 1): Promise<{ modelId: string; versionId: string }> {
  const modelId = crypto.randomUUID();
  await db.insert(model).values({ id: modelId, slug: `rp-t${modelId.slice(0, 6)}`, ownerId, title: "Queue test model" });
  const versionId = crypto.randomUUID();
  await db.insert(version).values({
    id: versionId,
    modelId,
    number: n,
    specSha256: "0".repeat(63) + String(n),
    specText: "{}",
    title: "Queue test model",
    uploadedBy: ownerId,
  });
  return { modelId, versionId };
}

export function fakeReport(verdict: Verdict = "confirmed", claims: ClaimResult[] = []): Report {
  return {
    format: REPORT_FORMAT,
    specSha256: "a".repeat(64),
    engine: { version: "0.0.0-test" },
    verdict,
    errors: [],
    claims,
    restPoints: [],
    experiments: [],
  };
}
