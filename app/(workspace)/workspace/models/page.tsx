import type { Metadata } from "next";
import { ModelList } from "@/components/deposit/ModelList";
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
        <ModelList models={models} />
      )}
    </div>
  );
}
