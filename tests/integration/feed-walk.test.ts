// Walking /api/v1/reports page by page while reports are accepted between the pages: every
// report accepted up to the walk's horizon comes back exactly once, in (accepted_at, id) order.
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createApiKey } from "../../app/auth/api-keys.server";
import { testDb } from "../support/db";
import { feedClient } from "../support/feed";

const db = testDb();
const added: number[] = [];
let get: ReturnType<typeof feedClient>;

beforeAll(async () => {
  const user = await db
    .selectFrom("users")
    .select("id")
    .where("email", "=", "reporter@demo.bayproof.test")
    .executeTakeFirstOrThrow();
  get = feedClient(undefined, await createApiKey(db, user.id, "walk tests"));
});
afterAll(async () => {
  if (added.length) await db.deleteFrom("reports").where("id", "in", added).execute();
  await db.destroy();
});

/** Accepts a copy of an existing accepted report, at `at` (now by default). */
async function acceptOne(at: Date | null = null) {
  const {
    id: _id,
    created_at: _c,
    updated_at: _u,
    ...row
  } = await db
    .selectFrom("reports")
    .selectAll()
    .where("status", "=", "accepted")
    .orderBy("id")
    .limit(1)
    .executeTakeFirstOrThrow();
  const { id } = await db
    .insertInto("reports")
    .values({
      ...row,
      notes: "Accepted during a feed walk (test)",
      accepted_at: at ?? (sql<Date>`now()` as never),
      decided_at: sql`now()` as never,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  added.push(id);
  return id;
}

async function walk(query: string, between?: (page: number, asOf: string) => Promise<void>) {
  const ids: number[] = [];
  const times: string[] = [];
  let path = `/api/v1/reports?${query}`;
  let asOf = "";
  for (let page = 0; page < 1000; page++) {
    const res = await get(path);
    expect(res.status).toBe(200);
    const body = await res.json();
    if (page === 0) asOf = body.as_of;
    expect(body.as_of).toBe(asOf);
    for (const r of body.data) {
      ids.push(r.id);
      times.push(r.accepted_at);
    }
    if (!body.next_cursor) {
      expect(res.headers.get("link")).toBeNull();
      break;
    }
    const link = res.headers.get("link")!;
    expect(link).toMatch(/^<http:\/\/127\.0\.0\.1:\d+\/api\/v1\/reports\?.*cursor=.*>; rel="next"$/);
    path = new URL(link.slice(1, link.indexOf(">"))).pathname + new URL(link.slice(1, link.indexOf(">"))).search;
    await between?.(page, asOf);
  }
  return { ids, times, asOf };
}

/** The reports the walk should hold; the horizon has microseconds, which a JS Date would drop. */
const expected = async (asOf: string, job?: string) =>
  (
    await db
      .selectFrom("reports as r")
      .innerJoin("job_types as j", "j.id", "r.job_type_id")
      .select("r.id")
      .where("r.status", "=", "accepted")
      .where(sql<boolean>`r.accepted_at <= ${asOf}::timestamptz`)
      .$if(!!job, (q) => q.where("j.slug", "=", job!))
      .orderBy("r.accepted_at")
      .orderBy("r.id")
      .execute()
  ).map((r) => r.id);

describe("cursor pagination", () => {
  it("returns every report once while others are accepted between pages", async () => {
    const late: number[] = [];
    const { ids, times, asOf } = await walk("limit=250", async (page, horizon) => {
      late.push(await acceptOne());
      // One accepted just inside the horizon whose transaction only now commits: still ahead of
      // the cursor, so the walk picks it up.
      if (page === 1) late.push(await acceptOne(new Date(new Date(horizon).getTime() - 1)));
    });
    expect(new Set(ids).size).toBe(ids.length);
    expect([...times].sort()).toEqual(times);
    expect(ids).toEqual(await expected(asOf));
    expect(late.length).toBeGreaterThan(5);
    const inside = late.filter((id) => ids.includes(id));
    expect(inside).toHaveLength(1);
  });

  it("walks a filtered set the same way", async () => {
    const { ids, asOf } = await walk("limit=37&job=ball-joint-separation");
    expect(ids.length).toBeGreaterThan(37);
    expect(ids).toEqual(await expected(asOf, "ball-joint-separation"));
  });

  it("filters by accepted time: since inclusive, until exclusive", async () => {
    const edges = await db
      .selectFrom("reports")
      .select("accepted_at")
      .where("status", "=", "accepted")
      .orderBy("accepted_at")
      .orderBy("id")
      .execute();
    const since = new Date(edges[100]!.accepted_at!);
    const until = new Date(edges[400]!.accepted_at!);
    const { ids } = await walk(`limit=120&accepted_since=${since.toISOString()}&accepted_until=${until.toISOString()}`);
    const want = (
      await db
        .selectFrom("reports")
        .select("id")
        .where("status", "=", "accepted")
        .where("accepted_at", ">=", since)
        .where("accepted_at", "<", until)
        .orderBy("accepted_at")
        .orderBy("id")
        .execute()
    ).map((r) => r.id);
    expect(want.length).toBeGreaterThan(250);
    expect(ids).toEqual(want);
  });
});
