/**
 * Crash recovery with real processes: a worker started with `npm run worker`'s entry is
 * SIGKILLed in the middle of a run; its job stays "running" until the lease expires, then a
 * second worker process claims it again and finishes it with the real engine. The second
 * worker then stops cleanly on SIGTERM.
 */
import "./deposit-env";
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { capturedMail, report, version } from "@/db/schema";
import { ALPINE_BUMBLEBEES } from "@/lib/demo/models";
import { enqueueJob, getJob, LEASE_EXPIRED_MESSAGE } from "@/lib/jobs";
import { makeUser, makeVersionRow, migrated } from "./deposit-support";

const root = path.resolve(import.meta.dirname, "../..");
const children: ChildProcess[] = [];

function startWorker(args: string[]): { child: ChildProcess; output: () => string; exited: Promise<number | null> } {
  const child = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", "scripts/worker.ts", ...args], {
    cwd: root,
    env: process.env,
    stdio: ["ignore", "pipe", "pipe"],
  });
  children.push(child);
  let out = "";
  child.stdout?.on("data", (d: Buffer) => (out += d.toString()));
  child.stderr?.on("data", (d: Buffer) => (out += d.toString()));
  const exited = new Promise<number | null>((resolve) => child.on("exit", (code) => resolve(code)));
  return { child, output: () => out, exited };
}

async function until(what: string, check: () => Promise<boolean>, timeoutMs: number, output: () => string): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}; worker output:\n${output()}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

beforeAll(async () => {
  await migrated();
});

afterAll(() => {
  for (const c of children) if (c.exitCode === null && c.signalCode === null) c.kill("SIGKILL");
});

describe("the worker command", () => {
  it("refuses a malformed option with a sentence and exit status 64", async () => {
    const w = startWorker(["--lease-ms", "soon"]);
    expect(await w.exited).toBe(64);
    expect(w.output()).toContain('--lease-ms takes a whole number of milliseconds, not "soon".');
  }, 60_000);
});

describe("a worker killed mid-run", () => {
  it("leaves its job to be claimed again after the lease expires, and another worker finishes it", async () => {
    const owner = await makeUser("Kill");
    const { versionId } = await makeVersionRow(owner.id);
    await db.update(version).set({ specText: JSON.stringify(ALPINE_BUMBLEBEES) }).where(eq(version.id, versionId));
    const queued = await enqueueJob(versionId);

    // Worker A holds each run for a minute, so it is surely mid-run when killed.
    const a = startWorker(["--lease-ms", "2000", "--poll-ms", "100", "--hold-ms", "60000"]);
    const pidA = a.child.pid ?? -1;
    await until("worker A to claim the job", async () => (await getJob(queued.id))?.state === "running", 60_000, a.output);
    const held = await getJob(queued.id);
    expect(held?.leaseOwner).toContain(`:${pidA}:`);
    expect(held?.attempts).toBe(1);
    // Let a heartbeat or two go by, then kill without warning.
    await new Promise((r) => setTimeout(r, 1500));
    a.child.kill("SIGKILL");
    expect(await a.exited).toBeNull();
    const orphaned = await getJob(queued.id);
    expect(orphaned?.state).toBe("running");
    expect(orphaned?.leaseOwner).toBe(held?.leaseOwner);

    // Worker B: no hold. It may only take the job once A's lease has run out.
    const b = startWorker(["--lease-ms", "2000", "--poll-ms", "100", "--grace-ms", "5000"]);
    await until("worker B to finish the job", async () => (await getJob(queued.id))?.state === "finished", 90_000, b.output);
    const done = await getJob(queued.id);
    expect(done?.attempts).toBe(2);
    expect(done?.lastError).toBe(LEASE_EXPIRED_MESSAGE);
    expect(done?.leaseOwner).toBeNull();
    expect(done?.startedAt?.getTime()).toBeGreaterThanOrEqual(orphaned?.leaseExpiresAt?.getTime() ?? Infinity);

    const [stored] = await db.select().from(report).where(eq(report.versionId, versionId));
    expect(stored?.verdict).toBe("confirmed");
    expect(stored?.confirmedCount).toBe(ALPINE_BUMBLEBEES.claims.length);

    // The author got the mail (captured by worker B's fake SMTP server in the same database).
    await until("the mail", async () => (await db.select().from(capturedMail)).some((m) => m.to.includes(owner.email)), 20_000, b.output);
    const [mail] = (await db.select().from(capturedMail)).filter((m) => m.to.includes(owner.email));
    expect(mail?.subject).toBe('Restpoint: version 1 of "Queue test model" is confirmed');
    expect(mail?.text).toContain("Verdict: confirmed.");

    b.child.kill("SIGTERM");
    expect(await b.exited).toBe(0);
    expect(b.output()).toContain("SIGTERM: stopping");
  }, 180_000);
});
