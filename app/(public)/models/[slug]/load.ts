/** The public version loader shared by a page and its metadata within one request. */
import "server-only";
import type { Metadata } from "next";
import { cache } from "react";
import { onPage } from "@/lib/authz";
import { loadPublicVersion, publicUrl, versionPath, type PublicVersion } from "@/lib/registry";

/** NotFound becomes Next's 404 page, the same for unknown and private models. */
export const publicVersion = cache(
  (slug: string, number?: string): Promise<PublicVersion> => onPage(() => loadPublicVersion(slug, number)),
);

function shorten(text: string, max: number): string {
  const flat = text.replace(/\s+/g, " ").trim();
  return flat.length <= max ? flat : `${flat.slice(0, max - 3).trimEnd()}...`;
}

export function versionMetadata(data: PublicVersion): Metadata {
  const { model, version, report } = data;
  const verdict = report === null ? "awaiting its re-run" : `re-run verdict: ${report.verdict}`;
  const authors = model.authors.map((a) => a.name).join(", ");
  const description = shorten(
    `${model.summary !== "" ? `${model.summary} ` : ""}Version ${version.number}${authors === "" ? "" : ` by ${authors}`}, ${verdict}. Strategies: ${version.strategyNames.join(", ")}.`,
    300,
  );
  const canonical = data.latest ? `/models/${encodeURIComponent(model.slug)}` : versionPath(model.slug, version.number);
  return {
    title: data.latest ? version.title : `${version.title} (version ${version.number})`,
    description,
    alternates: { canonical: publicUrl(canonical) },
    authors: model.authors.map((a) => ({ name: a.name })),
    openGraph: {
      type: "article",
      title: version.title,
      description,
      url: publicUrl(canonical),
      siteName: "Restpoint",
      publishedTime: version.createdAt,
      authors: model.authors.map((a) => a.name),
    },
    twitter: { card: "summary", title: version.title, description },
  };
}
