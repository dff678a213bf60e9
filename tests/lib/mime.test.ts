/** lib/mime.ts reads what nodemailer writes (the fake SMTP server stores it). */
import nodemailer, { type SendMailOptions } from "nodemailer";
import { describe, expect, it } from "vitest";
import { decodeHeaderValue, parseMail } from "@/lib/mime";

async function compose(message: SendMailOptions): Promise<string> {
  // nodemailer's stream transport builds the exact RFC 5322 text it would send.
  const t = nodemailer.createTransport({ streamTransport: true, buffer: true, newline: "unix" });
  const info = await t.sendMail(message);
  return (info.message as Buffer).toString("utf8");
}

describe("parseMail", () => {
  it("reads a text and HTML message with non-ASCII subject and body", async () => {
    const raw = await compose({
      from: "Restpoint <no-reply@restpoint.local>",
      to: "Zoë Ødegård <zoe@example.test>",
      subject: "Bestätigen Sie Ihre Adresse — Restpoint",
      text: "Grüße,\nopen http://localhost:3000/api/auth/verify-email?token=abc.def-ghi&callbackURL=%2F\n" + "x".repeat(120),
      html: "<p>Grüße</p>",
    });
    const m = parseMail(raw);
    expect(m.subject).toBe("Bestätigen Sie Ihre Adresse — Restpoint");
    expect(m.from).toBe("Restpoint <no-reply@restpoint.local>");
    expect(m.to).toContain("zoe@example.test");
    expect(m.text).toContain("Grüße,");
    expect(m.text).toContain("http://localhost:3000/api/auth/verify-email?token=abc.def-ghi&callbackURL=%2F");
    expect(m.text).toContain("x".repeat(120));
    expect(m.html).toBe("<p>Grüße</p>");
    expect(m.messageId).toMatch(/^<.+>$/);
  });

  it("reads a plain single-part message", () => {
    const m = parseMail("Subject: Hi\r\nFrom: a@b.test\r\nTo: c@d.test\r\n\r\nLine one\r\nLine two\r\n");
    expect(m).toMatchObject({ subject: "Hi", from: "a@b.test", to: "c@d.test", text: "Line one\nLine two", html: null });
  });

  it("decodes base64 and quoted-printable encoded words", () => {
    expect(decodeHeaderValue("=?UTF-8?B?w4lwaW5l?=")).toBe("Épine");
    expect(decodeHeaderValue("=?utf-8?Q?caf=C3=A9_au_lait?= now")).toBe("café au lait now");
    expect(decodeHeaderValue("=?UTF-8?Q?a?= =?UTF-8?Q?b?=")).toBe("ab");
  });
});
