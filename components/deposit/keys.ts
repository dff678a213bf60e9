/**
 * SWR keys (API addresses) shared by server pages and client components: a plain module, since
 * a server component cannot call functions exported from a "use client" file.
 */

/** How often a list or status polls while a verification is queued or running. */
export const POLL_MS = 1500;

export function modelKey(slug: string): string {
  return `/api/v1/models/${encodeURIComponent(slug)}`;
}

export function filesKey(slug: string, number: number): string {
  return `/api/v1/models/${encodeURIComponent(slug)}/versions/${number}/files`;
}

export function reportKey(slug: string, number: number): string {
  return `/api/v1/models/${encodeURIComponent(slug)}/versions/${number}/report`;
}
