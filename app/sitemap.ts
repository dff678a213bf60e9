/** /sitemap.xml: the home page, the registry and every public model and version page. */
import type { MetadataRoute } from "next";
import { publicUrl, publicVersionsForSitemap, versionPath } from "@/lib/registry";

// Read at request time: the database is not there while the app is built.
export const dynamic = "force-dynamic";

export default async function sitemap(): Promise<MetadataRoute.Sitemap> {
  const versions = await publicVersionsForSitemap();
  const entries: MetadataRoute.Sitemap = [
    { url: publicUrl("/"), changeFrequency: "weekly", priority: 0.6 },
    { url: publicUrl("/models"), changeFrequency: "daily", priority: 0.8 },
  ];
  for (const v of versions) {
    if (v.latest) {
      entries.push({ url: publicUrl(`/models/${encodeURIComponent(v.slug)}`), lastModified: v.createdAt, changeFrequency: "weekly", priority: 0.7 });
    }
    // A version page never changes once registered.
    entries.push({ url: publicUrl(versionPath(v.slug, v.number)), lastModified: v.createdAt, changeFrequency: "never", priority: 0.5 });
  }
  return entries;
}
