/**
 * The local fake SMTP server (development, tests, demo deployments without SMTP_URL): accepts
 * every message on 127.0.0.1 without authentication or TLS and stores it in captured_mail.
 * One per process; started by instrumentation.ts, or lazily by lib/mail.ts on first send.
 */
import "server-only";
import type { AddressInfo } from "node:net";
import { SMTPServer } from "smtp-server";
import { env } from "@/lib/env";
import { storeRawMail } from "@/lib/captured-mail";

interface Running {
  server: SMTPServer;
  port: number;
}

const slot = globalThis as unknown as { __restpointFakeSmtp?: Promise<Running> };

function listen(server: SMTPServer, port: number): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (e: Error) => reject(e);
    server.once("error", onError);
    server.listen(port, "127.0.0.1", () => {
      server.off("error", onError);
      resolve((server.server.address() as AddressInfo).port);
    });
  });
}

function create(): SMTPServer {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    banner: "Restpoint fake SMTP",
    size: 5 * 1024 * 1024,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("end", () => {
        const from = session.envelope.mailFrom === false ? "" : session.envelope.mailFrom.address;
        const to = session.envelope.rcptTo.map((r) => r.address);
        storeRawMail(Buffer.concat(chunks).toString("utf8"), from, to).then(
          () => callback(),
          (e: unknown) => {
            console.error("[restpoint] fake SMTP could not store a message:", e);
            callback(new Error("could not store the message"));
          },
        );
      });
    },
  });
  // A client dropping the connection is not our error; log anything else.
  server.on("error", (e) => console.error("[restpoint] fake SMTP:", e.message));
  return server;
}

async function start(): Promise<Running> {
  let server = create();
  let port: number;
  try {
    port = await listen(server, env.FAKE_SMTP_PORT);
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code !== "EADDRINUSE") throw e;
    // Another process (a second dev server, the worker) holds the usual port: take a free one.
    server = create();
    port = await listen(server, 0);
    console.warn(`[restpoint] port ${env.FAKE_SMTP_PORT} is busy; fake SMTP listens on ${port} instead`);
  }
  return { server, port };
}

/** Starts the fake server once per process and resolves to its port. */
export function startFakeSmtp(): Promise<{ port: number }> {
  slot.__restpointFakeSmtp ??= start().catch((e: unknown) => {
    slot.__restpointFakeSmtp = undefined;
    throw e;
  });
  return slot.__restpointFakeSmtp.then((r) => ({ port: r.port }));
}

export async function stopFakeSmtp(): Promise<void> {
  const running = slot.__restpointFakeSmtp;
  slot.__restpointFakeSmtp = undefined;
  if (running === undefined) return;
  const { server } = await running;
  await new Promise<void>((resolve) => server.close(() => resolve()));
}
