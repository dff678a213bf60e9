/**
 * Builds the app for browser tests only when its sources changed since the last build the
 * harness made: a fingerprint of every source file's path, size and modification time is kept
 * in .next/restpoint-e2e-fingerprint. The build runs under a lock file so two test runs never
 * write .next at the same time. E2E_SKIP_BUILD=1 uses whatever build is there.
 */
import { execFileSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";

const ROOT = path.resolve(import.meta.dirname, "../../..");
const SOURCE_DIRS = ["app", "components", "lib", "db", "drizzle", "schemas", "types", "public"];
const SOURCE_FILES = ["next.config.ts", "instrumentation.ts", "postcss.config.mjs", "package-lock.json", "tsconfig.json"];
const FINGERPRINT = path.join(ROOT, ".next", "restpoint-e2e-fingerprint");
const LOCK = "/tmp/restpoint-build.lock";

function walk(dir: string, out: string[]): void {
  if (!existsSync(dir)) return;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) walk(full, out);
    else out.push(full);
  }
}

export function sourceFingerprint(): string {
  const files: string[] = [];
  for (const d of SOURCE_DIRS) walk(path.join(ROOT, d), files);
  for (const f of SOURCE_FILES) if (existsSync(path.join(ROOT, f))) files.push(path.join(ROOT, f));
  const h = createHash("sha256");
  for (const f of files.sort()) {
    const s = statSync(f);
    h.update(`${path.relative(ROOT, f)}\0${s.size}\0${s.mtimeMs}\n`);
  }
  return h.digest("hex");
}

export function ensureBuild(env: NodeJS.ProcessEnv): void {
  if (env.E2E_SKIP_BUILD === "1") {
    if (!existsSync(path.join(ROOT, ".next", "BUILD_ID"))) throw new Error("E2E_SKIP_BUILD=1 but there is no build in .next: run `npm run build` first.");
    return;
  }
  const wanted = sourceFingerprint();
  if (existsSync(FINGERPRINT) && readFileSync(FINGERPRINT, "utf8") === wanted && existsSync(path.join(ROOT, ".next", "BUILD_ID"))) return;
  const started = Date.now();
  // flock(1) serialises builds across processes; the fingerprint is checked again inside.
  const script = `if [ -f "${FINGERPRINT}" ] && [ "$(cat "${FINGERPRINT}")" = "${wanted}" ] && [ -f .next/BUILD_ID ]; then exit 0; fi; node node_modules/next/dist/bin/next build && printf %s "${wanted}" > "${FINGERPRINT}"`;
  try {
    execFileSync("flock", [LOCK, "sh", "-c", script], { cwd: ROOT, env: { ...env, NEXT_TELEMETRY_DISABLED: "1", NODE_ENV: "production" }, stdio: ["ignore", "pipe", "pipe"] });
  } catch (e) {
    const out = e as { stdout?: Buffer; stderr?: Buffer };
    throw new Error(`next build failed:\n${out.stdout?.toString() ?? ""}\n${out.stderr?.toString() ?? ""}`);
  }
  if (!existsSync(FINGERPRINT)) writeFileSync(FINGERPRINT, wanted);
  console.log(`[e2e] app built in ${((Date.now() - started) / 1000).toFixed(1)} s`);
}
