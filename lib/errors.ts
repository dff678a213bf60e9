/**
 * The app's failures as Error subclasses with fields. Throw them from lib/ and from server
 * actions; lib/http.ts turns them into JSON responses for route handlers, and pages map them
 * to notFound()/forbidden()/unauthorized() through lib/authz.ts helpers.
 *
 * Each class carries `code` (stable, machine-readable, sent to API clients) and `status`.
 */

/** One problem with the input: where (a field name or a JSON pointer) and what. */
export interface ErrorDetail {
  path: string;
  message: string;
}

export abstract class AppError extends Error {
  abstract readonly code: string;
  abstract readonly status: number;
  /** Extra fields sent to API clients beside code and message (never secrets). */
  details(): ErrorDetail[] | undefined {
    return undefined;
  }
}

/**
 * The input is wrong. `status` 400 for a request that cannot be read at all (not JSON,
 * wrong shape), 422 for a well-formed request whose content breaks a rule (the default).
 */
export class ValidationError extends AppError {
  readonly code = "validation_failed";
  readonly status: 400 | 422;
  readonly problems: ErrorDetail[];
  constructor(message: string, problems: ErrorDetail[] = [], status: 400 | 422 = 422) {
    super(message);
    this.name = "ValidationError";
    this.problems = problems;
    this.status = status;
  }
  override details(): ErrorDetail[] {
    return this.problems;
  }
}

/** No session and no valid API token. */
export class NotSignedIn extends AppError {
  readonly code = "not_signed_in";
  readonly status = 401;
  constructor(message = "Sign in to continue.") {
    super(message);
    this.name = "NotSignedIn";
  }
}

/** Signed in, but this account may not do this. `needed` names the roles that may. */
export class Forbidden extends AppError {
  readonly code = "forbidden";
  readonly status = 403;
  readonly needed: readonly string[];
  constructor(message = "Your account may not do this.", needed: readonly string[] = []) {
    super(message);
    this.name = "Forbidden";
    this.needed = needed;
  }
}

/** The thing does not exist, or its existence is private to someone else (then say nothing more). */
export class NotFound extends AppError {
  readonly code = "not_found";
  readonly status = 404;
  readonly resource: string;
  constructor(resource = "resource", message = `No such ${resource}.`) {
    super(message);
    this.name = "NotFound";
    this.resource = resource;
  }
}

/** The request clashes with the current state (a duplicate, a decision already taken). */
export class Conflict extends AppError {
  readonly code = "conflict";
  readonly status = 409;
  constructor(message: string) {
    super(message);
    this.name = "Conflict";
  }
}

/** Too many requests from this client; `retryAfterSeconds` goes into the Retry-After header. */
export class RateLimited extends AppError {
  readonly code = "rate_limited";
  readonly status = 429;
  readonly retryAfterSeconds: number;
  constructor(retryAfterSeconds: number, message = "Too many attempts. Wait a moment and try again.") {
    super(message);
    this.name = "RateLimited";
    this.retryAfterSeconds = retryAfterSeconds;
  }
}

/** The body is larger than `limitBytes`. */
export class PayloadTooLarge extends AppError {
  readonly code = "payload_too_large";
  readonly status = 413;
  readonly limitBytes: number;
  constructor(limitBytes: number, message = `The upload is larger than the limit of ${formatBytes(limitBytes)}.`) {
    super(message);
    this.name = "PayloadTooLarge";
    this.limitBytes = limitBytes;
  }
}

export function isAppError(e: unknown): e is AppError {
  return e instanceof AppError;
}

function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${(n / (1024 * 1024)).toFixed(n % (1024 * 1024) === 0 ? 0 : 1)} MiB`;
  if (n >= 1024) return `${(n / 1024).toFixed(n % 1024 === 0 ? 0 : 1)} KiB`;
  return `${n} bytes`;
}
