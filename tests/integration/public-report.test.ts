// An accepted report's public page, and only an accepted report's: every other status answers 404
// to everyone, its own reporter included; published files show on the report and on its model's page.
import { afterAll, describe, expect, it } from "vitest";
import { testDb } from "../support/db";
import { Browserish, signedInAs } from "../support/http";

const db = testDb();
afterAll(() => db.destroy());

describe("/reports/:id", () => {
  it("shows an accepted report's fields and its published files", async () => {
    const withFile = await db
      .selectFrom("evidence as e")
      .innerJoin("reports as r", "r.id", "e.report_id")
      .innerJoin("tool_models as m", "m.id", "r.tool_model_id")
      .select(["r.id", "m.slug"])
      .where("r.status", "=", "accepted")
      .where("e.is_public", "=", true)
      .where("e.status", "in", ["uploaded", "verified"])
      .orderBy("r.id")
      .executeTakeFirstOrThrow();
    const res = await new Browserish().get(`/reports/${withFile.id}`);
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html).toContain("What the reporter recorded");
    expect(html).toContain("Published videos and photos");
    // Pages link to the feed's stable address of each file, which redirects to a fresh signed link.
    const link =
      /href="(\/api\/v1\/evidence\/\d+)"/.exec(html)?.[1] ?? /src="(\/api\/v1\/evidence\/\d+)"/.exec(html)?.[1];
    expect(link).toBeDefined();
    const file = await new Browserish().get(link!);
    expect(file.status).toBe(302);
    expect(file.headers.get("location")).toMatch(/X-Amz-Signature=/);
    const model = await (await new Browserish().get(`/models/${withFile.slug}`)).text();
    expect(model).toContain("From the bay: published videos and photos");
  });

  it("answers 404 for every report that is not accepted, whoever asks", async () => {
    const others = await db
      .selectFrom("reports")
      .select(["id", "status", "reporter_id"])
      .distinctOn("status")
      .where("status", "!=", "accepted")
      .orderBy("status")
      .orderBy("id")
      .execute();
    expect(others.length).toBeGreaterThan(0);
    const moderator = await signedInAs(db, "moderator@demo.bayproof.test");
    for (const r of others) {
      expect((await new Browserish().get(`/reports/${r.id}`)).status, r.status).toBe(404);
      expect((await moderator.get(`/reports/${r.id}`)).status, r.status).toBe(404);
    }
    // Its own reporter too: they follow it at /reports/:id/history.
    const own = await db
      .selectFrom("users")
      .select("email")
      .where("id", "=", others[0]!.reporter_id)
      .executeTakeFirstOrThrow();
    expect((await (await signedInAs(db, own.email)).get(`/reports/${others[0]!.id}`)).status).toBe(404);
    // Ids that name no report, or are no id at all.
    for (const bad of ["999999999", "0", "abc", "1e3", "99999999999999"])
      expect((await new Browserish().get(`/reports/${bad}`)).status, bad).toBe(404);
  });
});
