import Link from "next/link";
import { PageHeader } from "@/components/ui/PageHeader";

/** The same answer for a model that does not exist and one that is not public. */
export default function ModelNotFound() {
  return (
    <div className="flex flex-col gap-6">
      <PageHeader overline="Registry" title="No public model here" lede="There is no public model or version at this address. It may have been mistyped, or the model is not public." />
      <p>
        <Link href="/models" className="font-semibold text-tide hover:underline">
          Search the registry
        </Link>
      </p>
    </div>
  );
}
