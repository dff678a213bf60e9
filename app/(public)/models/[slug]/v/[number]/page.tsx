import type { Metadata } from "next";
import { PublicVersionView } from "@/components/public/PublicVersionView";
import { publicVersion, versionMetadata } from "../../load";

// Rendered on the first request and cached (ISR); lib/public-cache.ts revalidates it on every
// change a reader can see. The number is PUBLIC_PAGE_REVALIDATE_SECONDS (segment config must be a
// literal): the bound on staleness when a change happened outside a request (the worker loop).
export const revalidate = 30;
export const dynamicParams = true;
export function generateStaticParams(): { slug: string; number: string }[] {
  return [];
}

type Params = Promise<{ slug: string; number: string }>;

export async function generateMetadata({ params }: { params: Params }): Promise<Metadata> {
  const { slug, number } = await params;
  return versionMetadata(await publicVersion(slug, number));
}

/** One version of a public model, by number. */
export default async function PublicVersionPage({ params }: { params: Params }) {
  const { slug, number } = await params;
  return <PublicVersionView modelPage={false} data={await publicVersion(slug, number)} />;
}
