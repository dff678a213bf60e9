/** Headers for sending a stored file back: always as an attachment, never sniffed into HTML. */

/** Content-Disposition with an ASCII fallback and the exact name in RFC 5987 form. */
export function attachmentDisposition(name: string): string {
  const ascii = name.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}

export function downloadHeaders(info: { mediaType: string; size: number; originalName: string; sha256: string }, isPublic: boolean): Headers {
  return new Headers({
    "Content-Type": info.mediaType,
    "Content-Length": String(info.size),
    "Content-Disposition": attachmentDisposition(info.originalName),
    "X-Content-Type-Options": "nosniff",
    // Stored by content hash: the bytes behind an id never change.
    "Cache-Control": isPublic ? "public, max-age=31536000, immutable" : "private, max-age=0, must-revalidate",
    ETag: `"${info.sha256}"`,
    "Content-Security-Policy": "default-src 'none'; sandbox",
  });
}
