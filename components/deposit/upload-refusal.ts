/**
 * A refused upload (the server answered 4xx/5xx with its JSON error body) is a verdict on the
 * file, which the app explains beside the widget. Uppy would otherwise treat it as a network
 * failure: log "This looks like a network error…" with console.error and show its own
 * "Failed to upload" notice next to the app's message. These pieces tell the two apart.
 */

/** The message of the error thrown for a refused upload; Uppy passes it on as the notice's details. */
export const REFUSED_UPLOAD = "restpoint: the server refused the file";

/** Status and body of an answered request, the parts of an XMLHttpRequest that matter here. */
export interface Answer {
  status: number;
  responseText: string;
}

/** A refusal: the server answered (status set), not with 2xx, and its body is JSON. */
export function isRefusal(answer: Answer): boolean {
  if (answer.status === 0 || (answer.status >= 200 && answer.status < 300)) return false;
  try {
    JSON.parse(answer.responseText);
    return true;
  } catch {
    return false;
  }
}

/**
 * For xhr-upload's `onAfterResponse` (runs before its status check): throws the marked error
 * for a refusal, so the failure reaches `upload-error` as ours rather than as a NetworkError.
 */
export function markRefusal(answer: Answer): void {
  if (isRefusal(answer)) throw new Error(REFUSED_UPLOAD);
}

/** True for an error Uppy built from a marked refusal (ours, or its "Failed to upload" wrapper). */
export function isRefusalMessage(text: unknown): boolean {
  return typeof text === "string" && text.includes(REFUSED_UPLOAD);
}

type LogFn = (...args: unknown[]) => void;

/** Uppy's logger: quiet like its default, errors to the console except refusals. */
export function uploadLogger(error: LogFn): { debug: LogFn; warn: LogFn; error: LogFn } {
  return {
    debug: () => {},
    warn: () => {},
    error: (...args) => {
      if (args.some(isRefusalMessage)) return;
      error("[Uppy]", ...args);
    },
  };
}

export interface InfoEntry {
  type: string;
  message: string;
  details?: string | Record<string, string> | null;
}

/** The notices left once Uppy's own notice about a refusal is taken out. */
export function withoutRefusalNotices<T extends InfoEntry>(info: readonly T[]): T[] {
  return info.filter((i) => !isRefusalMessage(i.details) && !isRefusalMessage(i.message));
}
