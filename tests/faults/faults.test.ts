// Faults on a stack of the suite's own (tests/faults/private-stack.ts): the app server killed
// mid-submission, PostgreSQL restarted under steady load, the search service gone. The mail
// relay down past its retries is in tests/integration/mail-delivery.test.ts, storage down at
// upload completion in tests/integration/evidence-uploads.test.ts, and a server that dies under
// `npm start` being started again alone in tests/start/start-command.test.ts.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Browserish } from "../support/http";
import { newSession } from "../support/sessions";
import { validReport } from "../support/reports";
import { startPrivateStack } from "./private-stack";

let stack: Awaited<ReturnType<typeof startPrivateStack>>;
beforeAll(async () => {
  stack = await startPrivateStack();
});
afterAll(() => stack?.stop());

async function signIn(email: string) {
  const { userId, cookie } = await newSession(stack.db, email);
  const client = new Browserish(stack.baseUrl);
  client.cookies.set("bayproof_session", cookie);
  return { client, userId };
}

describe("the app server killed in the middle of submissions", () => {
  it("leaves every report whole or absent, and every answered one stored", async () => {
    const { client, userId } = await signIn("reporter@demo.bayproof.test");
    const tag = `fault-kill-${Date.now()}`;
    const posts = Array.from({ length: 40 }, (_, i) =>
      client.post("/reports/new", { ...validReport(), notes: `${tag}-${i}` }).then(
        (r) => ({ status: r.status, location: r.headers.get("location") ?? "" }),
        (e: Error) => ({ status: 0, location: "", error: e.message }),
      ),
    );
    // Once the first answer is in, the others are in flight: kill -9 the server then.
    await Promise.race(posts);
    await stack.killServer();
    const results = await Promise.all(posts);
    await stack.startServer();

    const rows = await stack.db
      .selectFrom("reports")
      .select(["id", "status", "reporter_id"])
      .where("notes", "like", `${tag}-%`)
      .execute();
    const versions = await stack.db
      .selectFrom("report_versions")
      .select("report_id")
      .where("report_id", "in", rows.length ? rows.map((r) => r.id) : [0])
      .execute();
    // Whole: submitted, by this reporter, with its version snapshot (written in the same transaction).
    for (const row of rows) {
      expect(row.status).toBe("submitted");
      expect(row.reporter_id).toBe(userId);
      expect(versions.some((v) => v.report_id === row.id)).toBe(true);
    }
    // Every submission the server answered as done is there.
    const answered = results
      .filter((r) => r.status === 302)
      .map((r) => Number(new URL(r.location, stack.baseUrl).searchParams.get("submitted")));
    for (const id of answered) expect(rows.map((r) => r.id)).toContain(id);
    expect(results.every((r) => r.status === 0 || r.status === 302)).toBe(true);
    console.log(
      `kill -9 during 40 submissions: ${answered.length} answered, ${results.filter((r) => r.status === 0).length} cut off, ${rows.length} stored`,
    );

    // The restarted server answers as before.
    expect((await client.get("/me/reports")).status).toBe(200);
  });
});

describe("PostgreSQL restarted under steady load", () => {
  it("answers every read without a server error while the database comes back", async () => {
    const paths = ["/", "/jobs", "/models", "/api/v1/reports?limit=5", "/api/v1/job-types"];
    const statuses: number[] = [];
    // Which request failed, by path, so a failure says where to look (and the server's log follows it).
    const failures: string[] = [];
    let restarting = false;
    let restarted = false;
    let afterRestart = 0;
    let duringRestart = 0;
    const visitor = async (offset: number) => {
      for (let i = offset; !restarted || afterRestart < 40; i++) {
        const res = await fetch(new URL(paths[i % paths.length]!, stack.baseUrl), {
          // The feed counts requests per client; spread them so the limit is not what answers.
          headers: { "x-forwarded-for": `10.0.${offset}.${i % 250}` },
          // A request that hangs is a failure too (status 0), not a reason to wait for ever.
          signal: AbortSignal.timeout(60_000),
        }).catch(() => null);
        statuses.push(res?.status ?? 0);
        if (!res || (res.status >= 500 && res.status !== 503))
          failures.push(`${res?.status ?? 0} ${paths[i % paths.length]}`);
        if (restarting && !restarted) duringRestart++;
        if (res && res.status === 503) expect(res.headers.get("retry-after")).toBeTruthy();
        await res?.body?.cancel();
        if (restarted) afterRestart++;
      }
    };
    const load = [visitor(0), visitor(1), visitor(2)];
    // Restart once the load is running.
    while (statuses.length < 15) await new Promise((r) => setTimeout(r, 20));
    restarting = true;
    // The load goes on while the database stops and starts again.
    await stack.restartDatabase();
    restarted = true;
    await Promise.all(load);
    if (failures.length) console.error(stack.serverLog());
    expect(failures).toEqual([]);
    console.log(
      `PostgreSQL restart under load: ${statuses.length} requests, ${duringRestart} of them while it restarted, ${statuses.filter((s) => s === 200).length} answered 200, ${statuses.filter((s) => s === 503).length} answered 503`,
    );
  });
});

describe("the search service gone", () => {
  it("answers search from PostgreSQL and says so", async () => {
    await stack.stopFakes();
    const res = await fetch(new URL("/search?q=quillon", stack.baseUrl));
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html).toMatch(/search service cannot be reached just now/);
    expect(html).toMatch(/Quillon Air Tools/);
  });
});
