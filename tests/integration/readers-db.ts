/**
 * A fresh SQLite file per test file for the readers' integration tests. Import this module
 * before anything that reads lib/env.ts: it points DATA_DIR and DATABASE_URL at a temp folder.
 */
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";

export const tempDir = mkdtempSync(path.join(os.tmpdir(), "rp-readers-test-"));
process.env.DATA_DIR = tempDir;
process.env.UPLOADS_DIR = path.join(tempDir, "uploads");
process.env.DATABASE_URL = `file:${path.join(tempDir, "restpoint.db")}`;
process.env.FAKE_SMTP_PORT = "0";
process.env.RESTPOINT_INLINE_WORKER = "0";

export async function setUpDatabase(): Promise<void> {
  const { migrateDatabase } = await import("@/db/migrate");
  await migrateDatabase();
}

export function removeTempDir(): void {
  rmSync(tempDir, { recursive: true, force: true });
}
