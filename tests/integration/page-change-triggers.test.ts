// Issue 22 item 2: the page cache is emptied "when a report is accepted or the catalogue changes".
// The catalogue and the stored bench figures notify from the database itself (migration
// 2026-12-02T22.00): any statement on those tables, from the app, a script or psql, sends one
// NOTIFY bayproof_pages when its transaction commits. The page cache
// test shows that a notification changes the pages on every process.
// PostgreSQL semantics: CREATE TRIGGER … FOR EACH STATEMENT fires even when no row is touched;
// NOTIFY inside a transaction is delivered at commit (PostgreSQL 15 manual, CREATE TRIGGER, NOTIFY).
import pg from "pg";
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { PAGES_CHANNEL } from "~/http-cache/notify.server";
import { testDb } from "../support/db";

const db = testDb();
const listener = new pg.Client({ connectionString: inject("databaseUrl") });
const received: string[] = [];

beforeAll(async () => {
  await listener.connect();
  listener.on("notification", (m) => {
    if (m.channel === PAGES_CHANNEL) received.push(m.payload ?? "");
  });
  await listener.query(`listen ${PAGES_CHANNEL}`);
});

afterAll(async () => {
  await listener.end();
  await db.destroy();
});

/** Waits for a notification with this payload, sent after `since` notifications had arrived. */
async function arrives(payload: string, since: number) {
  for (let i = 0; i < 500; i++) {
    if (received.slice(since).includes(payload)) return true;
    await new Promise((resolve) => setImmediate(resolve));
    await listener.query("select 1"); // a round trip lets pending notifications in
  }
  return false;
}

describe("page-change triggers", () => {
  it.each([
    ["tool_models", "catalogue"],
    ["makers", "catalogue"],
    ["job_types", "catalogue"],
    ["tool_categories", "catalogue"],
    ["bench_pooled_figures", "bench"],
    ["bench_job_force", "bench"],
    ["bench_pressure_slopes", "bench"],
  ])("a statement on %s notifies '%s' at commit", async (table, payload) => {
    const since = received.length;
    // Touches no row: a statement-level trigger fires all the same, and no other test sees a change.
    await sql`delete from ${sql.table(table)} where false`.execute(db);
    expect(await arrives(payload, since)).toBe(true);
  });
});
