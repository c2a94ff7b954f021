import { sql } from "kysely";
import { afterAll, describe, expect, it } from "vitest";
import { loadDemoScenario } from "../../seeds/index";
import { testDb } from "../support/db";

const db = testDb();
afterAll(() => db.destroy());

async function counts() {
  const r = await sql<
    Record<
      | "makers"
      | "models"
      | "categories"
      | "jobs"
      | "shops"
      | "users"
      | "reports"
      | "accepted"
      | "decisions"
      | "evidence",
      number
    >
  >`
    select (select count(*)::int from makers) makers, (select count(*)::int from tool_models) models,
           (select count(*)::int from tool_categories) categories, (select count(*)::int from job_types) jobs,
           (select count(*)::int from shops) shops, (select count(*)::int from users) users,
           (select count(*)::int from reports) reports, (select count(*)::int from reports where status = 'accepted') accepted,
           (select count(*)::int from decisions) decisions, (select count(*)::int from evidence) evidence`.execute(db);
  return r.rows[0]!;
}

describe("the demo scenario in PostgreSQL", () => {
  it("was loaded by the test setup with every part of the world", async () => {
    const c = await counts();
    expect(c.makers).toBeGreaterThanOrEqual(5);
    expect(c.models).toBeGreaterThanOrEqual(24);
    expect(c.categories).toBeGreaterThanOrEqual(3);
    expect(c.jobs).toBe(14);
    expect(c.shops).toBe(8);
    expect(c.users).toBeGreaterThanOrEqual(44); // other tests add people of their own
    expect(c.reports).toBeGreaterThanOrEqual(3000);
    expect(c.accepted / c.reports).toBeGreaterThan(0.7);
    expect(c.decisions).toBeGreaterThan(c.accepted);
  });

  it("has the well-known demo accounts with their roles", async () => {
    const rows = await db
      .selectFrom("users")
      .leftJoin("user_roles", "user_roles.user_id", "users.id")
      .select(["users.email", "user_roles.role"])
      .where("users.email", "in", [
        "reporter@demo.bayproof.test",
        "moderator@demo.bayproof.test",
        "moderator2@demo.bayproof.test",
        "admin@demo.bayproof.test",
      ])
      .execute();
    const roles = (email: string) =>
      rows
        .filter((r) => r.email === email)
        .map((r) => r.role)
        .filter(Boolean)
        .sort();
    expect(roles("reporter@demo.bayproof.test")).toEqual([]);
    expect(roles("moderator@demo.bayproof.test")).toEqual(["moderator"]);
    expect(roles("moderator2@demo.bayproof.test")).toEqual(["moderator"]);
    expect(roles("admin@demo.bayproof.test")).toEqual(["admin", "moderator"]);
  });

  it("never has a moderator decide on their own report", async () => {
    const own = await db
      .selectFrom("decisions as d")
      .innerJoin("reports as r", "r.id", "d.report_id")
      .select(sql<number>`count(*)::int`.as("n"))
      .whereRef("d.moderator_id", "=", "r.reporter_id")
      .executeTakeFirstOrThrow();
    expect(own.n).toBe(0);
  });

  it("changes nothing when loaded a second time", async () => {
    // Users are left out: other test files sign new people up while this runs.
    const { users: _u, ...before } = await counts();
    expect(await loadDemoScenario(db)).toEqual({ loaded: false, reports: 0 });
    const { users: _u2, ...after } = await counts();
    expect(after).toEqual(before);
  });
});
