/**
 * A small MIME reader for the fake SMTP server: enough of RFC 5322 / 2045-2047 to show what
 * nodemailer (or any ordinary mailer) sends: folded headers, encoded words in headers,
 * quoted-printable and base64 bodies, nested multipart parts. It keeps the first text/plain
 * and the first text/html part.
 */

export interface ParsedMail {
  headers: Map<string, string>;
  subject: string;
  from: string;
  to: string;
  messageId: string | null;
  text: string;
  html: string | null;
}

function splitHeadBody(raw: string): { head: string; body: string } {
  const m = /\r?\n\r?\n/.exec(raw);
  if (m === null) return { head: raw, body: "" };
  return { head: raw.slice(0, m.index), body: raw.slice(m.index + m[0].length) };
}

function parseHeaders(head: string): Map<string, string> {
  const headers = new Map<string, string>();
  // Folded lines continue with whitespace (RFC 5322 section 2.2.3).
  const unfolded = head.replace(/\r?\n[ \t]+/g, " ");
  for (const line of unfolded.split(/\r?\n/)) {
    const colon = line.indexOf(":");
    if (colon <= 0) continue;
    const name = line.slice(0, colon).trim().toLowerCase();
    if (!headers.has(name)) headers.set(name, line.slice(colon + 1).trim());
  }
  return headers;
}

function decodeBytes(bytes: Uint8Array, charset: string): string {
  try {
    return new TextDecoder(charset).decode(bytes);
  } catch {
    return new TextDecoder("utf-8").decode(bytes);
  }
}

function quotedPrintableBytes(input: string, inHeader: boolean): Uint8Array {
  const text = inHeader ? input.replace(/_/g, " ") : input.replace(/=\r?\n/g, "");
  const out: number[] = [];
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    const hex = text.slice(i + 1, i + 3);
    if (c === "=" && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      out.push(parseInt(hex, 16));
      i += 2;
    } else {
      for (const b of new TextEncoder().encode(c ?? "")) out.push(b);
    }
  }
  return Uint8Array.from(out);
}

/** Decodes RFC 2047 encoded words ("=?UTF-8?Q?...?=", "=?utf-8?B?...?="). */
export function decodeHeaderValue(value: string): string {
  return value
    .replace(/(=\?[^?]+\?[BbQq]\?[^?]*\?=)\s+(?==\?)/g, "$1")
    .replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g, (_all, charset: string, enc: string, data: string) => {
      const bytes = enc.toUpperCase() === "B" ? Uint8Array.from(Buffer.from(data, "base64")) : quotedPrintableBytes(data, true);
      return decodeBytes(bytes, charset);
    });
}

function param(headerValue: string, name: string): string | null {
  const m = new RegExp(`${name}\\s*=\\s*(?:"([^"]*)"|([^;\\s]+))`, "i").exec(headerValue);
  if (m === null) return null;
  return m[1] ?? m[2] ?? null;
}

function decodeBody(body: string, headers: Map<string, string>): string {
  const encoding = (headers.get("content-transfer-encoding") ?? "7bit").toLowerCase();
  const charset = param(headers.get("content-type") ?? "", "charset") ?? "utf-8";
  if (encoding === "base64") return decodeBytes(Uint8Array.from(Buffer.from(body.replace(/\s+/g, ""), "base64")), charset);
  if (encoding === "quoted-printable") return decodeBytes(quotedPrintableBytes(body, false), charset);
  return body;
}

function walk(raw: string, found: { text: string | null; html: string | null }): Map<string, string> {
  const { head, body } = splitHeadBody(raw);
  const headers = parseHeaders(head);
  const type = (headers.get("content-type") ?? "text/plain").toLowerCase();
  if (type.startsWith("multipart/")) {
    const boundary = param(headers.get("content-type") ?? "", "boundary");
    if (boundary !== null) {
      const parts = body.split(`--${boundary}`);
      // parts[0] is the preamble; the last part starts with "--" (the closing delimiter).
      for (const part of parts.slice(1)) {
        if (part.startsWith("--")) break;
        walk(part.replace(/^\r?\n/, ""), found);
      }
    }
  } else if (type.startsWith("text/html")) {
    found.html ??= decodeBody(body, headers).replace(/\r\n/g, "\n").trimEnd();
  } else if (type.startsWith("text/plain") || !headers.has("content-type")) {
    found.text ??= decodeBody(body, headers).replace(/\r\n/g, "\n").trimEnd();
  }
  return headers;
}

export function parseMail(raw: string): ParsedMail {
  const found: { text: string | null; html: string | null } = { text: null, html: null };
  const headers = walk(raw, found);
  const get = (name: string) => decodeHeaderValue(headers.get(name) ?? "");
  return {
    headers,
    subject: get("subject"),
    from: get("from"),
    to: get("to"),
    messageId: headers.get("message-id") ?? null,
    text: found.text ?? "",
    html: found.html,
  };
}
