import type { Metadata } from "next";
import { PublicVersionView } from "@/components/public/PublicVersionView";
import { publicVersion, versionMetadata } from "../../load";

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
