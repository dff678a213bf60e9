/**
 * A stand-in engine task for the pool and loop tests (loaded inside an engine thread):
 * the spec text says what to do.
 */
import os from "node:os";
import { threadId } from "node:worker_threads";
import { REPORT_FORMAT, type Report } from "@/lib/engine/types";
import type { EngineTask } from "@/lib/worker/types";

export async function runTask(task: EngineTask): Promise<Report> {
  const startedAt = Date.now();
  if (task.specText === "throw") throw new Error("the fixture engine refused this spec");
  if (task.specText === "spin") for (;;) { /* never returns: the pool's wall-clock guard must stop it */ }
  if (task.specText === "exit") process.exit(3);
  // This thread's own nice value (on Linux, pid 0 is the calling thread).
  if (task.specText === "nice") return { ...(await runTask({ specText: "ok" })), notes: [`nice ${os.getPriority(0)}`] };
  if (task.specText.startsWith("sleep:")) await new Promise((r) => setTimeout(r, Number(task.specText.slice(6))));
  return {
    format: REPORT_FORMAT,
    specSha256: "b".repeat(64),
    engine: { version: `fixture-thread-${threadId}` },
    verdict: "confirmed",
    errors: [],
    claims: [{ id: "c1", kind: "rest-point", status: "confirmed", message: "fixture", deviation: 0 }],
    experiments: [],
    notes: [`started ${startedAt}`],
  };
}
