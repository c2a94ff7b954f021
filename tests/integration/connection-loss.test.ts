// A query whose connection is cut (pg_terminate_backend, as in a PostgreSQL restart): a read
// outside a transaction runs again on a fresh connection when allowed; anything else is handed
// to `unavailable` (the app's 503). Connections here carry their own application_name, so only
// this test's own are cut.
import { sql } from "kysely";
import { afterAll, describe, expect, it } from "vitest";
import { inject } from "vitest";
import { createDb, createPool } from "../../db/database";
import { testDb } from "../support/db";

const admin = testDb();
const APP = `connection-loss-test-${process.pid}`;
class Unavailable extends Error {}
let readAllowed = true;
const pool = createPool(inject("databaseUrl"), 1, APP);
const db = createDb(pool, 1, {
  mayRetryRead: () => readAllowed,
  unavailable: (error) => new Unavailable(String(error)),
});
afterAll(async () => {
  await db.destroy();
  await admin.destroy();
});

/** Starts `work`, waits until its statement is running, then cuts that connection. */
async function cutWhileRunning<T>(work: () => Promise<T>): Promise<PromiseSettledResult<T>> {
  const running = work();
  running.catch(() => {});
  for (;;) {
    const { rows } = await sql<{ pid: number }>`select pid from pg_stat_activity
      where application_name = ${APP} and state = 'active' and query like '%pg_sleep%'`.execute(admin);
    if (rows.length) {
      await sql`select pg_terminate_backend(${rows[0]!.pid})`.execute(admin);
      break;
    }
    await new Promise((resolve) => setImmediate(resolve));
  }
  const [settled] = await Promise.allSettled([running]);
  return settled;
}

describe("a lost connection", () => {
  it("runs a read again on a fresh connection", async () => {
    readAllowed = true;
    const result = await cutWhileRunning(() => sql<{ one: number }>`select 1 as one from pg_sleep(0.5)`.execute(db));
    expect(result.status).toBe("fulfilled");
    expect(result.status === "fulfilled" && result.value.rows).toEqual([{ one: 1 }]);
  });

  it("does not run a read again when the caller does not allow it (a write request)", async () => {
    readAllowed = false;
    const result = await cutWhileRunning(() => sql`select 1 as one from pg_sleep(0.5)`.execute(db));
    expect(result.status === "rejected" && result.reason).toBeInstanceOf(Unavailable);
    readAllowed = true;
    expect((await sql<{ one: number }>`select 1 as one`.execute(db)).rows).toEqual([{ one: 1 }]);
  });

  it("never runs a statement of a transaction again", async () => {
    readAllowed = true;
    const result = await cutWhileRunning(() =>
      db.transaction().execute(async (trx) => sql`select 1 as one from pg_sleep(0.5)`.execute(trx)),
    );
    expect(result.status === "rejected" && result.reason).toBeInstanceOf(Unavailable);
    expect((await sql<{ one: number }>`select 1 as one`.execute(db)).rows).toEqual([{ one: 1 }]);
  });

  it("replaces a connection that died while idle in the pool", async () => {
    await sql`select 1`.execute(db);
    await sql`select pg_terminate_backend(pid) from pg_stat_activity where application_name = ${APP}`.execute(admin);
    readAllowed = false; // even a write request: nothing had been sent on the dead connection
    expect((await db.transaction().execute((trx) => sql<{ one: number }>`select 1 as one`.execute(trx))).rows).toEqual([
      { one: 1 },
    ]);
    readAllowed = true;
  });
});
