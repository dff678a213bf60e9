import type { Metadata } from "next";
import Link from "next/link";
import { QueueTable, type QueueControls } from "@/components/editor/QueueTable";
import { PageHeader } from "@/components/ui/PageHeader";
import { onPage, pageRole } from "@/lib/authz";
import { isAppError } from "@/lib/errors";
import { parseQueueQuery, type QueueQuery } from "@/lib/queue";
import { requireVenueAccess } from "@/lib/venues";

interface Props {
  params: Promise<{ venue: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { venue } = await params;
  return { title: `Queue · ${venue}` };
}

function controlsOf(q: QueueQuery): QueueControls {
  return {
    status: q.status,
    verdict: q.verdict,
    q: q.q,
    author: q.author,
    version: q.version === undefined ? "" : String(q.version),
    minContradicted: q.minContradicted === undefined ? "" : String(q.minContradicted),
    submittedFrom: q.submittedFrom ?? "",
    submittedTo: q.submittedTo ?? "",
    sort: q.sort,
    dir: q.dir,
    page: q.page,
    pageSize: q.pageSize,
  };
}

export default async function QueuePage({ params, searchParams }: Props) {
  const me = await pageRole("editor", "admin");
  const { venue } = await params;
  const v = await onPage(() => requireVenueAccess({ id: me.userId, role: me.role }, venue));
  let query: QueueQuery;
  try {
    query = parseQueueQuery(await searchParams);
  } catch (e) {
    // A hand-edited address with a bad filter opens the plain queue instead of an error page.
    if (!isAppError(e)) throw e;
    query = parseQueueQuery({});
  }
  return (
    <div className="flex flex-col gap-8">
      <Link href="/workspace/venues" className="rp-link -mb-4 self-start text-sm">
        ← All venues
      </Link>
      <PageHeader
        overline="Venue queue"
        title={v.name}
        lede="Each row is a model at its newest submitted version. Decide on that version from its review page."
      />
      <QueueTable venueSlug={v.slug} initial={controlsOf(query)} />
    </div>
  );
}
