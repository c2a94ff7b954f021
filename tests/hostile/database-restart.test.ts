// The web server's database connections cut from under it (pg_terminate_backend on every
// connection named "bayproof-web", as a PostgreSQL restart does): pages and the app's API keep
// answering reads, and a write is either done or refused with a 503 and Retry-After, never a 500.
// The hostile project runs after the others, one file at a time, so no other test is served by
// the connections cut here.
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { testDb } from "../support/db";
import { Browserish, signedInAs } from "../support/http";

const db = testDb();
let reporter: Browserish;
afterAll(() => db.destroy());

beforeAll(async () => {
  const email = `restart-${process.pid}-${Date.now()}@demo.bayproof.test`;
  await db
    .insertInto("users")
    .values({ email, handle: `restart-${Date.now() % 1e8}` })
    .execute();
  reporter = await signedInAs(db, email);
});

const cutAppConnections = async () =>
  (
    await sql<{ cut: number }>`select count(pg_terminate_backend(pid))::int as cut from pg_stat_activity
    where application_name = 'bayproof-web'`.execute(db)
  ).rows[0]!.cut;

describe("a database restart under the web server", () => {
  it("answers reads after every connection was cut", async () => {
    const visitor = new Browserish();
    expect((await visitor.get("/models")).status).toBe(200);
    expect(await cutAppConnections()).toBeGreaterThan(0);
    expect((await visitor.get("/models")).status).toBe(200);
    expect((await reporter.get("/me/reports")).status).toBe(200);
    expect((await visitor.get("/api/models")).status).toBe(200);
  });

  it("answers reads whose connections are cut while they run", async () => {
    const visitor = new Browserish();
    const pages = ["/models", "/jobs", "/api/models", "/search?q=hammer", "/"];
    for (let round = 0; round < 8; round++) {
      const requests = pages.map((p) => visitor.get(p));
      await cutAppConnections();
      const statuses = await Promise.all(requests.map(async (r) => (await r).status));
      expect(statuses, `round ${round}`).toEqual(pages.map(() => 200));
    }
  });

  it("does a write, or refuses it with 503 and Retry-After, never a 500", async () => {
    for (let round = 0; round < 8; round++) {
      const request = reporter.post("/account", { intent: "end-other-sessions" });
      await cutAppConnections();
      const res = await request;
      expect([200, 503], `round ${round}`).toContain(res.status);
      if (res.status === 503) expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(0);
    }
  });
});
