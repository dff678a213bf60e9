import type { Metadata } from "next";
import Link from "next/link";
import { StatusMark } from "@/components/report/StatusMark";
import { JobState } from "@/components/deposit/JobState";
import { ButtonLink } from "@/components/ui/Button";
import { EmptyState } from "@/components/ui/EmptyState";
import { PageHeader } from "@/components/ui/PageHeader";
import { pageUser } from "@/lib/authz";
import { listModelsForOwner } from "@/lib/models";

export const metadata: Metadata = { title: "Your models" };

export default async function ModelsPage() {
  const me = await pageUser();
  const models = await listModelsForOwner({ id: me.userId, role: me.role });
  return (
    <div className="flex flex-col gap-8">
      <PageHeader
        overline="Author"
        title="Your models"
        lede="Each model keeps every version you uploaded, with the verdict of its re-run."
        actions={<ButtonLink href="/workspace/models/new">Deposit a model</ButtonLink>}
      />
      {models.length === 0 ? (
        <EmptyState title="You have not deposited a model yet." action={<ButtonLink href="/workspace/models/new">Deposit a model</ButtonLink>}>
          A deposit is a model specification: strategies, payoffs, parameters, dynamics and the claims your paper makes.
          Restpoint re-runs it and reports on every claim.
        </EmptyState>
      ) : (
        <ul className="flex flex-col gap-3" data-testid="model-list">
          {models.map((m) => {
            const latest = m.versions[0];
            return (
              <li key={m.id} className="rp-card flex flex-col gap-2 p-5 sm:flex-row sm:items-center sm:justify-between">
                <div className="min-w-0">
                  <Link href={`/workspace/models/${m.slug}`} className="rp-link text-lg font-semibold">
                    {m.title}
                  </Link>
                  <p className="text-xs text-ink-faint">
                    <span className="font-mono">{m.slug}</span> · {m.visibility === "public" ? "public" : "private"}
                    {m.venue === null ? "" : ` · submitted to ${m.venue.name}`} · {m.versions.length}{" "}
                    {m.versions.length === 1 ? "version" : "versions"}
                  </p>
                </div>
                <div className="shrink-0 text-sm">
                  {latest === undefined ? (
                    <span className="text-ink-faint">No version yet</span>
                  ) : (
                    <span className="inline-flex items-center gap-2">
                      <span className="text-ink-faint">v{latest.number}</span>
                      {latest.verdict === null ? <JobState job={latest.job} verdict={null} /> : <StatusMark outcome={latest.verdict} />}
                    </span>
                  )}
                </div>
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}
