/**
 * Imported FIRST by the app frame's integration tests: a fresh temporary data folder (SQLite
 * file) and the fake SMTP server on a free port, set before lib/env.ts reads the environment.
 */
import { mkdtempSync } from "node:fs";
import os from "node:os";
import path from "node:path";

export const testDir = mkdtempSync(path.join(os.tmpdir(), "restpoint-app-"));

process.env.DATA_DIR = testDir;
process.env.DATABASE_URL = `file:${path.join(testDir, "restpoint.db")}`;
process.env.UPLOADS_DIR = path.join(testDir, "uploads");
process.env.FAKE_SMTP_PORT = "0";
process.env.RESTPOINT_INLINE_WORKER = "0";
process.env.BETTER_AUTH_URL = "http://localhost:3000";
