/**
 * The one place that reads process.env. Everything else imports `env` from here.
 * Values are validated once; a bad value stops the process with a sentence that names it.
 */
import path from "node:path";
import { z } from "zod";

const schema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  /** libSQL URL (libsql://, http://, ws://) or file: URL; default: an embedded file under data/. */
  DATABASE_URL: z.string().min(1).optional(),
  DATABASE_AUTH_TOKEN: z.string().min(1).optional(),
  /** Folder for the embedded database and other local state. */
  DATA_DIR: z.string().min(1).default("data"),
  /** Folder that holds uploaded files by content hash. */
  UPLOADS_DIR: z.string().min(1).default("uploads"),
  BETTER_AUTH_SECRET: z.string().min(16).optional(),
  BETTER_AUTH_URL: z.url().optional(),
  /** smtp(s)://user:pass@host:port of a real server; without it the app starts the local fake. */
  SMTP_URL: z.string().min(1).optional(),
  /** Port of the local fake SMTP server (0 picks a free one). */
  FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  MAIL_FROM: z.string().min(3).default("Restpoint <no-reply@restpoint.local>"),
  /** "1" runs the verification worker inside the web process (the default); "0" leaves it to `npm run worker`. */
  RESTPOINT_INLINE_WORKER: z.enum(["0", "1"]).default("1"),
  /** "1" seeds the demo data at start when the database is empty of it. */
  RESTPOINT_DEMO: z.enum(["0", "1"]).optional(),
});

const parsed = schema.safeParse(process.env);
if (!parsed.success) {
  const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
  throw new Error(`Invalid environment:\n${lines.join("\n")}`);
}
const raw = parsed.data;

const dataDir = path.resolve(raw.DATA_DIR);

export const env = {
  ...raw,
  isProduction: raw.NODE_ENV === "production",
  isTest: raw.NODE_ENV === "test",
  dataDir,
  uploadsDir: path.resolve(raw.UPLOADS_DIR),
  databaseUrl: raw.DATABASE_URL ?? `file:${path.join(dataDir, "restpoint.db")}`,
  authUrl: raw.BETTER_AUTH_URL ?? "http://localhost:3000",
  // A fixed development secret is fine locally; production must set its own (checked in lib/auth.ts).
  authSecret: raw.BETTER_AUTH_SECRET ?? "restpoint-development-secret-not-for-production",
};
