/**
 * Route-handler plumbing: every JSON error answer has the shape
 *   { "error": { "code": string, "message": string, "details"?: [{ path, message }] } }
 * with the status of the AppError (lib/errors.ts); anything else is a 500 with a generic
 * sentence, and the real error goes to the server log only.
 *
 * Usage in app/api/.../route.ts:
 *   export const POST = route(async (req) => {
 *     const actor = await actorFromRequest(req);             // lib/authz.ts
 *     const input = await readJson(req, mySchema);           // 400 / 422 with details
 *     return json(await doThing(actor, input), { status: 201 });
 *   });
 */
import type { z } from "zod";
import { isAppError, RateLimited, ValidationError, type ErrorDetail } from "@/lib/errors";

export interface ErrorBody {
  error: { code: string; message: string; details?: ErrorDetail[] };
}

export const GENERIC_500_MESSAGE = "Something went wrong on our side. The error was logged; please try again later.";

export function json(data: unknown, init?: ResponseInit): Response {
  return Response.json(data, init);
}

/** Maps any thrown value to the JSON error response; logs what is not an AppError. */
export function errorResponse(e: unknown, context = ""): Response {
  if (isAppError(e)) {
    const body: ErrorBody = { error: { code: e.code, message: e.message } };
    const details = e.details();
    if (details !== undefined && details.length > 0) body.error.details = details;
    const headers = new Headers();
    if (e instanceof RateLimited) headers.set("Retry-After", String(e.retryAfterSeconds));
    return Response.json(body, { status: e.status, headers });
  }
  console.error(`[restpoint] unhandled error${context === "" ? "" : ` in ${context}`}:`, e);
  const body: ErrorBody = { error: { code: "internal_error", message: GENERIC_500_MESSAGE } };
  return Response.json(body, { status: 500 });
}

/** Wraps a route handler so thrown errors become JSON answers (see errorResponse). */
export function route<Args extends unknown[]>(
  handler: (req: Request, ...args: Args) => Promise<Response>,
): (req: Request, ...args: Args) => Promise<Response> {
  return async (req, ...args) => {
    try {
      return await handler(req, ...args);
    } catch (e) {
      return errorResponse(e, `${req.method} ${new URL(req.url).pathname}`);
    }
  };
}

/** zod issues as details with JSON-pointer paths ("/claims/0/state"). */
export function zodDetails(error: z.ZodError): ErrorDetail[] {
  return error.issues.map((issue) => ({
    path: issue.path.length === 0 ? "" : `/${issue.path.map((p) => String(p).replace(/~/g, "~0").replace(/\//g, "~1")).join("/")}`,
    message: issue.message,
  }));
}

/** Parses `value` with `schema` or throws a 422 ValidationError listing every problem. */
export function parseWith<S extends z.ZodType>(schema: S, value: unknown, message = "The request has invalid fields."): z.infer<S> {
  const result = schema.safeParse(value);
  if (!result.success) throw new ValidationError(message, zodDetails(result.error));
  return result.data;
}

/** Reads a JSON body: 400 when it is not JSON, 422 (with details) when it breaks the schema. */
export async function readJson<S extends z.ZodType>(req: Request, schema: S): Promise<z.infer<S>> {
  let value: unknown;
  try {
    value = await req.json();
  } catch {
    throw new ValidationError("The request body is not valid JSON.", [], 400);
  }
  return parseWith(schema, value);
}
