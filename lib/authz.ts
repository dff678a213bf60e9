/**
 * Who is asking, and may they? The one place where role checks happen. Pages, server actions
 * and route handlers all call these; hiding a button is never the check.
 *
 *   Server component / action:  const me = await requireRole("editor", "admin");
 *   Page that must answer 401/403 with the right status:  const me = await pageRole("admin");
 *   Route handler:  const me = await requireActor(req, "author", "editor", "admin");
 *
 * Failures are lib/errors.ts classes (NotSignedIn 401, Forbidden 403); lib/http.ts maps them
 * to JSON, and the page helpers turn them into Next's unauthorized()/forbidden()/notFound().
 */
import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import { forbidden, notFound, unauthorized } from "next/navigation";
import { headers } from "next/headers";
import { cache } from "react";
import { db } from "@/db/client";
import { apiToken, user, type Role } from "@/db/schema";
import { auth } from "@/lib/auth";
import { Forbidden, NotFound, NotSignedIn, isAppError } from "@/lib/errors";
import { hashApiToken, looksLikeApiToken } from "@/lib/token-hash";
import { toRole } from "@/lib/users";

/** The signed-in person making a request, however they proved it. */
export interface Actor {
  userId: string;
  name: string;
  email: string;
  role: Role;
  /** "session" for the browser cookie, "token" for a personal API token. */
  via: "session" | "token";
  /** The api_token row used, when via is "token". */
  tokenId: string | null;
}

export const INVALID_TOKEN_MESSAGE = "The API token is not valid or has been revoked.";

function forbiddenFor(roles: readonly Role[]): Forbidden {
  const list = roles.join(" or ");
  return new Forbidden(`This needs the ${list} role.`, roles);
}

/** The better-auth session of the current request (once per request, through React cache). */
export const getSession = cache(async () => auth.api.getSession({ headers: await headers() }));

/** The current request's actor from the session cookie, or null when nobody is signed in. */
export const getActor = cache(async (): Promise<Actor | null> => {
  const s = await getSession();
  if (s === null) return null;
  return { userId: s.user.id, name: s.user.name, email: s.user.email, role: toRole(s.user.role), via: "session", tokenId: null };
});

export function hasRole(actor: Actor | null, ...roles: Role[]): boolean {
  return actor !== null && roles.includes(actor.role);
}

/** Throws NotSignedIn without a session. */
export async function requireUser(): Promise<Actor> {
  const actor = await getActor();
  if (actor === null) throw new NotSignedIn();
  return actor;
}

/** Throws NotSignedIn without a session, Forbidden when the role is not among `roles`. */
export async function requireRole(...roles: Role[]): Promise<Actor> {
  const actor = await requireUser();
  if (!roles.includes(actor.role)) throw forbiddenFor(roles);
  return actor;
}

async function actorFromToken(token: string): Promise<Actor> {
  if (!looksLikeApiToken(token)) throw new NotSignedIn(INVALID_TOKEN_MESSAGE);
  const [row] = await db
    .select({ tokenId: apiToken.id, userId: user.id, name: user.name, email: user.email, role: user.role, banned: user.banned })
    .from(apiToken)
    .innerJoin(user, eq(user.id, apiToken.userId))
    .where(and(eq(apiToken.tokenHash, hashApiToken(token)), isNull(apiToken.revokedAt)))
    .limit(1);
  if (row === undefined || row.banned === true) throw new NotSignedIn(INVALID_TOKEN_MESSAGE);
  await db.update(apiToken).set({ lastUsedAt: new Date() }).where(eq(apiToken.id, row.tokenId));
  return { userId: row.userId, name: row.name, email: row.email, role: toRole(row.role), via: "token", tokenId: row.tokenId };
}

/**
 * The actor of a route-handler request: `Authorization: Bearer rp_...` (a personal API token)
 * or the session cookie. A malformed, unknown or revoked token is an error (401), never a
 * silent fall-back to anonymous. Returns null when the request carries neither.
 */
export async function actorFromRequest(req: Request): Promise<Actor | null> {
  const authorization = req.headers.get("authorization");
  if (authorization !== null) {
    const m = /^Bearer\s+(\S+)\s*$/i.exec(authorization);
    if (m === null || m[1] === undefined) throw new NotSignedIn("Send the API token as: Authorization: Bearer rp_...");
    return actorFromToken(m[1]);
  }
  const s = await auth.api.getSession({ headers: req.headers });
  if (s === null) return null;
  return { userId: s.user.id, name: s.user.name, email: s.user.email, role: toRole(s.user.role), via: "session", tokenId: null };
}

/** actorFromRequest that throws NotSignedIn for anonymous requests and Forbidden for other roles. */
export async function requireActor(req: Request, ...roles: Role[]): Promise<Actor> {
  const actor = await actorFromRequest(req);
  if (actor === null) throw new NotSignedIn();
  if (roles.length > 0 && !roles.includes(actor.role)) throw forbiddenFor(roles);
  return actor;
}

// ---------------------------------------------------------------------------
// Pages: the same checks, answered with Next's 401 / 403 / 404 pages and statuses.
// (Needs experimental.authInterrupts in next.config.ts.)
// ---------------------------------------------------------------------------

/** Runs `fn` and turns NotSignedIn / Forbidden / NotFound into unauthorized() / forbidden() / notFound(). */
export async function onPage<T>(fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (e) {
    if (isAppError(e)) {
      if (e instanceof NotSignedIn) unauthorized();
      if (e instanceof Forbidden) forbidden();
      if (e instanceof NotFound) notFound();
    }
    throw e;
  }
}

/** For pages: the signed-in actor, or the 401 page. */
export function pageUser(): Promise<Actor> {
  return onPage(requireUser);
}

/** For pages: the actor if their role is among `roles`; else the 401 or 403 page. */
export function pageRole(...roles: Role[]): Promise<Actor> {
  return onPage(() => requireRole(...roles));
}
