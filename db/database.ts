import { Kysely, type Transaction } from "kysely";
import { createHash } from "node:crypto";
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
  pool.on("connect", preparesMarkedQueries);
  return pool;
}

/**
 * Put first in a query's text (a `sql` template), it asks for the query to be prepared: parsed and
 * planned once per connection and then only bound and executed (PostgreSQL: PREPARE; node-postgres:
 * a named query). For the few statements every feed answer and signed-in page runs, where parsing
 * and planning cost more than executing. The statement is named by a digest of its text, so each
 * distinct text (a filter present or absent) is its own statement; keep such variants few.
 * Named statements need a session of their own: behind a pooler in transaction mode, leave it out.
 */
export const PREPARED = "/* prepared */";

/** Statement names by text, shared by every connection: the marked texts are few, so this stays small. */
const statementNames = new Map<string, string>();
const statementName = (text: string) => {
  let name = statementNames.get(text);
  if (!name) statementNames.set(text, (name = `bp_${createHash("sha1").update(text).digest("base64url")}`));
  return name;
};

/** Sends queries whose text starts with PREPARED as named queries on this connection. */
function preparesMarkedQueries(client: pg.PoolClient) {
  const query = client.query.bind(client) as (...args: unknown[]) => unknown;
  (client as { query: unknown }).query = (config: unknown, values?: unknown, callback?: unknown) =>
    typeof config === "string" && config.startsWith(PREPARED) && callback === undefined
      ? query({ name: statementName(config), text: config, values })
      : query(config, values, callback);
}

export function createDb(
  connection: string | pg.Pool,
  max = 10,
  policy: ConnectionLossPolicy = NO_RETRY,
): Kysely<Database> {
  const pool = typeof connection === "string" ? createPool(connection, max) : connection;
  return new Kysely<Database>({ dialect: new ConnectionLossDialect({ pool: guardedPool(pool) }, policy) });
}
