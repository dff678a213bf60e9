import "./deposit-env";
import { spawn } from "node:child_process";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { enqueueJob, getJob } from "@/lib/jobs";
import { makeUser, makeVersionRow, migrated } from "./deposit-support";

beforeAll(async () => {
  await migrated();
});

function runClaimer(workerId: string, startAt: number): Promise<{ ids: string[]; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(
      process.execPath,
      ["--conditions=react-server", "--import", "tsx", path.join(import.meta.dirname, "jobs-claimer.ts"), workerId, String(startAt)],
      { cwd: path.resolve(import.meta.dirname, "../.."), env: process.env, stdio: ["ignore", "pipe", "pipe"] },
    );
    let out = "";
    let err = "";
    child.stdout.on("data", (d: Buffer) => (out += d.toString()));
    child.stderr.on("data", (d: Buffer) => (err += d.toString()));
    child.on("error", reject);
    child.on("exit", (code) => {
      if (code !== 0) reject(new Error(`claimer ${workerId} exited with ${code}: ${err}`));
      else resolve({ ids: JSON.parse(out) as string[], stderr: err });
    });
  });
}

describe("claiming from several processes", () => {
  it("hands each job to exactly one of three concurrent worker processes", async () => {
    const owner = await makeUser("Concurrent");
    const jobIds: string[] = [];
    for (let i = 0; i < 150; i++) {
      const { versionId } = await makeVersionRow(owner.id);
      jobIds.push((await enqueueJob(versionId)).id);
    }
    const startAt = Date.now() + 4000;
    const results = await Promise.all(["p1", "p2", "p3"].map((w) => runClaimer(w, startAt)));
    const all = results.flatMap((r) => r.ids);
    expect(new Set(all).size).toBe(all.length);
    expect([...all].sort()).toEqual([...jobIds].sort());
    for (const id of jobIds) {
      const row = await getJob(id);
      expect(row?.state).toBe("running");
      expect(row?.attempts).toBe(1);
    }
    // At least two processes got work, so the claims really interleaved.
    expect(results.filter((r) => r.ids.length > 0).length).toBeGreaterThanOrEqual(2);
  }, 120_000);
});
