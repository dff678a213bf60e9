// Entry of every engine thread. Plain JavaScript on purpose: it must load under bare Node
// (inside `next start` as well as `npm run worker`), so it registers tsx itself and then
// imports the TypeScript task module named in workerData (default: ./engine-task.ts).
import os from "node:os";
import { fileURLToPath } from "node:url";
import { parentPort, workerData } from "node:worker_threads";
import { register } from "tsx/esm/api";

register({ tsconfig: fileURLToPath(new URL("./tsconfig.engine.json", import.meta.url)) });

// On Linux the nice value belongs to each thread, and pid 0 names the calling one: this lowers
// the priority of this engine thread only (man 2 setpriority, NOTES). Raising niceness needs no
// privilege. Elsewhere it may apply to the whole process, so it is only done on Linux.
const niceness = typeof workerData?.niceness === "number" ? workerData.niceness : 0;
if (niceness > 0 && process.platform === "linux") {
  try {
    os.setPriority(0, Math.min(19, niceness));
  } catch {
    // Not permitted here (some sandboxes): run at normal priority.
  }
}

const taskModule = typeof workerData?.taskModule === "string" ? workerData.taskModule : fileURLToPath(new URL("./engine-task.ts", import.meta.url));
const { runTask } = await import(taskModule);

parentPort?.on("message", async (message) => {
  try {
    const result = await runTask(message.task);
    parentPort?.postMessage({ id: message.id, ok: true, result });
  } catch (error) {
    parentPort?.postMessage({ id: message.id, ok: false, error: error instanceof Error ? error.message : String(error) });
  }
});
parentPort?.postMessage({ ready: true });
