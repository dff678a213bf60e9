/** A `next` parameter is followed only when it is a path on this site (no "//host", no scheme). */
export function safeNext(value: string | string[] | undefined | null, fallback = "/workspace"): string {
  const v = Array.isArray(value) ? value[0] : value;
  if (typeof v !== "string" || !v.startsWith("/") || v.startsWith("//") || v.startsWith("/\\")) return fallback;
  return v;
}
