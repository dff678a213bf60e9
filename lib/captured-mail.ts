/**
 * Data access for mail caught by the local fake SMTP server (table captured_mail).
 * Pages call these after lib/authz.ts has decided who may read captured mail.
 */
import "server-only";
import { desc, eq, like } from "drizzle-orm";
import { db } from "@/db/client";
import { capturedMail } from "@/db/schema";
import { parseMail } from "@/lib/mime";

export interface CapturedMail {
  id: string;
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  receivedAt: Date;
}

/** Parses a raw RFC 5322 message and stores it; `envelopeTo` is used when the To header is empty. */
export async function storeRawMail(raw: string, envelopeFrom: string, envelopeTo: string[]): Promise<string> {
  const parsed = parseMail(raw);
  const [row] = await db
    .insert(capturedMail)
    .values({
      messageId: parsed.messageId,
      from: parsed.from === "" ? envelopeFrom : parsed.from,
      to: parsed.to === "" ? envelopeTo.join(", ") : parsed.to,
      subject: parsed.subject,
      text: parsed.text,
      html: parsed.html,
      raw,
    })
    .returning({ id: capturedMail.id });
  if (row === undefined) throw new Error("captured_mail insert returned no row");
  return row.id;
}

const listColumns = {
  id: capturedMail.id,
  from: capturedMail.from,
  to: capturedMail.to,
  subject: capturedMail.subject,
  text: capturedMail.text,
  html: capturedMail.html,
  receivedAt: capturedMail.receivedAt,
};

/** Newest first. `to` filters on a recipient address (substring match on the To header). */
export async function listCapturedMail(options: { to?: string; limit?: number } = {}): Promise<CapturedMail[]> {
  const query = db.select(listColumns).from(capturedMail);
  const filtered = options.to === undefined ? query : query.where(like(capturedMail.to, `%${options.to.toLowerCase()}%`));
  return filtered.orderBy(desc(capturedMail.receivedAt)).limit(options.limit ?? 100);
}

export async function getCapturedMail(id: string): Promise<CapturedMail | null> {
  const [row] = await db.select(listColumns).from(capturedMail).where(eq(capturedMail.id, id)).limit(1);
  return row ?? null;
}

/** The links in a message's text (verification and reset links live there). */
export function linksIn(mail: Pick<CapturedMail, "text">): string[] {
  return [...mail.text.matchAll(/https?:\/\/[^\s<>"')]+/g)].map((m) => m[0]);
}
