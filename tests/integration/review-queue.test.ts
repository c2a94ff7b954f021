// The review queue over HTTP: the pager and its total, both orders, the second-look filter, the
// filters kept in every address the page links to, the jump to a report number, and the
// acknowledgement a duplicate-evidence flag asks for before an accept.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "kysely";
import { testDb } from "../support/db";
import { fileFirstReport } from "../support/first-report";
import { type Browserish, signedInAs } from "../support/http";

const db = testDb();
let mod1: Browserish;
let mod2: Browserish;
let mod1Id: number;
afterAll(() => db.destroy());

const CHECKS = {
  check_job_visible: "on",
  check_tool_identifiable: "on",
  check_gauge_readable: "on",
  check_matches_outcome: "on",
};

beforeAll(async () => {
  mod1 = await signedInAs(db, "moderator@demo.bayproof.test");
  mod2 = await signedInAs(db, "moderator2@demo.bayproof.test");
  mod1Id = (
    await db
      .selectFrom("users")
      .select("id")
      .where("email", "=", "moderator@demo.bayproof.test")
      .executeTakeFirstOrThrow()
  ).id;
});

async function decideAs(client: Browserish, id: number, form: Record<string, string>) {
  const r = await db.selectFrom("reports").select("version").where("id", "=", id).executeTakeFirstOrThrow();
  const seen = await db
    .selectFrom("decisions")
    .select("id")
    .where("report_id", "=", id)
    .where("action", "in", ["accept", "return", "reject"])
    .execute();
  return client.post(`/review/${id}`, { version: String(r.version), seenDecisions: String(seen.length), ...form });
}

const unescape = (s: string) => s.replaceAll("&amp;", "&");
/** The queue page's rows (report ids and their links, in order), its "a–b of n waiting" line and its pager links. */
async function queue(path: string) {
  const res = await mod1.get(path);
  const html = await res.text();
  const rows = [...html.matchAll(/<a[^>]*data-testid="queue-row"[^>]*>/g)].map((m) =>
    unescape(m[0].match(/href="([^"]+)"/)![1]!),
  );
  const total = html
    .match(/data-testid="queue-total"[^>]*>([^<]*(?:<!-- -->[^<]*)*)</)?.[1]
    ?.replaceAll("<!-- -->", "");
  const pager = [...html.matchAll(/<nav aria-label="Queue pages"[\s\S]*?<\/nav>/g)].flatMap((m) =>
    [...m[0].matchAll(/href="([^"]+)"/g)].map((h) => unescape(h[1]!)),
  );
  return {
    status: res.status,
    html,
    rows,
    ids: rows.map((h) => Number(h.match(/^\/review\/(\d+)/)![1])),
    total,
    pager,
  };
}

const waitingFor = async (moderatorId: number) =>
  (
    await db
      .selectFrom("reports")
      .select(sql<number>`count(*)::int`.as("n"))
      .where("status", "=", "submitted")
      .where("reporter_id", "!=", moderatorId)
      .executeTakeFirstOrThrow()
  ).n;

async function submittedAt(ids: number[]) {
  const rows = await db.selectFrom("reports").select(["id", "submitted_at"]).where("id", "in", ids).execute();
  const at = new Map(rows.map((r) => [r.id, new Date(r.submitted_at!).getTime()]));
  return ids.map((id) => at.get(id)!);
}

describe("the queue's pages", () => {
  it("says which rows of how many are shown, 40 at a time, and pages on to the rest", async () => {
    // Other test files file reports meanwhile: compare with the database when it held still.
    let page1: Awaited<ReturnType<typeof queue>> | undefined;
    for (let tries = 0; tries < 5; tries++) {
      const before = await waitingFor(mod1Id);
      page1 = await queue("/review");
      if ((await waitingFor(mod1Id)) === before) {
        expect(page1.total).toBe(`1–${Math.min(40, before)} of ${before} waiting`);
        break;
      }
    }
    expect(page1!.status).toBe(200);
    expect(page1!.ids.length).toBe(40); // the demo queue holds about 200
    expect(page1!.pager).toContain("/review?page=2");
    const page2 = await queue("/review?page=2");
    expect(page2.total).toMatch(/^41–80 of \d+ waiting$/);
    expect(page2.ids.some((id) => page1!.ids.includes(id))).toBe(false);
    expect(page2.pager).toContain("/review"); // back to the first page: the default is left out of the address
  });

  it("lists oldest first by default and newest first when asked", async () => {
    const oldest = await queue("/review");
    const times = await submittedAt(oldest.ids);
    expect(times).toEqual([...times].sort((a, b) => a - b));
    const newest = await queue("/review?sort=newest");
    const newTimes = await submittedAt(newest.ids);
    expect(newTimes).toEqual([...newTimes].sort((a, b) => b - a));
    expect(newTimes[0]!).toBeGreaterThanOrEqual(times.at(-1)!);
    // The newest waiting report (not mod1's own) is on the first page of the newest-first order.
    const latest = await db
      .selectFrom("reports")
      .select("id")
      .where("status", "=", "submitted")
      .where("reporter_id", "!=", mod1Id)
      .orderBy("submitted_at", "desc")
      .orderBy("id", "desc")
      .executeTakeFirstOrThrow();
    const again = await queue("/review?sort=newest");
    expect(again.ids).toContain(latest.id);
  });

  it("keeps the filters in every link: the rows, the pager and the form", async () => {
    const page = await queue("/review?sort=newest&page=2");
    expect(page.rows.length).toBeGreaterThan(0);
    for (const href of page.rows) expect(href).toMatch(/\?sort=newest&page=2$/);
    expect(page.pager).toEqual(expect.arrayContaining(["/review?sort=newest", "/review?sort=newest&page=3"]));
    expect(page.html).toMatch(/<form[^>]*method="get"/);
    expect(page.html).toMatch(/<option value="newest" selected="">/); // the form shows what the address says
  });

  it("answers 400 with a reason for filters that are not valid", async () => {
    for (const bad of [
      "sort=sideways",
      "page=0",
      "page=abc",
      "second=yes",
      "flag=made_up",
      "reporter=gold",
      "job=Not%20A%20Slug",
    ]) {
      const res = await mod1.get(`/review?${bad}`);
      expect(res.status, bad).toBe(400);
    }
    expect((await mod1.get("/review?page=999")).status).toBe(200); // past the end shows the last page
  });
});

describe("the second look", () => {
  it("lists only reports accepted once and waiting for a second moderator", async () => {
    const { id } = await fileFirstReport(db, "queue");
    expect((await decideAs(mod2, id, { action: "accept", reasonCode: "evidence_clear", ...CHECKS })).status).toBe(200);
    const page = await queue("/review?second=1&sort=newest");
    expect(page.ids).toContain(id);
    const accepted = await db
      .selectFrom("decisions as d")
      .innerJoin("reports as r", "r.id", "d.report_id")
      .select("d.report_id")
      .where("d.action", "=", "accept")
      .whereRef("d.report_version", "=", "r.version")
      .where("d.report_id", "in", page.ids)
      .execute();
    expect(new Set(accepted.map((a) => a.report_id))).toEqual(new Set(page.ids));
    for (const href of page.rows) expect(href).toMatch(/\?second=1&sort=newest$/);
  });
});

describe("opening a report by its number", () => {
  it("goes straight to it, keeping the queue's filters, and says why when it cannot", async () => {
    const { id } = await fileFirstReport(db, "queue");
    const res = await mod1.get(`/review?sort=newest&report=${id}`);
    expect(res.status).toBe(302);
    expect(res.headers.get("location")).toBe(`/review/${id}?sort=newest`);
    const page = await (await mod1.get(`/review/${id}?sort=newest`)).text();
    expect(page).toMatch(/href="\/review\?sort=newest"/); // back to the same queue
    for (const [bad, message] of [
      ["abc", "Give a report number"],
      ["99999999", "There is no report #99999999"],
    ] as const) {
      const refused = await mod1.get(`/review?report=${bad}`);
      expect(refused.status).toBe(400);
      expect(await refused.text()).toContain(message);
    }
  });
});

describe("a duplicate-evidence flag", () => {
  it("needs the moderator's acknowledgement before an accept, as a field message", async () => {
    const { id } = await fileFirstReport(db, "queue");
    await db
      .updateTable("reports")
      .set({ flags: sql`array_append(flags, 'duplicate_evidence')` })
      .where("id", "=", id)
      .execute();
    const page = await (await mod1.get(`/review/${id}`)).text();
    expect(page).toContain('name="ack_duplicate"');

    const refused = await decideAs(mod1, id, { action: "accept", reasonCode: "evidence_clear", ...CHECKS });
    expect(refused.status).toBe(400);
    const html = await refused.text();
    expect(html).toContain("Tick that you compared the duplicate file with the other report before accepting");
    expect(html).toMatch(/id="ack_duplicate-error"/);
    expect(
      await db
        .selectFrom("decisions")
        .select("id")
        .where("report_id", "=", id)
        .where("action", "=", "accept")
        .execute(),
    ).toHaveLength(0);

    // A return or reject needs no acknowledgement; an acknowledged accept goes through.
    const accepted = await decideAs(mod1, id, {
      action: "accept",
      reasonCode: "evidence_clear",
      ack_duplicate: "on",
      ...CHECKS,
    });
    expect(accepted.status).toBe(200);
    expect(
      await db
        .selectFrom("decisions")
        .select("id")
        .where("report_id", "=", id)
        .where("action", "=", "accept")
        .execute(),
    ).toHaveLength(1);
  });

  it("asks nothing of a return", async () => {
    const { id } = await fileFirstReport(db, "queue");
    await db
      .updateTable("reports")
      .set({ flags: sql`array_append(flags, 'duplicate_evidence')` })
      .where("id", "=", id)
      .execute();
    expect(
      (await decideAs(mod1, id, { action: "return", reasonCode: "gauge_unreadable", note: "Show the gauge" })).status,
    ).toBe(200);
  });
});
