/** Path segments as the data-access modules take them. */
import { NotFound } from "@/lib/errors";

/** "3" -> 3; anything that is not a positive whole number names no version. */
export function versionNumber(segment: string): number {
  if (!/^[1-9]\d{0,8}$/.test(segment)) throw new NotFound("version");
  return Number(segment);
}

/** Route files may export handlers only, so their sentences live here (and tests import them). */
export const UNSUPPORTED_SPEC_TYPE_MESSAGE = "Send the specification as application/json, or as one file in multipart/form-data.";

export const TOKEN_FROM_TOKEN_MESSAGE =
  "API tokens are created in the browser, in your settings; a token cannot create further tokens.";
