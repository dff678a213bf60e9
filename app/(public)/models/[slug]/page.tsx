import type { Metadata } from "next";
import { PublicVersionView } from "@/components/public/PublicVersionView";
import { publicVersion, versionMetadata } from "./load";

type Params = Promise<{ slug: string }>;

export async function generateMetadata({ params }: { params: Params }): Promise<Metadata> {
  const { slug } = await params;
  return versionMetadata(await publicVersion(slug));
}

/** A public model: its newest version. */
export default async function PublicModelPage({ params }: { params: Params }) {
  const { slug } = await params;
  return <PublicVersionView modelPage={true} data={await publicVersion(slug)} />;
}
