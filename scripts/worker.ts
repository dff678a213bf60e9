/**
 * `npm run worker`: a verification worker as its own process. Several may run against one
 * libSQL server. Applies migrations first; SIGTERM or SIGINT stops claiming, lets running jobs
 * finish for up to --grace-ms, gives the rest back to the queue and exits.
 *
 *   npm run worker -- [--threads N] [--lease-ms MS] [--poll-ms MS] [--grace-ms MS] [--timeout-ms MS]
 *
 * --hold-ms MS makes every run sleep first (for crash-recovery tests that kill the process mid-run).
 */
import { parseArgs } from "node:util";
import { migrateDatabase } from "@/db/migrate";
import { env } from "@/lib/env";
import { VerificationWorker } from "@/lib/worker/loop";
import { mailAuthor } from "@/lib/worker/notify";

function positiveInt(name: string, value: string | undefined, fallback: number): number {
  if (value === undefined) return fallback;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 0) {
    console.error(`--${name} takes a whole number of ${name === "threads" ? "threads" : "milliseconds"}, not "${value}".`);
    process.exit(64);
  }
  return n;
}

const { values } = parseArgs({
  options: {
    threads: { type: "string" },
    "lease-ms": { type: "string" },
    "poll-ms": { type: "string" },
    "grace-ms": { type: "string" },
    "timeout-ms": { type: "string" },
    "hold-ms": { type: "string" },
  },
  strict: true,
});

await migrateDatabase();
const graceMs = positiveInt("grace-ms", values["grace-ms"], 10_000);
const worker = new VerificationWorker({
  concurrency: Math.max(1, positiveInt("threads", values.threads, env.RESTPOINT_WORKER_THREADS)),
  leaseMs: positiveInt("lease-ms", values["lease-ms"], 60_000),
  pollMs: positiveInt("poll-ms", values["poll-ms"], 1000),
  runTimeoutMs: positiveInt("timeout-ms", values["timeout-ms"], 120_000),
  holdMs: positiveInt("hold-ms", values["hold-ms"], 0),
  notify: mailAuthor,
});
worker.start();
console.log(`[restpoint worker ${worker.workerId}] started against ${env.databaseUrl.replace(/\/\/[^@]*@/, "//")}`);

let stopping = false;
async function shutdown(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  console.log(`[restpoint worker ${worker.workerId}] ${signal}: stopping`);
  await worker.stop(graceMs);
  console.log(`[restpoint worker ${worker.workerId}] stopped`);
  process.exit(0);
}
process.on("SIGTERM", () => void shutdown("SIGTERM"));
process.on("SIGINT", () => void shutdown("SIGINT"));
