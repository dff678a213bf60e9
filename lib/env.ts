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
  /** Port the web server listens on (Next reads it too); the default public address follows it. */
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  BETTER_AUTH_SECRET: z.string().min(16).optional(),
  BETTER_AUTH_URL: z.url().optional(),
  /** smtp(s)://user:pass@host:port of a real server; without it the app starts the local fake. */
  SMTP_URL: z.string().min(1).optional(),
  /** Port of the local fake SMTP server (0 picks a free one). */
  FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  MAIL_FROM: z.string().min(3).default("Restpoint <no-reply@restpoint.local>"),
  /** "1" runs the verification worker inside the web process (the default); "0" leaves it to `npm run worker`. */
  RESTPOINT_INLINE_WORKER: z.enum(["0", "1"]).default("1"),
  /** Engine threads per worker (inline or `npm run worker`); one suits a 2-core machine beside the web server. */
  RESTPOINT_WORKER_THREADS: z.coerce.number().int().min(1).max(64).default(1),
  /** "1" seeds the demo data at start when the database is empty of it. */
  RESTPOINT_DEMO: z.enum(["0", "1"]).optional(),
  /** Set by Next.js while it builds; build-time page-data collection must not need production secrets. */
  NEXT_PHASE: z.string().optional(),
  /** Sign-in attempts allowed per client address within the window (seconds). Strict by default. */
  AUTH_SIGN_IN_MAX: z.coerce.number().int().min(1).default(5),
  AUTH_SIGN_IN_WINDOW: z.coerce.number().int().min(1).default(60),
  /** Sign-up attempts allowed per client address within the window (seconds). */
  AUTH_SIGN_UP_MAX: z.coerce.number().int().min(1).default(10),
  AUTH_SIGN_UP_WINDOW: z.coerce.number().int().min(1).default(60),
});

const parsed = schema.safeParse(process.env);
if (!parsed.success) {
  const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
  throw new Error(`Invalid environment:\n${lines.join("\n")}`);
}
const raw = parsed.data;

const dataDir = path.resolve(raw.DATA_DIR);
const isProduction = raw.NODE_ENV === "production";
/** Development, tests, or a deployment that asked for demo data: the fake mail server and demo hints are on. */
const demoMode = !isProduction || raw.RESTPOINT_DEMO === "1";

export const env = {
  ...raw,
  isProduction,
  isBuild: raw.NEXT_PHASE === "phase-production-build",
  demoMode,
  /** Seed demo accounts and the demo venue at start: in development unless RESTPOINT_DEMO=0, elsewhere only with RESTPOINT_DEMO=1. */
  seedDemo: raw.RESTPOINT_DEMO === "1" || (raw.NODE_ENV === "development" && raw.RESTPOINT_DEMO !== "0"),
  /** Mail goes to the local fake SMTP server (and is captured in the database) when no real server is configured. */
  useFakeSmtp: raw.SMTP_URL === undefined && demoMode,
  isTest: raw.NODE_ENV === "test",
  dataDir,
  uploadsDir: path.resolve(raw.UPLOADS_DIR),
  databaseUrl: raw.DATABASE_URL ?? `file:${path.join(dataDir, "restpoint.db")}`,
  // The public address of the app (links in mail, citations, sign-in origin checks). Without
  // BETTER_AUTH_URL it is this machine on the port the server runs on.
  authUrl: raw.BETTER_AUTH_URL ?? `http://localhost:${raw.PORT}`,
  // A fixed development secret is fine locally; production must set its own (checked in lib/auth.ts).
  authSecret: raw.BETTER_AUTH_SECRET ?? "restpoint-development-secret-not-for-production",
};
