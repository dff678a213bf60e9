/**
 * The database connection: libSQL (embedded file by default, or a libSQL server through
 * DATABASE_URL) wrapped by Drizzle. One client per process.
 */
import { mkdirSync } from "node:fs";
import path from "node:path";
import { createClient, type Client } from "@libsql/client";
import { drizzle, type LibSQLDatabase } from "drizzle-orm/libsql";
import { env } from "@/lib/env";
import * as schema from "./schema";

export type Database = LibSQLDatabase<typeof schema>;

function open(url: string, authToken?: string): { client: Client; db: Database } {
  if (url.startsWith("file:")) {
    mkdirSync(path.dirname(url.slice("file:".length)), { recursive: true });
  }
  // `timeout` is SQLite's busy timeout for embedded files, applied to every pooled connection
  // (a PRAGMA would reach only one). It blocks the thread while it waits, so it is short; the
  // queue and deposit code retry "database is locked" asynchronously (lib/jobs.ts withBusyRetry).
  const client = createClient({ url, authToken, timeout: 250 });
  return { client, db: drizzle(client, { schema }) };
}

const globalForDb = globalThis as unknown as { __restpointDb?: { client: Client; db: Database } };

function connection() {
  globalForDb.__restpointDb ??= open(env.databaseUrl, env.DATABASE_AUTH_TOKEN);
  return globalForDb.__restpointDb;
}

// An embedded libSQL file gives each transaction its own connection and waits for a busy
// database synchronously, so two transactions of one process would block each other until
// the busy timeout. Transactions of this process therefore run one after another.
let transactionQueue: Promise<unknown> = Promise.resolve();
function oneAtATime<T>(run: () => Promise<T>): Promise<T> {
  const result = transactionQueue.then(run, run);
  transactionQueue = result.catch(() => undefined);
  return result;
}

/** Drizzle over the process's one libSQL client (opened on first use); `db.transaction` is serialised per process. */
export const db: Database = new Proxy({} as Database, {
  get(_target, prop) {
    const real = connection().db as unknown as Record<PropertyKey, unknown>;
    const value = real[prop];
    if (typeof value !== "function") return value;
    const bound = (value as (...a: unknown[]) => unknown).bind(real);
    if (prop !== "transaction") return bound;
    return (...args: unknown[]) => oneAtATime(() => bound(...args) as Promise<unknown>);
  },
});

export function rawClient(): Client {
  return connection().client;
}
