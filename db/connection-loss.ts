// Surviving a lost database connection (a PostgreSQL restart, a dropped socket). Kysely's
// PostgreSQL driver is wrapped so that:
//   - acquiring a connection that cannot be made yet is tried again for a moment (nothing has
//     been sent, so this is safe for any request);
//   - a read (a SELECT outside a transaction) whose connection dropped runs again on a fresh
//     connection, when the caller allows it (the app: only while serving GET and HEAD); a
//     pooled connection that turns out dead as well is skipped the same way, up to three times;
//   - any other lost query, and a transaction whose connection dropped, is handed to
//     `unavailable`, which the app turns into a 503 with Retry-After.
// Plain Kysely and pg: no framework here.
import {
  type CompiledQuery,
  type DatabaseConnection,
  type Driver,
  PostgresDialect,
  type PostgresDialectConfig,
  type PostgresPool,
  type QueryCompiler,
  type QueryResult,
  type TransactionSettings,
} from "kysely";
import type pg from "pg";

const CONNECTION_CODES = new Set([
  "ECONNRESET",
  "ECONNREFUSED",
  "EPIPE",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENETUNREACH",
  "EAI_AGAIN",
  "57P01", // admin_shutdown (a restart, pg_terminate_backend)
  "57P02", // crash_shutdown
  "57P03", // cannot_connect_now (starting up, shutting down)
  "08000",
  "08001",
  "08003",
  "08004",
  "08006",
  "08007", // connection_exception and its kinds
]);
const CONNECTION_MESSAGES =
  /Connection terminated|Client has encountered a connection error|not queryable|timeout exceeded when trying to connect|Client was closed and is not queryable/i;

/** Whether an error means the connection to PostgreSQL was lost or could not be made. */
export function isConnectionError(error: unknown): boolean {
  if (!(error instanceof Error)) return false;
  if (error instanceof AggregateError && error.errors.some(isConnectionError)) return true;
  const code = (error as { code?: unknown }).code;
  if (typeof code === "string") return CONNECTION_CODES.has(code);
  return CONNECTION_MESSAGES.test(error.message);
}

/** A query that only reads: safe to run again when its answer never arrived. */
export function isReadQuery(query: CompiledQuery): boolean {
  if (query.query.kind === "SelectQueryNode") return true;
  return (
    query.query.kind === "RawNode" && /^\s*select\b/i.test(query.sql) && !/\b(insert|update|delete)\b/i.test(query.sql)
  );
}

export interface ConnectionLossPolicy {
  /** May a read whose connection dropped run again now? */
  mayRetryRead(): boolean;
  /** What to throw for a lost connection that is not retried (default: the error itself). */
  unavailable(error: unknown): unknown;
}

export const NO_RETRY: ConnectionLossPolicy = { mayRetryRead: () => false, unavailable: (error) => error };

const CONNECT_DELAYS_MS = [100, 200, 400, 800];
/** The read is sent again once; the later tries only skip pooled connections found dead. */
const READ_RETRY_DELAYS_MS = [20, 100, 300];
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

class Connection implements DatabaseConnection {
  inTransaction = false;
  constructor(
    private readonly driver: ConnectionLossDriver,
    public inner: DatabaseConnection,
  ) {}

  async executeQuery<R>(query: CompiledQuery): Promise<QueryResult<R>> {
    for (let attempt = 0; ; attempt++) {
      try {
        return await this.inner.executeQuery<R>(query);
      } catch (error) {
        if (!isConnectionError(error)) throw error;
        const retry =
          !this.inTransaction &&
          isReadQuery(query) &&
          this.driver.policy.mayRetryRead() &&
          attempt < READ_RETRY_DELAYS_MS.length;
        if (!retry) throw this.driver.policy.unavailable(error);
        // A restart cuts every pooled connection at once: give the pool a moment to hear of the
        // others' end, so the read runs again on a live one rather than on the next dead one.
        await sleep(READ_RETRY_DELAYS_MS[attempt]!);
        await this.replace();
      }
    }
  }

  streamQuery<R>(query: CompiledQuery, chunkSize?: number): AsyncIterableIterator<QueryResult<R>> {
    return this.inner.streamQuery<R>(query, chunkSize);
  }

  /** Gives the broken connection back (the pool drops it) and takes a fresh one. */
  async replace() {
    await this.driver.inner.releaseConnection(this.inner).catch(() => {});
    this.inner = await this.driver.connect();
  }
}

export class ConnectionLossDriver implements Driver {
  constructor(
    readonly inner: Driver,
    readonly policy: ConnectionLossPolicy,
  ) {}

  init() {
    return this.inner.init();
  }

  /** A fresh connection, trying again for about 1.5 s while PostgreSQL cannot take one. */
  async connect(): Promise<DatabaseConnection> {
    for (let attempt = 0; ; attempt++) {
      try {
        return await this.inner.acquireConnection();
      } catch (error) {
        if (!isConnectionError(error)) throw error;
        if (attempt >= CONNECT_DELAYS_MS.length) throw this.policy.unavailable(error);
        await sleep(CONNECT_DELAYS_MS[attempt]!);
      }
    }
  }

  async acquireConnection(): Promise<DatabaseConnection> {
    return new Connection(this, await this.connect());
  }

  async beginTransaction(connection: DatabaseConnection, settings: TransactionSettings) {
    const c = connection as Connection;
    try {
      await this.inner.beginTransaction(c.inner, settings);
    } catch (error) {
      // Nothing ran yet: a connection that died while idle in the pool is simply replaced.
      if (!isConnectionError(error)) throw error;
      await c.replace();
      await this.inner.beginTransaction(c.inner, settings).catch((again) => {
        throw isConnectionError(again) ? this.policy.unavailable(again) : again;
      });
    }
    c.inTransaction = true;
  }

  async commitTransaction(connection: DatabaseConnection) {
    const c = connection as Connection;
    try {
      await this.inner.commitTransaction(c.inner);
    } catch (error) {
      throw isConnectionError(error) ? this.policy.unavailable(error) : error;
    } finally {
      c.inTransaction = false;
    }
  }

  async rollbackTransaction(connection: DatabaseConnection) {
    const c = connection as Connection;
    try {
      await this.inner.rollbackTransaction(c.inner);
    } catch (error) {
      // A lost connection has rolled the transaction back already; the error that led here stands.
      if (!isConnectionError(error)) throw error;
    } finally {
      c.inTransaction = false;
    }
  }

  async savepoint(connection: DatabaseConnection, name: string, compile: QueryCompiler["compileQuery"]) {
    await this.inner.savepoint!((connection as Connection).inner, name, compile);
  }

  async rollbackToSavepoint(connection: DatabaseConnection, name: string, compile: QueryCompiler["compileQuery"]) {
    await this.inner.rollbackToSavepoint!((connection as Connection).inner, name, compile);
  }

  async releaseSavepoint(connection: DatabaseConnection, name: string, compile: QueryCompiler["compileQuery"]) {
    await this.inner.releaseSavepoint!((connection as Connection).inner, name, compile);
  }

  releaseConnection(connection: DatabaseConnection) {
    return this.inner.releaseConnection((connection as Connection).inner);
  }

  destroy() {
    return this.inner.destroy();
  }
}

/**
 * The pool as Kysely sees it. A checked-out client whose connection dies emits "error", which
 * would end the process if nobody listened; and a client that lost its connection must be given
 * back as broken (release(error)) or the pool would hand it out again.
 */
export function guardedPool(pool: pg.Pool): PostgresPool {
  return {
    async connect() {
      const client = await pool.connect();
      let lost: Error | undefined;
      const onError = (error: Error) => {
        lost ??= error;
      };
      client.on("error", onError);
      return {
        query: ((...args: Parameters<pg.PoolClient["query"]>) => {
          const result = (client.query as (...a: unknown[]) => unknown)(...args);
          if (result instanceof Promise) {
            result.catch((error: unknown) => {
              if (isConnectionError(error)) lost ??= error as Error;
            });
          }
          return result;
        }) as pg.PoolClient["query"],
        release() {
          client.off("error", onError);
          client.release(lost);
        },
      };
    },
    end: () => pool.end(),
  };
}

/** PostgresDialect with the connection-loss rules above. */
export class ConnectionLossDialect extends PostgresDialect {
  constructor(
    config: PostgresDialectConfig,
    private readonly policy: ConnectionLossPolicy,
  ) {
    super(config);
  }

  override createDriver(): Driver {
    return new ConnectionLossDriver(super.createDriver(), this.policy);
  }
}
