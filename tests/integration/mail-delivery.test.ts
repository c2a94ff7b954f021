// Mail that is never lost: decision mail retries over more than a day, what still fails is listed
// on the admin's "Stuck work" page and can be sent again; sign-in with a dead relay is a clear 503
// that does not count toward the per-address limit. The relay "goes down" for one address of the
// test's own (the catcher's `.refuse-<address>` file) or is a closed port, never for other tests.
import { rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { sql } from "kysely";
import PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { testDb } from "../support/db";
import { baseUrl, Browserish, signedInAs } from "../support/http";
import { newClientAddress } from "../support/feed";
import { latestMailTo } from "../support/mail";
import { validReport } from "../support/reports";
import { freePort } from "../support/system";

const db = testDb();
let boss: PgBoss;
let moderator: Browserish;
let admin: Browserish;
const flags: string[] = [];

beforeAll(async () => {
  boss = new PgBoss({
    connectionString: inject("databaseUrl"),
    schema: "pgboss",
    supervise: false,
    schedule: false,
    max: 2,
  });
  await boss.start();
  moderator = await signedInAs(db, "moderator@demo.bayproof.test");
  admin = await signedInAs(db, "admin@demo.bayproof.test");
});
afterAll(async () => {
  for (const f of flags) rmSync(f, { force: true });
  await boss.stop({ graceful: false, wait: true });
  await db.destroy();
});

/** Makes every delivery to this address fail (451) until relayUp() — a relay that is down, for this address only. */
function relayDownFor(email: string) {
  const flag = path.join(inject("mailDir"), `.refuse-${email}`);
  writeFileSync(flag, "");
  flags.push(flag);
  return () => rmSync(flag, { force: true });
}

/** Polls until `check` returns a value, or fails after `ms`. */
async function until<T>(what: string, check: () => Promise<T | null | undefined>, ms = 30_000): Promise<T> {
  const deadline = Date.now() + ms;
  for (;;) {
    const value = await check();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`gave up waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

interface JobRow {
  id: string;
  state: string;
  retry_limit: number;
  retry_delay: number;
  retry_backoff: boolean;
  retry_count: number;
  expire_seconds: number;
  retention_seconds: number;
  output: { message?: string } | null;
}
const jobsOf = async (decisionId: number) =>
  (
    await sql<JobRow>`select id, state::text as state, retry_limit, retry_delay, retry_backoff, retry_count, output,
      extract(epoch from expire_in)::int as expire_seconds, extract(epoch from keep_until - created_on)::int as retention_seconds
    from pgboss.job where name = 'decision-mail' and data->>'decisionId' = ${String(decisionId)} order by created_on`.execute(
      db,
    )
  ).rows;

/** A new reporter's report, returned by a moderator: the decision whose mail we follow. */
async function returnedReport() {
  const stamp = `${Date.now()}${Math.floor(Math.random() * 1000)}`;
  const email = `mail-test-${stamp}@demo.bayproof.test`;
  await db
    .insertInto("users")
    .values({ email, handle: `mailtest-${stamp.slice(-9)}` })
    .execute();
  const reporter = await signedInAs(db, email);
  const filed = await reporter.post("/reports/new", validReport());
  const reportId = Number(filed.headers.get("location")!.match(/submitted=(\d+)/)![1]);
  return { email, reportId };
}

async function decideReturn(reportId: number) {
  const r = await db.selectFrom("reports").select("version").where("id", "=", reportId).executeTakeFirstOrThrow();
  const res = await moderator.post(`/review/${reportId}`, {
    version: String(r.version),
    seenDecisions: "0",
    action: "return",
    reasonCode: "gauge_unreadable",
    note: "Film the inlet gauge.",
  });
  expect(res.status).toBe(200);
  const d = await db
    .selectFrom("decisions")
    .select("id")
    .where("report_id", "=", reportId)
    .where("action", "=", "return")
    .executeTakeFirstOrThrow();
  return d.id;
}

describe("decision mail with the relay down", () => {
  it("keeps a failed delivery retrying on the long schedule, and shows it as waiting on the stuck-work page", async () => {
    const { email, reportId } = await returnedReport();
    relayDownFor(email);
    const decisionId = await decideReturn(reportId);
    const job = await until("a failed first attempt", async () =>
      (await jobsOf(decisionId)).find((j) => j.state === "retry" && j.output?.message),
    );
    expect(job.output!.message).toMatch(/451|Try again later/);
    // The options pg-boss stored on the job (app/jobs/queue.server.ts MAIL_RETRY).
    expect(job).toMatchObject({
      retry_limit: 15,
      retry_delay: 3,
      retry_backoff: true,
      expire_seconds: 300,
      retention_seconds: 7 * 86400,
    });
    // Retry k waits retry_delay × 2^(k−1) × (1 + random) s (pg-boss 10, failJobs): recomputed.
    const shortest = Array.from({ length: job.retry_limit }, (_, k) => job.retry_delay * 2 ** k).reduce(
      (a, b) => a + b,
    );
    expect(shortest).toBeGreaterThanOrEqual(24 * 3600);
    // Nothing expires a waiting job before its last try, even at the longest waits and every attempt timing out.
    expect(job.retention_seconds).toBeGreaterThan(2 * shortest + (job.retry_limit + 1) * job.expire_seconds);

    const page = await (await admin.get("/admin/jobs")).text();
    expect(page).toContain("Stuck work");
    expect(page).toContain(`Mail to ${email} that report #${reportId} was returned (decision #${decisionId})`);
    await sql`delete from pgboss.job where id = ${job.id}::uuid`.execute(db); // no mail from it once the flag is gone
  });

  it("lists mail that ran out of retries with its address and error, and delivers it once sent again", async () => {
    const { email, reportId } = await returnedReport();
    const relayUp = relayDownFor(email);
    const decisionId = await decideReturn(reportId);
    // The app's own job would take a day to run out; this one has a short schedule and fails for good.
    await until("the app's job", async () => (await jobsOf(decisionId))[0]);
    await sql`delete from pgboss.job where name = 'decision-mail' and data->>'decisionId' = ${String(decisionId)}`.execute(
      db,
    );
    const shortId = (await boss.send("decision-mail", { decisionId }, { retryLimit: 1, retryDelay: 1 }))!;
    const failed = await until("the job to fail", async () =>
      (await jobsOf(decisionId)).find((j) => j.id === shortId && j.state === "failed"),
    );
    expect(failed.retry_count).toBe(1);

    const page = await (await admin.get("/admin/jobs")).text();
    const row = page.slice(page.indexOf(`Mail to ${email}`));
    expect(row).toContain(`report #${reportId} was returned (decision #${decisionId})`);
    expect(row.slice(0, 2000)).toMatch(/Try again later/);
    expect(row.slice(0, 2000)).toContain("2 of 2");
    expect(page).toContain(`value="${shortId}"`);
    expect(page).toContain("Send again");

    relayUp();
    const since = Date.now();
    const res = await admin.post("/admin/jobs", { intent: "send-again", jobId: shortId });
    expect(res.status).toBe(200);
    expect(await res.text()).toContain("Sent again");
    const again = (await jobsOf(decisionId)).find((j) => j.id !== shortId)!;
    expect(again).toMatchObject({ retry_limit: 15, retry_delay: 3, retry_backoff: true, expire_seconds: 300 });
    const mail = await latestMailTo(email, since, 30_000);
    expect(mail.subject).toMatch(new RegExp(`#${reportId} was returned`));
    await until("the job to complete", async () =>
      (await jobsOf(decisionId)).find((j) => j.id === again.id && j.state === "completed"),
    );
    expect((await jobsOf(decisionId)).map((j) => j.id)).not.toContain(shortId);

    const twice = await admin.post("/admin/jobs", { intent: "send-again", jobId: shortId });
    expect(twice.status).toBe(404);
    expect((await admin.post("/admin/jobs", { intent: "send-again", jobId: "not-a-job" })).status).toBe(400);
  });

  it("throws when the relay does not answer at all, so pg-boss retries the job", async () => {
    process.env.SMTP_URL = `smtp://127.0.0.1:${await freePort()}`; // nothing listens there
    process.env.DATABASE_URL = inject("databaseUrl");
    const { sendDecisionMail } = await import("../../app/moderation/mail.server");
    const decision = await db
      .selectFrom("decisions")
      .select("id")
      .where("action", "=", "accept")
      .orderBy("id")
      .executeTakeFirstOrThrow();
    await expect(sendDecisionMail(db, decision.id)).rejects.toThrow(/ECONNREFUSED|connect/i);
  });
});

describe("sign-in mail with the relay down", () => {
  const linksFor = async (email: string) =>
    (
      await db
        .selectFrom("sign_in_links")
        .select(sql<number>`count(*)::int`.as("n"))
        .where("email", "=", email)
        .executeTakeFirstOrThrow()
    ).n;

  it("answers 503 with a clear message and does not count the failed link toward the limit", async () => {
    const email = `relay-down-${Date.now()}@demo.bayproof.test`;
    const relayUp = relayDownFor(email);
    const client = new Browserish();
    // A client address of its own, so the per-client limit counts only this test's links.
    const headers = { origin: baseUrl(), "x-forwarded-for": newClientAddress() };
    const ask = () => client.post("/sign-in", { email, redirectTo: "/account" }, headers);
    for (let i = 0; i < 4; i++) {
      const res = await ask();
      expect(res.status).toBe(503);
      expect(res.headers.get("retry-after")).toBe("60");
      expect(await res.text()).toContain("The mail could not be sent just now. Try again in a minute.");
    }
    expect(await linksFor(email)).toBe(0);
    relayUp();
    for (let i = 0; i < 3; i++) expect((await ask()).status).toBe(200);
    expect((await ask()).status).toBe(429);
  });

  it("returns mail_failed, keeping no link, when nothing listens at the relay's port", async () => {
    process.env.SMTP_URL = `smtp://127.0.0.1:${await freePort()}`;
    process.env.DATABASE_URL = inject("databaseUrl");
    const { requestSignInLink } = await import("../../app/auth/email-link.server");
    const { db, pool } = await import("../../app/db.server");
    const email = `relay-closed-${Date.now()}@demo.bayproof.test`;
    for (let i = 0; i < 4; i++) {
      expect(
        await requestSignInLink(db, email, new Request("http://127.0.0.1/sign-in", { method: "POST" }), "/"),
      ).toEqual({ ok: false, reason: "mail_failed" });
    }
    expect(await linksFor(email)).toBe(0);
    await pool.end();
  });
});
