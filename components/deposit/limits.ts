/**
 * Upload limits as the client states and checks them before sending. The server checks the
 * same numbers again (it must; a script does not run this code).
 */
// The same numbers as lib/storage.ts (server-only, so not importable here); a test keeps them equal.
export const SPEC_MAX_BYTES = 1_000_000;
export const SUPPLEMENT_MAX_BYTES = 50_000_000;

/** Uppy matches either an extension or a media type per entry. */
export const SPEC_ACCEPT = [".json", "application/json"];
export const SUPPLEMENT_ACCEPT = [".csv", ".pdf", ".zip", ".txt", "text/csv", "application/pdf", "application/zip", "text/plain"];

export const SPEC_NOTE = "One specification: a .json file up to 1 MB.";
export const SUPPLEMENT_NOTE = "Supplementary files: CSV, PDF, ZIP or plain text, up to 50 MB each.";
