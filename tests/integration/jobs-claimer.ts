/**
 * Child process for the claim-atomicity test: claims jobs until the queue stays empty and
 * prints the ids it got as JSON. Run as: node --conditions=react-server --import tsx jobs-claimer.ts <workerId> <startAtMs>
 */
import { migrateDatabase } from "@/db/migrate";
import { claimNext } from "@/lib/jobs";

const workerId = process.argv[2] ?? "claimer";
// All claimers start at the same wall-clock moment so they really compete.
const startAt = Number(process.argv[3] ?? "0");
await migrateDatabase();
await new Promise((resolve) => setTimeout(resolve, Math.max(0, startAt - Date.now())));
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
process.stdout.write(JSON.stringify(claimed));
