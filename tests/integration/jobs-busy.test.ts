import "./deposit-env";
import { createClient, type Client } from "@libsql/client";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { claimNext, completeJob, enqueueJob, failJob, heartbeat } from "@/lib/jobs";
import { databaseFile } from "./deposit-env";
import { fakeReport, makeUser, makeVersionRow, migrated } from "./deposit-support";

// Another process's view of the file: what it reads is what this process really committed.
let outside: Client;
let ownerId = "";

beforeAll(async () => {
  await migrated();
  outside = createClient({ url: `file:${databaseFile}` });
  ownerId = (await makeUser("Busy")).id;
});

afterAll(() => {
  outside.close();
});

/**
 * Runs `op` while another connection holds the write lock, and lets that lock go only once
 * `op` has met SQLITE_BUSY: the busy timeout (250 ms, db/client.ts) blocks the event loop, so
 * the timer that commits the other transaction fires after `op`'s first attempt failed.
 */
async function whileLockedElsewhere<T>(op: () => Promise<T>): Promise<{ result: T; waitedMs: number }> {
  const lock = await outside.transaction("write");
  const started = Date.now();
  setTimeout(() => void lock.commit(), 20);
  const result = await op();
  return { result, waitedMs: Date.now() - started };
}

async function committedJob(id: string): Promise<{ state: unknown; leaseOwner: unknown; leaseExpiresAt: unknown; lastError: unknown }> {
  const rs = await outside.execute({ sql: "select state, lease_owner, lease_expires_at, last_error from job where id = ?", args: [id] });
  const row = rs.rows[0];
  if (row === undefined) throw new Error(`job ${id} not found`);
  return { state: row.state, leaseOwner: row.lease_owner, leaseExpiresAt: row.lease_expires_at, lastError: row.last_error };
}

async function queuedJob(): Promise<string> {
  const { versionId } = await makeVersionRow(ownerId);
  return (await enqueueJob(versionId)).id;
}

describe("queue operations retried after the database was locked", () => {
  // A statement that fails with SQLITE_BUSY used to stay active on its pooled connection, so
  // the retried UPDATE ... RETURNING returned the job without committing the claim: another
  // process then saw the job still queued and claimed it too.
  it("commits a claim that went through on its retry, so no other process can take the job", async () => {
    const id = await queuedJob();
    const { result, waitedMs } = await whileLockedElsewhere(() => claimNext("busy-w1", 60_000));
    expect(waitedMs).toBeGreaterThanOrEqual(240);
    expect(result?.id).toBe(id);
    expect(await committedJob(id)).toMatchObject({ state: "running", leaseOwner: "busy-w1" });
    // What the other process's claim finds: nothing left.
    const rs = await outside.execute("update job set lease_owner = 'other' where state = 'queued' returning id");
    expect(rs.rows).toHaveLength(0);
  });

  it("keeps later writes of the process durable after a busy claim, heartbeat and transaction", async () => {
    const id = await queuedJob();
    expect((await claimNext("busy-w2", 60_000))?.id).toBe(id);

    const extendedTo = Date.now() + 5 * 60_000;
    const beat = await whileLockedElsewhere(() => heartbeat(id, "busy-w2", 5 * 60_000, extendedTo - 5 * 60_000));
    expect(beat.waitedMs).toBeGreaterThanOrEqual(240);
    expect(beat.result).toBe(true);
    expect(await committedJob(id)).toMatchObject({ state: "running", leaseOwner: "busy-w2", leaseExpiresAt: extendedTo });

    // failJob is one write transaction: its BEGIN IMMEDIATE is what meets the lock.
    const failed = await whileLockedElsewhere(() => failJob(id, "busy-w2", "engine stopped", { backoffMs: () => 0 }));
    expect(failed.waitedMs).toBeGreaterThanOrEqual(240);
    expect(failed.result).toBe("retry");
    expect(await committedJob(id)).toMatchObject({ state: "queued", leaseOwner: null, lastError: "engine stopped" });

    expect((await claimNext("busy-w2", 60_000))?.id).toBe(id);
    expect(await completeJob(id, "busy-w2", fakeReport(), 5)).toBe(true);
    expect(await committedJob(id)).toMatchObject({ state: "finished", leaseOwner: null });
    const reports = await outside.execute({ sql: "select count(*) as n from report where version_id = (select version_id from job where id = ?)", args: [id] });
    expect(Number(reports.rows[0]?.n)).toBe(1);
  });
});
