// Moderation over HTTP: permissions, own reports, concurrency, the second look, failed evidence,
// and the reporter's mail surviving a failed first delivery.
import { writeFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { testDb } from "../support/db";
import { fileFirstReport } from "../support/first-report";
import { Browserish, signedInAs } from "../support/http";
import { latestMailTo } from "../support/mail";
import { validReport } from "../support/reports";

const db = testDb();
let mod1: Browserish;
let mod2: Browserish;
afterAll(() => db.destroy());

const CHECKS = {
  check_job_visible: "on",
  check_tool_identifiable: "on",
  check_gauge_readable: "on",
  check_matches_outcome: "on",
};

async function state(id: number) {
  const r = await db.selectFrom("reports").select(["status", "version"]).where("id", "=", id).executeTakeFirstOrThrow();
  const seen = await db
    .selectFrom("decisions")
    .select("id")
    .where("report_id", "=", id)
    .where("action", "in", ["accept", "return", "reject"])
    .execute();
  return { ...r, seen: seen.length };
}

async function decideAs(client: Browserish, id: number, form: Record<string, string>) {
  const s = await state(id);
  return client.post(`/review/${id}`, { version: String(s.version), seenDecisions: String(s.seen), ...form });
}

/** Starting a review takes the claim: an explicit POST, never the page's GET. */
async function startReview(client: Browserish, id: number) {
  return client.post(`/review/${id}`, { intent: "claim" });
}

beforeAll(async () => {
  mod1 = await signedInAs(db, "moderator@demo.bayproof.test");
  mod2 = await signedInAs(db, "moderator2@demo.bayproof.test");
});

describe("who may decide", () => {
  it("refuses reporters and sends visitors to sign in", async () => {
    const { id, reporter } = await fileFirstReport(db, "mod");
    expect((await reporter.get(`/review/${id}`)).status).toBe(403);
    expect(
      (
        await reporter.post(`/review/${id}`, {
          action: "reject",
          reasonCode: "duplicate",
          version: "1",
          seenDecisions: "0",
        })
      ).status,
    ).toBe(403);
    expect((await new Browserish().get("/review")).status).toBe(302);
    expect((await state(id)).status).toBe("submitted");
  });

  it("never lets a moderator decide on their own report", async () => {
    const own = await signedInAs(db, "moderator3@demo.bayproof.test");
    const res = await own.post("/reports/new", validReport());
    const id = Number(res.headers.get("location")!.match(/submitted=(\d+)/)![1]);
    const page = await (await own.get(`/review/${id}`)).text();
    expect(page).toContain("This is your own report");
    const refused = await decideAs(own, id, { action: "reject", reasonCode: "duplicate", ...CHECKS });
    expect(refused.status).toBe(403);
    expect(await refused.text()).toMatch(/Nobody decides on their own report/);
    expect((await state(id)).status).toBe("submitted");
  });

  it("asks for a reason, and for what to change on a return", async () => {
    const { id } = await fileFirstReport(db, "mod");
    expect((await decideAs(mod1, id, { action: "reject", reasonCode: "" })).status).toBe(400);
    expect((await decideAs(mod1, id, { action: "reject", reasonCode: "evidence_clear" })).status).toBe(400);
    const noNote = await decideAs(mod1, id, { action: "return", reasonCode: "gauge_unreadable", note: "" });
    expect(noNote.status).toBe(400);
    expect((await state(id)).status).toBe("submitted");
  });

  it("refuses a decision on a report that is not waiting", async () => {
    const accepted = await db
      .selectFrom("reports")
      .select("id")
      .where("status", "=", "accepted")
      .executeTakeFirstOrThrow();
    const res = await decideAs(mod1, accepted.id, { action: "reject", reasonCode: "duplicate" });
    expect(res.status).toBe(409);
  });
});

describe("what moderators never see", () => {
  it("answers 404 for a reporter's draft: no notes shown, no claim taken, no decision possible", async () => {
    const { reporter } = await fileFirstReport(db, "mod");
    const secret = `draft note ${Date.now()}`;
    const saved = await reporter.post("/reports/new", { ...validReport(), notes: secret, intent: "save-draft" });
    const id = Number(saved.headers.get("location")!.match(/reports\/(\d+)\/edit/)![1]);
    expect((await state(id)).status).toBe("draft");

    const page = await mod1.get(`/review/${id}`);
    expect(page.status).toBe(404);
    expect(await page.text()).not.toContain(secret);
    expect((await decideAs(mod1, id, { action: "reject", reasonCode: "duplicate" })).status).toBe(404);
    expect((await mod1.get(`/reports/${id}/history`)).status).toBe(404);
    expect(
      await db.selectFrom("report_claims").select("report_id").where("report_id", "=", id).executeTakeFirst(),
    ).toBeUndefined();
    expect(await db.selectFrom("decisions").select("id").where("report_id", "=", id).execute()).toHaveLength(0);
    expect((await reporter.get(`/reports/${id}/history`)).status).toBe(200); // still the reporter's own
  });

  it("answers 404 for a withdrawn report", async () => {
    const { id, reporter } = await fileFirstReport(db, "mod");
    expect((await reporter.post(`/reports/${id}/edit`, { intent: "withdraw" })).status).toBe(302);
    expect((await state(id)).status).toBe("withdrawn");
    expect((await mod1.get(`/review/${id}`)).status).toBe(404);
    expect((await decideAs(mod1, id, { action: "reject", reasonCode: "duplicate" })).status).toBe(404);
  });
});

describe("claims and concurrency", () => {
  it("claims a report for the first moderator who starts the review and shows others who holds it", async () => {
    const { id } = await fileFirstReport(db, "mod");
    expect((await mod1.get(`/review/${id}`)).status).toBe(200);
    // Opening the page only reads: the claim is taken by starting the review (a POST).
    expect(
      await db.selectFrom("report_claims").select("report_id").where("report_id", "=", id).executeTakeFirst(),
    ).toBeUndefined();
    expect((await startReview(mod1, id)).status).toBe(200);
    const other = await (await mod2.get(`/review/${id}`)).text();
    expect(other).toMatch(/mod-harriet<!-- --> has this report open|mod-harriet has this report open/);
    const claims = await db
      .selectFrom("decisions")
      .select("action")
      .where("report_id", "=", id)
      .where("action", "=", "claim")
      .execute();
    expect(claims).toHaveLength(1);
  });

  it("lets only the holder of a live claim decide, and anyone once it has run out", async () => {
    const { id } = await fileFirstReport(db, "mod");
    expect((await startReview(mod1, id)).status).toBe(200); // mod1 now holds the claim
    const blocked = await decideAs(mod2, id, { action: "reject", reasonCode: "job_not_shown" });
    expect(blocked.status).toBe(409);
    expect(await blocked.text()).toMatch(/mod-harriet has this report open until/);
    expect(await state(id)).toMatchObject({ status: "submitted", seen: 0 });

    await db
      .updateTable("report_claims")
      .set({ claimed_at: new Date(Date.now() - 20 * 60_000), expires_at: new Date(Date.now() - 5 * 60_000) })
      .where("report_id", "=", id)
      .execute();
    const late = await decideAs(mod2, id, { action: "return", reasonCode: "gauge_unreadable", note: "Show the gauge" });
    expect(late.status).toBe(200);
    expect((await state(id)).status).toBe("returned");
  });

  it("lets the holder of the claim decide", async () => {
    const { id } = await fileFirstReport(db, "mod");
    expect((await startReview(mod1, id)).status).toBe(200);
    expect((await decideAs(mod1, id, { action: "reject", reasonCode: "job_not_shown" })).status).toBe(200);
    expect((await state(id)).status).toBe("rejected");
    expect(
      await db.selectFrom("report_claims").select("report_id").where("report_id", "=", id).executeTakeFirst(),
    ).toBeUndefined();
  });

  it("refuses to start a review another moderator holds, or one not waiting, and writes nothing", async () => {
    const { id } = await fileFirstReport(db, "mod");
    expect((await startReview(mod1, id)).status).toBe(200);
    expect((await startReview(mod1, id)).status).toBe(200); // renewing one's own claim
    const taken = await startReview(mod2, id);
    expect(taken.status).toBe(409);
    expect(await taken.text()).toMatch(/mod-harriet has this report open until/);
    const claims = await db
      .selectFrom("decisions")
      .select("moderator_id")
      .where("report_id", "=", id)
      .where("action", "=", "claim")
      .execute();
    expect(claims).toHaveLength(1);
    const accepted = await db
      .selectFrom("reports")
      .select("id")
      .where("status", "=", "accepted")
      .executeTakeFirstOrThrow();
    expect((await startReview(mod1, accepted.id)).status).toBe(409);
    expect((await mod1.post(`/review/${id}`, { intent: "take-over" })).status).toBe(400);
  });

  it("lets one of two simultaneous decisions win and tells the other", async () => {
    const { id } = await fileFirstReport(db, "mod");
    const s = await state(id);
    const form = (action: string, reasonCode: string, note = "") => ({
      version: String(s.version),
      seenDecisions: String(s.seen),
      action,
      reasonCode,
      note,
    });
    const [a, b] = await Promise.all([
      mod1.post(`/review/${id}`, form("reject", "job_not_shown")),
      mod2.post(`/review/${id}`, form("return", "gauge_unreadable", "Show the gauge")),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const loser = a.status === 409 ? a : b;
    expect(await loser.text()).toMatch(/while you had it open|not waiting for a decision/);
    const final = await state(id);
    expect(["rejected", "returned"]).toContain(final.status);
    expect(final.seen).toBe(1);
  });
});

describe("the second look", () => {
  it("needs two different moderators to accept a flagged report, then refreshes its stats", async () => {
    const { id } = await fileFirstReport(db, "mod");
    const first = await decideAs(mod1, id, { action: "accept", reasonCode: "evidence_clear", ...CHECKS });
    expect(first.status).toBe(200);
    expect(await first.text()).toMatch(/needs a second look/);
    expect((await state(id)).status).toBe("submitted");
    const again = await decideAs(mod1, id, { action: "accept", reasonCode: "evidence_clear", ...CHECKS });
    expect(again.status).toBe(409);
    expect(await again.text()).toMatch(/another moderator/);
    const second = await decideAs(mod2, id, { action: "accept", reasonCode: "second_look_agrees", ...CHECKS });
    expect(second.status).toBe(200);
    expect((await state(id)).status).toBe("accepted");

    // The accept asked the worker to refresh the report's stats cell.
    const report = await db
      .selectFrom("reports")
      .select(["tool_model_id", "job_type_id", "accepted_at"])
      .where("id", "=", id)
      .executeTakeFirstOrThrow();
    const deadline = Date.now() + 60_000;
    let cell: { computed_at: Date } | undefined;
    do {
      cell = await db
        .selectFrom("stats_cells")
        .select("computed_at")
        .where("tool_model_id", "=", report.tool_model_id)
        .where("job_type_id", "=", report.job_type_id)
        .executeTakeFirst();
      if (cell && new Date(cell.computed_at) >= new Date(report.accepted_at!)) break;
      await new Promise((r) => setTimeout(r, 250));
    } while (Date.now() < deadline);
    expect(new Date(cell!.computed_at).getTime()).toBeGreaterThanOrEqual(new Date(report.accepted_at!).getTime());
  });

  it("ends with a reject from either moderator", async () => {
    const { id } = await fileFirstReport(db, "mod");
    await decideAs(mod1, id, { action: "accept", reasonCode: "evidence_clear", ...CHECKS });
    expect((await decideAs(mod2, id, { action: "reject", reasonCode: "tool_not_shown" })).status).toBe(200);
    expect((await state(id)).status).toBe("rejected");
  });

  it("refuses to accept without the checklist, or with failed evidence", async () => {
    const { id } = await fileFirstReport(db, "mod");
    expect((await decideAs(mod1, id, { action: "accept", reasonCode: "evidence_clear" })).status).toBe(400);
    const evidence = await db
      .insertInto("evidence")
      .values({
        report_id: id,
        object_key: `reports/${id}/test-failed-${Date.now()}`,
        kind: "photo",
        content_type: "image/png",
        size_bytes: 10,
        sha256: "a".repeat(64),
        status: "uploaded",
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    const res = await decideAs(mod1, id, {
      action: "accept",
      reasonCode: "evidence_clear",
      ...CHECKS,
      [`evidence_${evidence.id}`]: "failed",
    });
    expect(res.status).toBe(409);
    expect(await res.text()).toMatch(/failed evidence cannot be accepted/);
    const item = await db
      .selectFrom("evidence")
      .select("status")
      .where("id", "=", evidence.id)
      .executeTakeFirstOrThrow();
    expect(item.status).toBe("uploaded"); // the whole decision rolled back
  });
});

describe("the reporter hears of it", () => {
  it("gets the mail even when the first delivery fails, and an in-app notice", async () => {
    const { id, email, reporter } = await fileFirstReport(db, "mod");
    writeFileSync(path.join(inject("mailDir"), `.reject-next-${email}`), "");
    const since = Date.now();
    const res = await decideAs(mod1, id, {
      action: "return",
      reasonCode: "gauge_unreadable",
      note: "Film the inlet gauge while the hammer runs.",
    });
    expect(res.status).toBe(200);
    const mail = await latestMailTo(email, since, 30_000);
    expect(mail.subject).toMatch(new RegExp(`#${id} was returned`));
    expect(mail.text).toContain("Film the inlet gauge while the hammer runs.");
    const page = await (await reporter.get("/me/reports")).text();
    expect(page).toContain("News on your reports");
    expect(page).toContain("Film the inlet gauge");
  }, 40_000);
});
