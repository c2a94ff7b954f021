// Queries marked PREPARED (db/database.ts) are named statements: parsed and planned once per
// connection, then only bound and executed (PostgreSQL manual, PREPARE; pg_prepared_statements lists
// a session's prepared statements). Unmarked queries are not prepared, and several statements in one
// unmarked text (the simple query protocol, as migrations use it) still run.
import { sql } from "kysely";
import { afterAll, expect, inject, it } from "vitest";
import { createDb, createPool, PREPARED } from "../../db/database";

const pool = createPool(inject("databaseUrl"), 1);
const db = createDb(pool);
afterAll(() => db.destroy());

const prepared = async () =>
  (
    await sql<{
      statement: string;
    }>`select statement from pg_prepared_statements where statement like '/* prepared */%' order by statement`.execute(
      db,
    )
  ).rows.map((r) => r.statement);

it("prepares a marked query once per connection and answers it like any other", async () => {
  const marked = (n: number) => sql<{ twice: number }>`${sql.raw(PREPARED)} select ${n}::int * 2 as twice`.execute(db);
  expect((await marked(2)).rows).toEqual([{ twice: 4 }]);
  expect((await marked(21)).rows).toEqual([{ twice: 42 }]);
  const statements = await prepared();
  expect(statements).toHaveLength(1);
  expect(statements[0]).toContain("select $1::int * 2 as twice");

  await sql`select ${1}::int as one`.execute(db);
  expect(await prepared()).toHaveLength(1);
  await sql.raw("create temporary table t_prepared (x int); drop table t_prepared").execute(db);
});
