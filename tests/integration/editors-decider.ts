/**
 * Child process for the cross-process decision test: prints "ready" once connected, waits for
 * a line on stdin (so both deciders start together), then records a decision on each model
 * given and prints, as JSON on its last line, "ok" or the error's class and message per model.
 * Run as: node --conditions=react-server --import tsx editors-decider.ts <editorId> <slug...>
 */
import { migrateDatabase } from "@/db/migrate";
import { recordDecision } from "@/lib/decisions";

const [editorId = "", ...slugs] = process.argv.slice(2);
await migrateDatabase();
process.stdout.write("ready\n");
await new Promise<void>((resolve) => process.stdin.once("data", () => resolve()));
process.stdin.pause();
const results: Record<string, string> = {};
for (const slug of slugs) {
  try {
    await recordDecision({ id: editorId, role: "editor" }, { model: slug, number: 1 }, { outcome: "declined", comment: `declined by ${editorId}` });
    results[slug] = "ok";
  } catch (e) {
    results[slug] = e instanceof Error ? `${e.name}: ${e.message}` : String(e);
  }
}
process.stdout.write(`${JSON.stringify(results)}\n`);
process.exit(0);
