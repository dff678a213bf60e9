/**
 * Starts the built app with `next start` on a free local port, with its own temporary data
 * folder (SQLite file, uploads), the demo data, and the fake SMTP server on a free port.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { createServer } from "node:net";
import os from "node:os";
import path from "node:path";

const ROOT = path.resolve(import.meta.dirname, "../../..");

export interface RunningApp {
  baseUrl: string;
  dataDir: string;
  databaseFile: string;
  stop(): Promise<void>;
}

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const address = s.address();
      const port = typeof address === "object" && address !== null ? address.port : 0;
      s.close(() => resolve(port));
    });
  });
}

async function waitUntilUp(url: string, child: ChildProcess, log: () => string, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`next start exited with ${child.exitCode}:\n${log()}`);
    try {
      const res = await fetch(url, { redirect: "manual" });
      if (res.status === 200) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`the app did not answer at ${url} within ${timeoutMs} ms:\n${log()}`);
}

/** `distDir`: the build folder from ensureBuild(). */
export async function startApp(distDir: string, extraEnv: Record<string, string> = {}): Promise<RunningApp> {
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const dataDir = mkdtempSync(path.join(os.tmpdir(), "restpoint-e2e-"));
  const databaseFile = path.join(dataDir, "restpoint.db");
  const env: NodeJS.ProcessEnv = {
    PATH: process.env.PATH,
    HOME: process.env.HOME,
    NODE_ENV: "production",
    NEXT_TELEMETRY_DISABLED: "1",
    NEXT_DIST_DIR: distDir,
    DATA_DIR: dataDir,
    DATABASE_URL: `file:${databaseFile}`,
    UPLOADS_DIR: path.join(dataDir, "uploads"),
    RESTPOINT_DEMO: "1",
    FAKE_SMTP_PORT: "0",
    BETTER_AUTH_SECRET: randomBytes(32).toString("hex"),
    BETTER_AUTH_URL: baseUrl,
    // The journeys sign in many times from one address; the strict limit has its own test.
    AUTH_SIGN_IN_MAX: "1000",
    AUTH_SIGN_UP_MAX: "1000",
    ...extraEnv,
  };
  let output = "";
  const child = spawn(process.execPath, [path.join(ROOT, "node_modules/next/dist/bin/next"), "start", "-p", String(port), "-H", "127.0.0.1"], {
    cwd: ROOT,
    env,
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout?.on("data", (d: Buffer) => (output += d.toString()));
  child.stderr?.on("data", (d: Buffer) => (output += d.toString()));
  try {
    await waitUntilUp(`${baseUrl}/`, child, () => output, 60_000);
  } catch (e) {
    // A server that never came up must not outlive the failed run.
    child.kill("SIGKILL");
    rmSync(dataDir, { recursive: true, force: true });
    throw e;
  }
  return {
    baseUrl,
    dataDir,
    databaseFile,
    async stop() {
      if (child.exitCode === null) {
        const exited = new Promise<void>((r) => child.once("exit", () => r()));
        child.kill("SIGTERM");
        const timer = setTimeout(() => child.kill("SIGKILL"), 5000);
        await exited;
        clearTimeout(timer);
      }
      if (process.env.E2E_KEEP_DATA !== "1") rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
