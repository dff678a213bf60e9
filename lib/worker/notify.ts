/**
 * Tells the author that a version's verification finished (with the verdict) or failed for
 * good (with the error), by mail with a link to the version's report page.
 */
import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { model, user, version } from "@/db/schema";
import { env } from "@/lib/env";
import { sendMail, type OutgoingMail } from "@/lib/mail";
import type { Notifier } from "./loop";

/** The author's page of one version and its report in the workspace (the link in the mail). */
export function versionPageUrl(modelSlug: string, versionNumber: number): string {
  return `${env.authUrl.replace(/\/$/, "")}/workspace/models/${encodeURIComponent(modelSlug)}/v/${versionNumber}`;
}

const VERDICT_SENTENCES: Record<string, string> = {
  confirmed: "Every claim was confirmed by the re-run.",
  contradicted: "At least one claim was contradicted by the re-run.",
  inconclusive: "No claim was contradicted, but at least one could not be decided.",
  invalid: "The specification could not be run: it breaks a rule of the format.",
};

export function verificationFinishedMail(input: {
  to: string;
  name: string;
  modelTitle: string;
  versionNumber: number;
  url: string;
  outcome: { verdict: string; confirmed: number; contradicted: number; inconclusive: number } | { error: string };
}): OutgoingMail {
  const what = `version ${input.versionNumber} of "${input.modelTitle}"`;
  const lines =
    "verdict" in input.outcome
      ? [
          `The verification of ${what} has finished. Verdict: ${input.outcome.verdict}.`,
          VERDICT_SENTENCES[input.outcome.verdict] ?? "",
          `Claims: ${input.outcome.confirmed} confirmed, ${input.outcome.contradicted} contradicted, ${input.outcome.inconclusive} inconclusive.`,
        ]
      : [`The verification of ${what} failed after its last attempt.`, `Error: ${input.outcome.error}`];
  const subject =
    "verdict" in input.outcome
      ? `Restpoint: ${what} is ${input.outcome.verdict}`
      : `Restpoint: the verification of ${what} failed`;
  const text = [`Hello ${input.name},`, "", ...lines.filter((l) => l !== ""), "", "The report:", input.url, "", "Restpoint"].join("\n");
  return { to: input.to, subject, text };
}

/** The default notifier of the worker: one mail to the model's owner per finished or failed job. */
export const mailAuthor: Notifier = async (event) => {
  const rows = await db
    .select({ number: version.number, title: model.title, slug: model.slug, email: user.email, name: user.name })
    .from(version)
    .innerJoin(model, eq(version.modelId, model.id))
    .innerJoin(user, eq(model.ownerId, user.id))
    .where(eq(version.id, event.job.versionId));
  const row = rows[0];
  if (row === undefined) return;
  const outcome =
    event.outcome === "finished"
      ? {
          verdict: event.report.verdict,
          confirmed: event.report.claims.filter((c) => c.status === "confirmed").length,
          contradicted: event.report.claims.filter((c) => c.status === "contradicted").length,
          inconclusive: event.report.claims.filter((c) => c.status === "inconclusive").length,
        }
      : { error: event.error };
  await sendMail(
    verificationFinishedMail({
      to: row.email,
      name: row.name,
      modelTitle: row.title,
      versionNumber: row.number,
      url: versionPageUrl(row.slug, row.number),
      outcome,
    }),
  );
};
