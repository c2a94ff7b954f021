import { Kysely, type Transaction } from "kysely";
import pg from "pg";
import { ConnectionLossDialect, type ConnectionLossPolicy, guardedPool, NO_RETRY } from "./connection-loss";
import type { Database } from "./schema";

/**
 * What every query function takes first: the app's instance or an open transaction, so a caller can put
 * several queries in one transaction. A function that must run inside one takes `Trx`.
 */
export type Db = Kysely<Database> | Transaction<Database>;
export type Trx = Transaction<Database>;

export const DEFAULT_DATABASE_URL = "postgres://bayproof@127.0.0.1:54320/bayproof";

/** `applicationName` names the connections in pg_stat_activity (the web server's: "bayproof-web"). */
export function createPool(connectionString: string, max = 10, applicationName?: string): pg.Pool {
  const pool = new pg.Pool({
    connectionString,
    max,
    ...(applicationName ? { application_name: applicationName } : {}),
  });
  // An idle client losing its connection (a database restart) must not take the process down;
  // the pool replaces it and the next query reports any real outage.
  pool.on("error", (error) => console.warn(`[db] idle connection lost: ${error.message}`));
  return pool;
}

export function createDb(
  connection: string | pg.Pool,
  max = 10,
  policy: ConnectionLossPolicy = NO_RETRY,
): Kysely<Database> {
  const pool = typeof connection === "string" ? createPool(connection, max) : connection;
  return new Kysely<Database>({ dialect: new ConnectionLossDialect({ pool: guardedPool(pool) }, policy) });
}
