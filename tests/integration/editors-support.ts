/** Venues, submitted versions and reports for the editors' tests (import ./editors-env first). */
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { model, version, venue, venueEditor } from "@/db/schema";
import type { ClaimResult, ClaimStatus, Verdict } from "@/lib/engine/types";
import { storeReport } from "@/lib/reports";
import { submitVersion } from "@/lib/venues";
import { fakeReport, makeUser, migrated } from "./deposit-support";

export { fakeReport, makeUser, migrated };

export interface Person {
  id: string;
  role: string;
  email: string;
}

export async function makeVenueWith(slug: string, editors: Person[] = []): Promise<{ id: string; slug: string; name: string }> {
  const id = crypto.randomUUID();
  const full = `${slug}-${id.slice(0, 6)}`;
  const name = `${slug} review`;
  await db.insert(venue).values({ id, slug: full, name });
  for (const e of editors) await db.insert(venueEditor).values({ venueId: id, userId: e.id });
  return { id, slug: full, name };
}

/** A spec text of our own (fictional grazing herds) whose claim state varies with `share`. */
export function herdSpec(share: number, extraClaim = false): string {
  const claims: unknown[] = [{ id: "mixed-herd", kind: "rest-point", state: [share, 1 - share] }];
  if (extraClaim) claims.push({ id: "two-rest-points", kind: "rest-point-count", count: 3 });
  return JSON.stringify({
    format: "restpoint/model@1",
    title: "Grazing herds on a shared meadow",
    game: { kind: "symmetric", strategies: ["Graze", "Wander"], payoffs: [[1, 3], [2, 1]] },
    claims,
  });
}

let counter = 0;

export async function makeModel(
  owner: Person,
  venueId: string | null,
  opts: { title?: string; visibility?: "private" | "public" } = {},
): Promise<{ id: string; slug: string; title: string }> {
  const id = crypto.randomUUID();
  counter += 1;
  const slug = `rp-e${counter.toString(36)}${id.slice(0, 4)}`;
  const title = opts.title ?? `Grazing herds ${counter}`;
  await db.insert(model).values({ id, slug, ownerId: owner.id, title, venueId, visibility: opts.visibility ?? "private" });
  return { id, slug, title };
}

export function claim(id: string, status: ClaimStatus, deviation?: number): ClaimResult {
  const c: ClaimResult = { id, kind: "rest-point", status, message: `${id} is ${status}` };
  if (deviation !== undefined) c.deviation = deviation;
  return c;
}

/** Adds version `number` (spec text from herdSpec), with a report unless `verdict` is null. */
export async function addVersion(
  owner: Person,
  m: { id: string },
  number: number,
  verdict: Verdict | null = "confirmed",
  claims: ClaimResult[] = [claim("mixed-herd", verdict === "contradicted" ? "contradicted" : "confirmed", 1e-9)],
  specText: string = herdSpec(0.5 - number / 100, number > 1),
): Promise<{ id: string; number: number; specSha256: string }> {
  const id = crypto.randomUUID();
  const specSha256 = (crypto.randomUUID() + crypto.randomUUID()).replace(/-/g, "").slice(0, 64);
  await db.insert(version).values({ id, modelId: m.id, number, specSha256, specText, title: "Grazing herds", uploadedBy: owner.id });
  if (verdict !== null) {
    const r = { ...fakeReport(verdict, claims), specSha256 };
    await db.transaction(async (tx) => {
      await storeReport(tx, id, r, 12);
    });
  }
  return { id, number, specSha256 };
}

/** addVersion then submitVersion as the owner. */
export async function addSubmitted(
  owner: Person,
  m: { id: string; slug: string },
  number: number,
  verdict: Verdict | null = "confirmed",
  claims?: ClaimResult[],
): Promise<{ id: string; number: number; specSha256: string }> {
  const v = await addVersion(owner, m, number, verdict, claims);
  await submitVersion({ id: owner.id, role: owner.role }, { model: m.slug, number });
  return v;
}

export async function setVisibility(modelId: string, visibility: "private" | "public"): Promise<void> {
  await db.update(model).set({ visibility }).where(eq(model.id, modelId));
}
