/**
 * End to end in one process with the real engine: deposit specs through addVersion, let the
 * worker (default engine thread pool) verify them, read the stored reports and the mails.
 */
import "./deposit-env";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { capturedMail } from "@/db/schema";
import { ALPINE_BUMBLEBEES, HARBOUR_SEALS, REEF_CLEANERS } from "@/lib/demo/models";
import { ENGINE_VERSION } from "@/lib/engine/verify";
import { createModel, listModelsForOwner } from "@/lib/models";
import { getReportForVersion } from "@/lib/reports";
import { addVersion } from "@/lib/versions";
import { mailAuthor, versionPageUrl } from "@/lib/worker/notify";
import { VerificationWorker } from "@/lib/worker/loop";
import { makeUser, migrated } from "./deposit-support";

beforeAll(async () => {
  await migrated();
});

async function until(what: string, check: () => Promise<boolean>, timeoutMs = 60_000): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe("deposit to report with the real engine", () => {
  it("verifies each version in the background, stores the report whole and per claim, and mails the author", async () => {
    const author = await makeUser("Engine");
    const seals = await createModel(author, { title: "Seals" });
    const bees = await createModel(author, { title: "Bees" });
    const reef = await createModel(author, { title: "Reef" });
    const s1 = await addVersion(seals.id, JSON.stringify(HARBOUR_SEALS, null, 2), author);
    const b1 = await addVersion(bees.id, JSON.stringify(ALPINE_BUMBLEBEES, null, 2), author);
    const r1 = await addVersion(reef.id, JSON.stringify(REEF_CLEANERS, null, 2), author);

    const worker = new VerificationWorker({ pollMs: 100, leaseMs: 30_000, notify: mailAuthor, log: () => {} });
    worker.start();
    try {
      await until("all three reports", async () =>
        (await listModelsForOwner(author)).every((m) => m.versions[0]?.job?.state === "finished"),
      );
    } finally {
      await worker.stop(5000);
    }

    const sealsReport = await getReportForVersion(s1.version.id, author);
    expect(sealsReport?.verdict).toBe("contradicted");
    expect(sealsReport?.engineVersion).toBe(ENGINE_VERSION);
    expect(sealsReport?.counts).toEqual({ confirmed: 3, contradicted: 1, inconclusive: 0 });
    // The deliberately wrong claim: from 70 % group hunters the run ends at all-Solo, distance 1 from [1, 0].
    const wrong = sealsReport?.claims.find((c) => c.claimId === "group-hunting-takes-over");
    expect(wrong?.status).toBe("contradicted");
    expect(wrong?.deviation).toBeCloseTo(1, 6);
    expect(sealsReport?.report.restPoints?.map((p) => p.stability)).toEqual(["asymptotically-stable", "unstable", "asymptotically-stable"]);
    expect(sealsReport?.report.experiments[0]?.times).toHaveLength(121);

    const beesReport = await getReportForVersion(b1.version.id, author);
    expect(beesReport?.verdict).toBe("confirmed");
    expect(beesReport?.claims.map((c) => c.claimId)).toEqual(ALPINE_BUMBLEBEES.claims.map((c) => c.id));
    // Interior rest point of the anti-coordination game at x* = (b - d) / ((b - d) + (c - a)) = 1/2, eigenvalue -1 (common practice).
    const interior = beesReport?.report.restPoints?.find((p) => p.support.length === 2);
    expect(interior?.state).toEqual([0.5, 0.5]);
    expect(interior?.eigenvalues[0]?.[0]).toBeCloseTo(-1, 9);

    const reefReport = await getReportForVersion(r1.version.id, author);
    expect(reefReport?.verdict).toBe("confirmed");
    expect(reefReport?.report.restPoints?.find((p) => p.stability === "non-hyperbolic")?.state).toEqual([[0.5, 0.5], [0.5, 0.5]]);

    const mails = (await db.select().from(capturedMail)).filter((m) => m.to.includes(author.email));
    expect(mails.map((m) => m.subject).sort()).toEqual([
      'Restpoint: version 1 of "Bees" is confirmed',
      'Restpoint: version 1 of "Reef" is confirmed',
      'Restpoint: version 1 of "Seals" is contradicted',
    ]);
    const sealsMail = mails.find((m) => m.subject.includes("Seals"));
    expect(sealsMail?.text).toContain("Claims: 3 confirmed, 1 contradicted, 0 inconclusive.");
    expect(sealsMail?.text).toContain(versionPageUrl(seals.slug, 1));
  }, 120_000);
});
