import type { Metadata } from "next";
import { ModelForm } from "@/components/deposit/ModelForm";
import { EMPTY_MODEL_FORM } from "@/components/deposit/model-form";
import { PageHeader } from "@/components/ui/PageHeader";
import { pageUser } from "@/lib/authz";
import { listVenues } from "@/lib/venues";
import { createModelAction } from "../actions";

export const metadata: Metadata = { title: "Deposit a model" };

export default async function NewModelPage() {
  await pageUser();
  const venues = await listVenues();
  return (
    <div className="flex flex-col gap-8">
      <PageHeader
        overline="Deposit"
        title="Deposit a model"
        lede="First the entry: what the model is and where it was published. On the next page you upload its specification, and every upload becomes a version that Restpoint re-runs."
      />
      <div className="rp-card p-6">
        <ModelForm initial={EMPTY_MODEL_FORM} venues={venues.map((v) => ({ id: v.id, name: v.name }))} action={createModelAction} submitLabel="Create the model entry" />
      </div>
    </div>
  );
}
