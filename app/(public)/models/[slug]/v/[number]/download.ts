/**
 * Shared plumbing of a public version's download routes: load the version for an anonymous
 * reader (unknown and private answer the same 404), then send a file with a stable name.
 */
import "server-only";
import { createHash } from "node:crypto";
import { NotFound } from "@/lib/errors";
import { route } from "@/lib/http";
import { loadPublicVersion, type PublicVersion } from "@/lib/registry";

export type VersionParams = Promise<{ slug: string; number: string }>;

/** A file name stem: the slug and version, with only safe characters. */
export function fileStem(p: PublicVersion): string {
  return `${p.model.slug.replace(/[^A-Za-z0-9-]+/g, "-")}-v${p.version.number}`;
}

export interface FileAnswer {
  body: string;
  mediaType: string;
  fileName: string;
}

export function downloadRoute(make: (p: PublicVersion, req: Request, extra: Record<string, string>) => FileAnswer) {
  return route(async (req: Request, ctx: { params: Promise<Record<string, string>> }) => {
    const params = await ctx.params;
    const slug = params.slug ?? "";
    const data = await loadPublicVersion(slug, params.number ?? "");
    const file = make(data, req, params);
    // A strong validator of the bytes: a reader's browser revalidates with If-None-Match and gets 304.
    const etag = `"${createHash("sha256").update(file.body).digest("base64url").slice(0, 32)}"`;
    const common = {
      ETag: etag,
      // Versions are immutable, but a model can be made private again: revalidate each time.
      "Cache-Control": "public, max-age=0, must-revalidate",
    };
    const seen = req.headers.get("if-none-match");
    if (seen !== null && seen.split(/\s*,\s*/).includes(etag)) return new Response(null, { status: 304, headers: common });
    return new Response(file.body, {
      headers: {
        ...common,
        "Content-Type": file.mediaType,
        "Content-Disposition": `attachment; filename="${file.fileName}"`,
        "X-Content-Type-Options": "nosniff",
      },
    });
  });
}

export { NotFound };
