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
  const client = createClient({ url, authToken });
  return { client, db: drizzle(client, { schema }) };
}

const globalForDb = globalThis as unknown as { __restpointDb?: { client: Client; db: Database } };

function connection() {
  globalForDb.__restpointDb ??= open(env.databaseUrl, env.DATABASE_AUTH_TOKEN);
  return globalForDb.__restpointDb;
}

/** Drizzle over the process's one libSQL client (opened on first use). */
export const db: Database = new Proxy({} as Database, {
  get(_target, prop) {
    const real = connection().db as unknown as Record<PropertyKey, unknown>;
    const value = real[prop];
    return typeof value === "function" ? (value as (...a: unknown[]) => unknown).bind(real) : value;
  },
});

export function rawClient(): Client {
  return connection().client;
}
