/** Small glue shared by the deposit API's route handlers (a private folder: not a route). */
import type { Actor } from "@/lib/authz";
import type { Viewer } from "@/lib/types/deposit";

/** The data-access modules' notion of who is asking. */
export function viewerOf(actor: Actor | null): Viewer {
  return actor === null ? null : { id: actor.userId, role: actor.role };
}

/** Next passes dynamic segments as a promise of their values. */
export interface SlugContext {
  params: Promise<{ slug: string }>;
}
export interface VersionContext {
  params: Promise<{ slug: string; number: string }>;
}
export interface IdContext {
  params: Promise<{ id: string }>;
}
