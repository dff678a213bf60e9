/**
 * The database connection: libSQL (embedded file by default, or a libSQL server through
 * DATABASE_URL) wrapped by Drizzle. One client per process.
 */
import { mkdirSync } from "node:fs";
import path from "node:path";
import {
  createClient,
  type Client,
  type InArgs,
  type InStatement,
  type Replicated,
  type ResultSet,
  type Transaction,
  type TransactionMode,
} from "@libsql/client";
import { drizzle, type LibSQLDatabase } from "drizzle-orm/libsql";
import { env } from "@/lib/env";
import * as schema from "./schema";

export type Database = LibSQLDatabase<typeof schema>;

/** True for SQLite's "database is locked" (SQLITE_BUSY), anywhere in the error's cause chain. */
export function isBusyError(e: unknown): boolean {
  for (let cur: unknown = e; cur instanceof Error; cur = cur.cause) {
    const code = (cur as { code?: unknown }).code;
    if (code === "SQLITE_BUSY" || /SQLITE_BUSY|database is locked/.test(cur.message)) return true;
  }
  return false;
}

/** One @libsql/client instance and the operations (open transactions included) still using it. */
interface Generation {
  client: Client;
  inFlight: number;
  retired: boolean;
}

/**
 * An embedded-file client that never reuses a connection on which a statement failed with
 * SQLITE_BUSY.
 *
 * Why: the embedded driver (libsql 0.5.29, under @libsql/client 0.18.0) does not reset a statement
 * whose step returned SQLITE_BUSY; it stays active until garbage collection finalizes it. SQLite
 * commits an autocommit write only when no other writing statement is active on the connection,
 * so every later INSERT/UPDATE ... RETURNING on that pooled connection (which still reports no
 * open transaction) returns its rows but stays uncommitted: visible to this process only,
 * holding the write lock, and rolled back when the stuck statement is finalized (a later COMMIT
 * fails with "cannot commit transaction - SQL statements in progress"). Under load this handed
 * the same queued job to several workers. Closing the connection does not help either (it stays
 * open until its statements are collected), so after a busy error this client moves all new work
 * to a fresh @libsql/client and closes the old one once its open transactions have settled.
 */
class BusyResetClient implements Client {
  readonly #open: () => Client;
  #current: Generation;
  #closed = false;

  constructor(open: () => Client) {
    this.#open = open;
    this.#current = this.#fresh();
  }

  get closed(): boolean {
    return this.#closed;
  }

  get protocol(): string {
    return this.#current.client.protocol;
  }

  /** Sends new work to a fresh client; `gen` is closed once nothing uses it any more. */
  #retire(gen: Generation): void {
    if (gen.retired) return;
    gen.retired = true;
    if (gen === this.#current && !this.#closed) this.#current = this.#fresh();
    if (gen.inFlight === 0) gen.client.close();
  }

  #fresh(): Generation {
    return { client: this.#open(), inFlight: 0, retired: false };
  }

  #done(gen: Generation): void {
    gen.inFlight -= 1;
    if (gen.retired && gen.inFlight === 0) gen.client.close();
  }

  async #run<T>(work: (client: Client) => Promise<T>): Promise<T> {
    const gen = this.#current;
    gen.inFlight += 1;
    try {
      return await work(gen.client);
    } catch (e) {
      if (isBusyError(e)) this.#retire(gen);
      throw e;
    } finally {
      this.#done(gen);
    }
  }

  execute(stmt: InStatement): Promise<ResultSet>;
  execute(sql: string, args?: InArgs): Promise<ResultSet>;
  execute(stmtOrSql: InStatement | string, args?: InArgs): Promise<ResultSet> {
    return this.#run((c) => (typeof stmtOrSql === "string" ? c.execute(stmtOrSql, args) : c.execute(stmtOrSql)));
  }

  batch(stmts: Array<InStatement | [string, InArgs?]>, mode?: TransactionMode): Promise<ResultSet[]> {
    return this.#run((c) => c.batch(stmts, mode));
  }

  migrate(stmts: InStatement[]): Promise<ResultSet[]> {
    return this.#run((c) => c.migrate(stmts));
  }

  executeMultiple(sql: string): Promise<void> {
    return this.#run((c) => c.executeMultiple(sql));
  }

  sync(): Promise<Replicated> {
    return this.#run((c) => c.sync());
  }

  /** The transaction keeps its generation in use until it commits, rolls back or closes. */
  async transaction(mode?: TransactionMode): Promise<Transaction> {
    const gen = this.#current;
    gen.inFlight += 1;
    let inner: Transaction;
    try {
      inner = await gen.client.transaction(mode);
    } catch (e) {
      if (isBusyError(e)) this.#retire(gen);
      this.#done(gen);
      throw e;
    }
    let settled = false;
    const settle = () => {
      if (settled) return;
      settled = true;
      this.#done(gen);
    };
    const guard = async <T>(work: () => Promise<T>): Promise<T> => {
      try {
        return await work();
      } catch (e) {
        if (isBusyError(e)) this.#retire(gen);
        throw e;
      }
    };
    return {
      execute: (stmt: InStatement) => guard(() => inner.execute(stmt)),
      batch: (stmts: InStatement[]) => guard(() => inner.batch(stmts)),
      executeMultiple: (sql: string) => guard(() => inner.executeMultiple(sql)),
      commit: () => guard(() => inner.commit()).finally(settle),
      rollback: () => guard(() => inner.rollback()).finally(settle),
      close: () => {
        try {
          inner.close();
        } finally {
          settle();
        }
      },
      get closed() {
        return inner.closed;
      },
    };
  }

  reconnect(): void {
    const old = this.#current;
    this.#closed = false;
    this.#current = this.#fresh();
    this.#retire(old);
  }

  close(): void {
    this.#closed = true;
    this.#retire(this.#current);
  }
}

function open(url: string, authToken?: string): { client: Client; db: Database } {
  // `timeout` is SQLite's busy timeout for embedded files, applied to every pooled connection
  // (a PRAGMA would reach only one). It blocks the thread while it waits, so it is short; the
  // queue and deposit code retry "database is locked" asynchronously (lib/jobs.ts withBusyRetry).
  const connect = () => createClient({ url, authToken, timeout: 250 });
  let client: Client;
  if (url.startsWith("file:")) {
    mkdirSync(path.dirname(url.slice("file:".length)), { recursive: true });
    client = new BusyResetClient(connect);
  } else {
    client = connect();
  }
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
