// The database itself refuses bad rows: these inserts go straight past the app.
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { NewReport } from "../../db/schema";
import { testDb } from "../support/db";

const db = testDb();
let valid: NewReport;

beforeAll(async () => {
  const model = await db
    .selectFrom("tool_models")
    .select(["id", "category_id"])
    .orderBy("id")
    .executeTakeFirstOrThrow();
  const job = await db
    .selectFrom("job_types")
    .select("id")
    .where("category_id", "=", model.category_id)
    .executeTakeFirstOrThrow();
  const user = await db.selectFrom("users").select("id").orderBy("id").executeTakeFirstOrThrow();
  valid = {
    reporter_id: user.id,
    tool_model_id: model.id,
    category_id: model.category_id,
    job_type_id: job.id,
    status: "submitted",
    vehicle_class: "passenger_car",
    corrosion_level: "heavy",
    regulator_kpa: 650,
    inlet_kpa: 600,
    inlet_source: "measured_at_inlet",
    hose_id_mm: 9.5,
    hose_length_m: 10,
    coupler_profile: "industrial_m",
    coupler_count: 2,
    outcome: "freed",
    time_to_result_s: 30,
    attempts: 1,
    submitted_at: new Date(),
  };
});
afterAll(() => db.destroy());

/** Runs the insert in a transaction that is always rolled back, and returns the error if any. */
async function tryInsert(row: NewReport): Promise<Error | null> {
  try {
    await db.transaction().execute(async (trx) => {
      await trx.insertInto("reports").values(row).execute();
      throw new Error("rollback");
    });
  } catch (error) {
    return (error as Error).message === "rollback" ? null : (error as Error);
  }
  return null;
}

describe("reports table rules", () => {
  it("accepts a complete, sensible report", async () => {
    expect(await tryInsert(valid)).toBeNull();
  });

  it("refuses a negative time to result", async () => {
    const error = await tryInsert({ ...valid, time_to_result_s: -5 });
    expect(error?.message).toMatch(/time_to_result_s_check/);
  });

  it("refuses a 5,000 kPa inlet pressure", async () => {
    const error = await tryInsert({ ...valid, inlet_kpa: 5000 });
    expect(error?.message).toMatch(/inlet_kpa_check/);
  });

  it("refuses a status outside the fixed set", async () => {
    const error = await tryInsert({ ...valid, status: "approved" as never });
    expect(error?.message).toMatch(/status_check/);
  });

  it("refuses a job type from another tool category", async () => {
    const other = await db
      .selectFrom("job_types")
      .select("id")
      .where("category_id", "!=", valid.category_id)
      .executeTakeFirstOrThrow();
    const error = await tryInsert({ ...valid, job_type_id: other.id });
    expect(error?.message).toMatch(/foreign key/);
  });

  it("lets a draft be incomplete but not a submitted report", async () => {
    const draft: NewReport = {
      reporter_id: valid.reporter_id,
      tool_model_id: valid.tool_model_id,
      category_id: valid.category_id,
      job_type_id: valid.job_type_id,
    };
    expect(await tryInsert(draft)).toBeNull();
    const error = await tryInsert({ ...draft, status: "submitted" });
    expect(error?.message).toMatch(/reports_complete_unless_draft/);
  });

  it("lets a draft withdrawn as it stood stay incomplete, but nothing that was ever submitted", async () => {
    const draft: NewReport = {
      reporter_id: valid.reporter_id,
      tool_model_id: valid.tool_model_id,
      category_id: valid.category_id,
      job_type_id: valid.job_type_id,
    };
    expect(await tryInsert({ ...draft, status: "withdrawn" })).toBeNull();
    expect((await tryInsert({ ...draft, status: "withdrawn", submitted_at: new Date() }))?.message).toMatch(
      /reports_complete_unless_draft/,
    );
    for (const status of ["submitted", "returned", "accepted", "rejected"] as const) {
      const accepted_at = status === "accepted" ? new Date() : null;
      expect((await tryInsert({ ...draft, status, submitted_at: new Date(), accepted_at }))?.message, status).toMatch(
        /reports_complete_unless_draft/,
      );
    }
    expect(await tryInsert({ ...valid, status: "withdrawn" })).toBeNull();
  });

  it("refuses hose bores outside 4–25 mm", async () => {
    expect((await tryInsert({ ...valid, hose_id_mm: 2 }))?.message).toMatch(/hose_id_mm_check/);
  });
});

describe("catalogue rules", () => {
  it("keeps model codes unique per maker", async () => {
    const m = await db.selectFrom("tool_models").selectAll().orderBy("id").executeTakeFirstOrThrow();
    const { id: _id, created_at: _c, ...copy } = m;
    await expect(
      db
        .insertInto("tool_models")
        .values({ ...copy, slug: "copy-of-first" })
        .execute(),
    ).rejects.toThrow(/tool_models_maker_code_key/);
  });
});

describe("decision log", () => {
  it("refuses UPDATE, DELETE and TRUNCATE", async () => {
    await expect(db.updateTable("decisions").set({ note: "rewritten" }).execute()).rejects.toThrow(/append-only/);
    await expect(db.deleteFrom("decisions").execute()).rejects.toThrow(/append-only/);
    await expect(sql`truncate decisions`.execute(db)).rejects.toThrow(/append-only/);
  });
});

describe("ban log", () => {
  /** One insert (or statement) in a transaction that is always rolled back; the error if any. */
  async function tryBanLog(run: (trx: typeof db) => Promise<unknown>): Promise<Error | null> {
    try {
      await db.transaction().execute(async (trx) => {
        await run(trx);
        throw new Error("rollback");
      });
    } catch (error) {
      return (error as Error).message === "rollback" ? null : (error as Error);
    }
    return null;
  }
  const row = () => ({ user_id: valid.reporter_id, change: "ban" as const, reason: "Posted made-up reports" });

  it("accepts a ban with a reason", async () => {
    expect(await tryBanLog((trx) => trx.insertInto("ban_changes").values(row()).execute())).toBeNull();
  });

  it("refuses a ban without a reason, or with a blank one", async () => {
    for (const reason of ["", "   ", "no"]) {
      const error = await tryBanLog((trx) =>
        trx
          .insertInto("ban_changes")
          .values({ ...row(), reason })
          .execute(),
      );
      expect(error?.message).toMatch(/ban_changes_reason_check/);
    }
    const missing = await tryBanLog((trx) =>
      sql`insert into ban_changes (user_id, change) values (${valid.reporter_id}, 'ban')`.execute(trx),
    );
    expect(missing?.message).toMatch(/null value in column "reason"/);
  });

  it("refuses a change other than ban or unban", async () => {
    const error = await tryBanLog((trx) =>
      sql`insert into ban_changes (user_id, change, reason) values (${valid.reporter_id}, 'suspend', 'Spam')`.execute(
        trx,
      ),
    );
    expect(error?.message).toMatch(/ban_changes_change_check/);
  });

  it("refuses UPDATE and TRUNCATE", async () => {
    const rewrite = await tryBanLog(async (trx) => {
      await trx.insertInto("ban_changes").values(row()).execute();
      await trx.updateTable("ban_changes").set({ reason: "rewritten" }).execute();
    });
    expect(rewrite?.message).toMatch(/append-only/);
    expect(await tryBanLog((trx) => sql`truncate ban_changes`.execute(trx))).toHaveProperty(
      "message",
      expect.stringMatching(/append-only/),
    );
  });
});
