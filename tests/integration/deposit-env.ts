/**
 * Imported FIRST by the deposit and job integration tests: points the app at a fresh temporary
 * data folder (SQLite file and uploads) before lib/env.ts reads the environment.
 */
import { mkdtempSync } from "node:fs";
import os from "node:os";
import path from "node:path";

export const testDir = mkdtempSync(path.join(os.tmpdir(), "restpoint-deposit-"));
export const databaseFile = path.join(testDir, "restpoint.db");
export const uploadsDir = path.join(testDir, "uploads");

process.env.DATA_DIR = testDir;
process.env.DATABASE_URL = `file:${databaseFile}`;
process.env.UPLOADS_DIR = uploadsDir;
process.env.RESTPOINT_INLINE_WORKER = "0";
// The fake SMTP server of each process (this one and spawned workers) takes a free port.
process.env.FAKE_SMTP_PORT = "0";
