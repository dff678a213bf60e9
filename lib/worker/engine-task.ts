/**
 * Runs inside an engine thread (see engine-thread.mjs): one spec text in, one report out.
 * Imports only the engine, never the database or Next.js.
 */
import { verifySpecText } from "@/lib/engine/verify";
import type { Report } from "@/lib/engine/types";
import type { EngineTask } from "./types";

export async function runTask(task: EngineTask): Promise<Report> {
  const holdMs = task.holdMs ?? 0;
  if (holdMs > 0) await new Promise((resolve) => setTimeout(resolve, holdMs));
  return verifySpecText(task.specText, { budget: task.budget });
}
