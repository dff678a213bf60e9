/**
 * Shared by the badge routes: who may see a private model's badge, and the SVG answer with
 * its ETag and caching headers (304 when the client's copy is current).
 */
import { actorFromRequest } from "@/lib/authz";
import { badgeEtag } from "@/lib/badges";
import type { BadgeSource } from "@/lib/decisions";
import { isAppError, NotFound } from "@/lib/errors";
import { loadModelForReview } from "@/lib/venues";

/** Immutable: a decided, checked version never changes its badge. */
export const IMMUTABLE = "public, max-age=31536000, immutable";
/** A model badge (or an undecided version's) may change: caches check back after a minute. */
export const SHORT = "public, max-age=60, must-revalidate";
/** A private model's badge is for its owner and editors only: never stored by shared caches. */
export const PRIVATE = "private, no-store";

/** "rp-abc.svg" -> "rp-abc"; anything without the extension is no badge. */
export function stripSvg(segment: string): string {
  if (!segment.endsWith(".svg")) throw new NotFound("badge");
  return segment.slice(0, -".svg".length);
}

/** Public models: the given cache policy. Private: PRIVATE for those who may review it, else 404. */
export async function cachePolicy(req: Request, m: BadgeSource, publicPolicy: string): Promise<string> {
  if (m.visibility === "public") return publicPolicy;
  let actor = null;
  try {
    actor = await actorFromRequest(req);
  } catch (e) {
    // A bad token on an image request counts as nobody signed in.
    if (!isAppError(e)) throw e;
  }
  if (actor === null) throw new NotFound("badge");
  try {
    await loadModelForReview({ id: actor.userId, role: actor.role }, m.slug);
  } catch (e) {
    if (isAppError(e)) throw new NotFound("badge");
    throw e;
  }
  return PRIVATE;
}

export function svgResponse(req: Request, svg: string, cacheControl: string): Response {
  const etag = badgeEtag(svg);
  const headers = new Headers({
    "content-type": "image/svg+xml; charset=utf-8",
    "cache-control": cacheControl,
    etag,
    "x-content-type-options": "nosniff",
    // An SVG opened directly must not run anything.
    "content-security-policy": "default-src 'none'; style-src 'unsafe-inline'; sandbox",
  });
  const match = req.headers.get("if-none-match");
  if (match !== null && match.split(",").some((t) => t.trim() === etag || t.trim() === `W/${etag}`)) {
    return new Response(null, { status: 304, headers });
  }
  return new Response(svg, { status: 200, headers });
}
