import type { Metadata } from "next";
import { RegistryResults } from "@/components/public/RegistryResults";
import { RegistrySearch } from "@/components/public/RegistrySearch";
import { Notice } from "@/components/ui/Notice";
import { PageHeader } from "@/components/ui/PageHeader";
import { ValidationError } from "@/lib/errors";
import { parseRegistryQuery, searchRegistry, type RegistryQuery } from "@/lib/registry";

export const metadata: Metadata = {
  title: "Registry of models",
  description: "Every public evolutionary game model in Restpoint: search by title, author, DOI, strategy names, dynamics and verdict.",
  openGraph: { title: "Restpoint registry of models", type: "website" },
};

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

export default async function RegistryPage({ searchParams }: { searchParams: SearchParams }) {
  const params = await searchParams;
  let query: RegistryQuery | null = null;
  let problems: { path: string; message: string }[] = [];
  try {
    query = parseRegistryQuery(params);
  } catch (e) {
    if (!(e instanceof ValidationError)) throw e;
    problems = e.problems;
  }
  const result = query === null ? null : await searchRegistry(query);
  return (
    <div className="flex flex-col gap-8">
      <PageHeader
        overline="Registry"
        title="Public models"
        lede="Models deposited with the papers that use them, each re-run by the server. No account is needed to read them or to try your own values."
      />
      <RegistrySearch query={query ?? {}} />
      {problems.length > 0 && (
        <Notice tone="error" title="This search could not be run">
          <ul className="list-disc pl-5">
            {problems.map((p) => (
              <li key={p.path}>{p.message}</li>
            ))}
          </ul>
        </Notice>
      )}
      {result !== null && <RegistryResults result={result} />}
    </div>
  );
}
