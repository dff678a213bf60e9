/**
 * Demo models of our own invention (fictional species and scenarios), deposited by the demo
 * author. The harbour-seal model carries a deliberately contradicted claim, so the demo shows
 * what a failed check looks like; the public bumblebee model has named parameters, so a reader
 * can re-run it with values of their own.
 *
 * Hook-in: add `{ name: "models", run: seedDemoModels }` to DEMO_STEPS in lib/demo/index.ts
 * after the accounts and venue steps.
 */
import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { model } from "@/db/schema";
import { createModel, getModel, updateModel } from "@/lib/models";
import type { ModelInput } from "@/lib/types/deposit";
import { submitVersion } from "@/lib/venues";
import { addVersion } from "@/lib/versions";
import { demoAccount } from "./accounts";
import type { DemoContext } from "./index";

export interface DemoModel {
  entry: ModelInput;
  /** Specs uploaded in order as versions 1, 2, ... */
  specs: Record<string, unknown>[];
  /** Submit to the demo venue. */
  toVenue: boolean;
}

// The demo author account's own (invented) name. No ORCID iD: any well-formed iD would point at
// a real ORCID record, and the demo must not attribute models to anyone real.
const DEMO_AUTHOR = { name: demoAccount("author").name, affiliation: "Institute of Imaginary Meadows" };

/**
 * Alpine bumblebees choosing between specialising on one flower species and visiting any.
 * Anti-coordination (a = 1, b = uncrowded = 4, c = 3, d = 3 - travel = 2): the interior rest
 * point x* = (b - d) / ((b - d) + (c - a)) = (uncrowded - 3 + travel) / (uncrowded - 1 + travel)
 * = 1/2 is stable (common practice: the 2x2 replicator closed form); a reader who raises
 * uncrowded or travel sees the Specialist share rise, e.g. to 2/3 with uncrowded = 6.
 */
export const ALPINE_BUMBLEBEES = {
  format: "restpoint/model@1",
  title: "Flower constancy in a fictional alpine bumblebee",
  summary:
    "Fictional scenario. Workers of an imagined high-meadow bumblebee either stay constant to one flower species (Specialist) or visit whatever blooms (Generalist). Specialists do well among Generalists, who leave them the uncrowded flowers (worth uncrowded), and poorly among each other; two Generalists lose travel to flying between the same patches. The colony mix settles at half and half.",
  authors: [DEMO_AUTHOR],
  manuscript: { title: "Constancy pays when it is rare", year: 2026 },
  parameters: { uncrowded: 4, travel: 1 },
  game: {
    kind: "symmetric",
    strategies: ["Specialist", "Generalist"],
    payoffs: [
      [1, "uncrowded"],
      [3, "3 - travel"],
    ],
  },
  experiments: [{ id: "few-specialists", initial: [0.1, 0.9], duration: 40, samples: 201 }],
  claims: [
    { id: "even-mix", kind: "rest-point", state: [0.5, 0.5], stability: "asymptotically-stable" },
    { id: "even-mix-is-ess", kind: "ess", state: [0.5, 0.5] },
    { id: "all-specialists-unstable", kind: "rest-point", state: [1, 0], stability: "unstable" },
    { id: "three-rest-points", kind: "rest-point-count", count: 3 },
    { id: "specialists-spread", kind: "final-state", experiment: "few-specialists", state: [0.5, 0.5] },
  ],
};

/**
 * Harbour seals hunting herring either in a group (pays 4 only if the partner joins) or alone
 * (a sure 3). Two stable conventions and an unstable threshold at a 3/4 share of group
 * hunters. The claim "group-hunting-takes-over" is wrong on purpose: from 70 % group hunters
 * the colony falls back to hunting alone.
 */
export const HARBOUR_SEALS = {
  format: "restpoint/model@1",
  title: "Group hunting thresholds in a fictional harbour seal colony",
  summary:
    "Fictional scenario. Seals of an imagined colony drive herring together (Group) or hunt alone (Solo). Group hunting pays more, but only when the partner joins. The model claims, wrongly on purpose, that a colony starting with 70 % group hunters goes over to group hunting entirely; the threshold is 75 %.",
  authors: [DEMO_AUTHOR, { name: "Jorunn Haldvik", affiliation: "Fjord Field Station (fictional)" }],
  manuscript: { title: "When does cooperative herding take hold?", year: 2025 },
  parameters: { herd: 4, solo: 3 },
  game: {
    kind: "symmetric",
    strategies: ["Group", "Solo"],
    payoffs: [
      ["herd", 0],
      ["solo", "solo"],
    ],
  },
  experiments: [{ id: "seventy-percent-group", initial: [0.7, 0.3], duration: 60, samples: 121 }],
  claims: [
    { id: "threshold", kind: "rest-point", state: [0.75, 0.25], stability: "unstable" },
    { id: "group-convention-ess", kind: "ess", state: [1, 0] },
    { id: "solo-convention-ess", kind: "ess", state: [0, 1] },
    { id: "group-hunting-takes-over", kind: "final-state", experiment: "seventy-percent-group", state: [1, 0] },
  ],
};

/**
 * Cleaner fish (Honest or Cheat) and their reef clients (Stay or Leave) as two populations:
 * cheating pays when clients stay, clients stay only while most cleaners are honest. The
 * mixed equilibrium (1/2, 1/2) of this matching-pennies-like game is a centre of the
 * two-population replicator dynamics (common practice: zero-sum-like 2x2 bimatrix games cycle).
 */
export const REEF_CLEANERS = {
  format: "restpoint/model@1",
  title: "Honesty cycles between fictional reef cleaners and their clients",
  summary:
    "Fictional scenario. Cleaner fish of an imagined reef either remove parasites only (Honest) or also bite off mucus (Cheat); clients either stay for the cleaning or leave. Neither side settles: honesty, staying, cheating and leaving follow each other around the mixed equilibrium.",
  authors: [DEMO_AUTHOR],
  game: {
    kind: "bimatrix",
    populations: [
      { name: "Cleaners", strategies: ["Honest", "Cheat"] },
      { name: "Clients", strategies: ["Stay", "Leave"] },
    ],
    payoffs: [
      [
        [2, 0],
        [3, -1],
      ],
      [
        [2, -2],
        [0, 0],
      ],
    ],
  },
  experiments: [{ id: "mostly-honest", initial: [[0.8, 0.2], [0.6, 0.4]], duration: 30, samples: 301 }],
  claims: [
    { id: "mixed-equilibrium", kind: "nash-equilibrium", state: [[0.5, 0.5], [0.5, 0.5]] },
    { id: "mixed-is-a-centre", kind: "rest-point", state: [[0.5, 0.5], [0.5, 0.5]], stability: "non-hyperbolic" },
    { id: "honest-and-staying-is-no-equilibrium", kind: "nash-equilibrium", state: [[1, 0], [1, 0]], holds: false },
  ],
};

export const DEMO_MODELS: DemoModel[] = [
  {
    entry: {
      title: ALPINE_BUMBLEBEES.title,
      summary: ALPINE_BUMBLEBEES.summary,
      manuscriptTitle: ALPINE_BUMBLEBEES.manuscript.title,
      year: 2026,
      authors: [DEMO_AUTHOR],
      visibility: "public",
    },
    specs: [ALPINE_BUMBLEBEES],
    toVenue: true,
  },
  {
    entry: {
      title: HARBOUR_SEALS.title,
      summary: HARBOUR_SEALS.summary,
      manuscriptTitle: HARBOUR_SEALS.manuscript.title,
      year: 2025,
      authors: HARBOUR_SEALS.authors,
      visibility: "private",
    },
    specs: [HARBOUR_SEALS],
    toVenue: true,
  },
  {
    entry: { title: REEF_CLEANERS.title, summary: REEF_CLEANERS.summary, authors: [DEMO_AUTHOR], visibility: "public" },
    specs: [REEF_CLEANERS],
    toVenue: false,
  },
];

/** The entry's authors as stored (absent fields as null), to compare with what is in the database. */
function authorKey(authors: readonly { name: string; orcid?: string | null; affiliation?: string | null }[]): string {
  return JSON.stringify(authors.map((a) => [a.name, a.orcid ?? null, a.affiliation ?? null]));
}

/**
 * Deposits each demo model for the demo author unless a model of that title is already theirs.
 * Titles never change, so an older database gets no duplicates: a changed spec becomes the next
 * version, and an entry whose authors differ (older demo data) gets the current ones.
 */
export async function seedDemoModels(ctx: DemoContext): Promise<void> {
  const author = { id: ctx.accounts.author.id, role: "author" };
  for (const demo of DEMO_MODELS) {
    const [existing] = await db
      .select({ id: model.id })
      .from(model)
      .where(and(eq(model.ownerId, author.id), eq(model.title, demo.entry.title)))
      .limit(1);
    if (existing !== undefined) {
      const view = await getModel(existing.id, author);
      if (authorKey(view.authors) !== authorKey(demo.entry.authors ?? [])) {
        await updateModel(existing.id, author, { ...demo.entry, venueId: view.venue?.id ?? null });
      }
    }
    const modelId =
      existing?.id ?? (await createModel(author, { ...demo.entry, venueId: demo.toVenue ? (ctx.venue?.id ?? null) : null })).id;
    // addVersion answers "identical" for a spec already deposited, so this is idempotent.
    for (const spec of demo.specs) {
      const added = await addVersion(modelId, `${JSON.stringify(spec, null, 2)}\n`, author, { fileName: "spec.json" });
      // Put each version before the demo venue, so the demo editor's queue has work in it
      // (submitVersion answers "existing" for one already submitted: idempotent too).
      if (demo.toVenue) await submitVersion(author, { model: modelId, number: added.version.number });
    }
  }
}
