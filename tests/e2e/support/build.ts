/**
 * Builds the app for browser tests into a folder of its own, `.next-e2e-<fingerprint>`, where
 * the fingerprint covers every source file's path, size and modification time. A run whose
 * sources match an existing build reuses it; a run with other sources builds beside it, so a
 * rebuild never pulls files away from a server another run is still testing. Builds are
 * serialised with a lock file (two builds at once would starve this 2-core machine); older
 * e2e builds beyond the newest three are removed.
 *
 * E2E_DIST_DIR=<folder> uses that existing build as it is (for a quick re-run).
 */
import { execFileSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, readdirSync, rmSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";

export const ROOT = path.resolve(import.meta.dirname, "../../..");
const SOURCE_DIRS = ["app", "components", "lib", "db", "drizzle", "schemas", "types", "public"];
const SOURCE_FILES = ["next.config.ts", "instrumentation.ts", "postcss.config.mjs", "package-lock.json", "tsconfig.json"];
const LOCK = "/tmp/restpoint-build.lock";
const PREFIX = ".next-e2e-";
const KEEP = 3;
/** Next writes its dist folder's type paths into the tsconfig it builds with: give it a git-ignored one. */
export const E2E_TSCONFIG = "tsconfig.e2e.json";

export function writeE2eTsconfig(): void {
  const config = {
    extends: "./tsconfig.json",
    include: ["next-env.d.ts", "**/*.ts", "**/*.tsx"],
    exclude: ["node_modules", "data", "uploads", ".next", ".next-*"],
  };
  writeFileSync(path.join(ROOT, E2E_TSCONFIG), `${JSON.stringify(config, null, 2)}\n`);
}

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
  return h.digest("hex").slice(0, 16);
}

function pruneOldBuilds(keep: string): void {
  const builds = readdirSync(ROOT)
    .filter((n) => n.startsWith(PREFIX) && n !== keep)
    .map((n) => ({ n, t: statSync(path.join(ROOT, n)).mtimeMs }))
    .sort((a, b) => b.t - a.t);
  for (const old of builds.slice(KEEP - 1)) rmSync(path.join(ROOT, old.n), { recursive: true, force: true });
}

/** Returns the dist folder (relative to the project) that holds a build of the current sources. */
export function ensureBuild(env: NodeJS.ProcessEnv): string {
  const given = env.E2E_DIST_DIR;
  if (given !== undefined && given !== "") {
    if (!existsSync(path.join(ROOT, given, "BUILD_ID"))) throw new Error(`E2E_DIST_DIR=${given} holds no build.`);
    return given;
  }
  const distDir = `${PREFIX}${sourceFingerprint()}`;
  if (existsSync(path.join(ROOT, distDir, "BUILD_ID"))) return distDir;
  const started = Date.now();
  writeE2eTsconfig();
  // Inside the lock, look again: another run may have built the same sources meanwhile.
  const script = `[ -f "${distDir}/BUILD_ID" ] && exit 0; rm -rf "${distDir}"; node node_modules/next/dist/bin/next build`;
  try {
    execFileSync("flock", [LOCK, "sh", "-c", script], {
      cwd: ROOT,
      env: { ...env, NEXT_DIST_DIR: distDir, NEXT_TSCONFIG_PATH: E2E_TSCONFIG, NEXT_TELEMETRY_DISABLED: "1", NODE_ENV: "production" },
      stdio: ["ignore", "pipe", "pipe"],
    });
  } catch (e) {
    const out = e as { stdout?: Buffer; stderr?: Buffer };
    throw new Error(`next build failed:\n${out.stdout?.toString() ?? ""}\n${out.stderr?.toString() ?? ""}`);
  }
  console.log(`[e2e] app built into ${distDir} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  try {
    pruneOldBuilds(distDir);
  } catch {
    // A build another run is still using may vanish under us only if it is four builds old.
  }
  return distDir;
}
