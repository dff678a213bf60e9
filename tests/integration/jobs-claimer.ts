/**
 * Child process for the claim-atomicity test: prints "ready" once connected, waits for a line
 * on stdin (so all claimers start together), claims jobs until the queue stays empty and
 * prints the ids it got as JSON on its last line.
 * Run as: node --conditions=react-server --import tsx jobs-claimer.ts <workerId>
 */
import { migrateDatabase } from "@/db/migrate";
import { claimNext } from "@/lib/jobs";

const workerId = process.argv[2] ?? "claimer";
await migrateDatabase();
process.stdout.write("ready\n");
await new Promise<void>((resolve) => process.stdin.once("data", () => resolve()));
process.stdin.pause();
const claimed: string[] = [];
let misses = 0;
while (misses < 5) {
  const job = await claimNext(workerId, 10 * 60_000);
  if (job === null) {
    misses += 1;
    await new Promise((resolve) => setTimeout(resolve, 20));
  } else {
    misses = 0;
    claimed.push(job.id);
  }
}
process.stdout.write(`${JSON.stringify(claimed)}\n`);
