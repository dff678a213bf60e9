/**
 * What the workspace's client components need to talk to /api/v1: the JSON error shape and a
 * fetcher for SWR that turns error answers into thrown ApiError values.
 */

export interface ApiErrorDetail {
  path: string;
  message: string;
  line?: number;
}

export interface ApiErrorBody {
  error: { code: string; message: string; details?: ApiErrorDetail[] };
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: ApiErrorDetail[] = [],
  ) {
    super(message);
    this.name = "ApiError";
  }
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

/** Reads an API error body defensively: a proxy or a crash may answer with something else. */
export function toApiError(status: number, body: unknown): ApiError {
  if (isRecord(body) && isRecord(body.error)) {
    const e = body.error;
    const details = Array.isArray(e.details)
      ? e.details.filter(isRecord).map((d) => ({
          path: typeof d.path === "string" ? d.path : "",
          message: typeof d.message === "string" ? d.message : "",
          ...(typeof d.line === "number" ? { line: d.line } : {}),
        }))
      : [];
    return new ApiError(
      status,
      typeof e.code === "string" ? e.code : "error",
      typeof e.message === "string" ? e.message : `The server answered ${status}.`,
      details,
    );
  }
  return new ApiError(status, "error", `The server answered ${status} without an explanation.`);
}

/** SWR fetcher: JSON on success (2xx), ApiError otherwise. Same-origin, so the session cookie goes along. */
export async function fetchJson<T>(url: string): Promise<T> {
  const res = await fetch(url, { headers: { Accept: "application/json" }, cache: "no-store" });
  let body: unknown = null;
  try {
    body = await res.json();
  } catch {
    body = null;
  }
  if (!res.ok) throw toApiError(res.status, body);
  return body as T;
}
