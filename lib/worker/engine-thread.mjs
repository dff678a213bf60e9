// Entry of every engine thread. Plain JavaScript on purpose: it must load under bare Node
// (inside `next start` as well as `npm run worker`), so it registers tsx itself and then
// imports the TypeScript task module named in workerData (default: ./engine-task.ts).
import { fileURLToPath } from "node:url";
import { parentPort, workerData } from "node:worker_threads";
import { register } from "tsx/esm/api";

register({ tsconfig: fileURLToPath(new URL("./tsconfig.engine.json", import.meta.url)) });

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
