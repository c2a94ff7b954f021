// Filing reports: drafts, submission with flags and versions, withdrawal, the reporter's list.
// Every function takes `db` first and checks ownership itself.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { type LengthUnit, type PressureUnit, toolName } from "~/domain";
import { submitFlags } from "~/moderation/submit-flags.server";
import { type ReportForm, toColumns, type parseDraft } from "./form-schema";
import { EDITABLE, WITHDRAWABLE } from "./status";
import { AppError } from "~/utils/errors";

export { EDITABLE, WITHDRAWABLE };

export class ReportError extends AppError {
  constructor(
    message: string,
    readonly status: 400 | 403 | 404 | 409,
    readonly field?: string,
  ) {
    super(message, status);
  }
}

export async function findModel(db: Db, slug: string) {
  return db
    .selectFrom("tool_models as m")
    .innerJoin("tool_categories as c", "c.id", "m.category_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .select([
      "m.id",
      "m.slug",
      "m.category_id",
      "m.max_inlet_kpa",
      "m.model_code",
      "mk.name as maker_name",
      "c.action",
      "c.slug as category_slug",
      "c.name as category_name",
    ])
    .where("m.slug", "=", slug)
    .executeTakeFirst();
}

/** Suggestions for the tool field: maker, model code or name containing every typed word. */
export async function suggestModels(db: Db, q: string, limit = 8) {
  const words = q.toLowerCase().split(/\s+/).filter(Boolean).slice(0, 5);
  let query = db
    .selectFrom("tool_models as m")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("tool_categories as c", "c.id", "m.category_id")
    .select([
      "m.slug",
      "m.model_code",
      "m.name",
      "m.fitting",
      "m.max_inlet_kpa",
      "mk.name as maker_name",
      "c.slug as category_slug",
      "c.name as category_name",
      "c.action",
    ]);
  for (const w of words) {
    const like = `%${w.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    query = query.where(
      sql<boolean>`lower(mk.name || ' ' || m.model_code || ' ' || m.name || ' ' || c.name) like ${like}`,
    );
  }
  return query.orderBy("mk.name").orderBy("m.model_code").limit(limit).execute();
}

export async function jobTypesByCategory(db: Db) {
  return db
    .selectFrom("job_types as j")
    .innerJoin("tool_categories as c", "c.id", "j.category_id")
    .select(["j.slug", "j.name", "c.slug as category_slug", "c.name as category_name"])
    .orderBy("c.name")
    .orderBy("j.name")
    .execute();
}

async function resolveToolAndJob(db: Db, toolSlug: string, jobSlug: string) {
  const model = await findModel(db, toolSlug);
  if (!model) throw new ReportError("No such tool in the catalogue; pick one from the suggestions", 400, "toolModel");
  const job = await db
    .selectFrom("job_types")
    .select(["id", "category_id"])
    .where("slug", "=", jobSlug)
    .executeTakeFirst();
  if (!job) throw new ReportError("No such job", 400, "jobType");
  if (job.category_id !== model.category_id)
    throw new ReportError(`That job is not one for an ${model.category_name.toLowerCase()}`, 400, "jobType");
  return { model, job };
}

/** The reporter's own report (its row locked until the transaction ends when `lock`); 404 when it is someone else's. */
async function ownReport(db: Db, userId: number, reportId: number, lock = false) {
  const q = db.selectFrom("reports").selectAll().where("id", "=", reportId).where("reporter_id", "=", userId);
  const r = await (lock ? q.forUpdate() : q).executeTakeFirst();
  if (!r) throw new ReportError("No such report among yours", 404);
  return r;
}

export async function getOwnReport(db: Db, userId: number, reportId: number) {
  const r = await ownReport(db, userId, reportId);
  const model = await db
    .selectFrom("tool_models as m")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .select(["m.slug", "m.model_code", "mk.name as maker_name"])
    .where("m.id", "=", r.tool_model_id)
    .executeTakeFirstOrThrow();
  const job = await db
    .selectFrom("job_types")
    .select(["slug"])
    .where("id", "=", r.job_type_id)
    .executeTakeFirstOrThrow();
  return {
    report: r,
    modelSlug: model.slug,
    modelLabel: toolName(model.maker_name, model.model_code),
    jobSlug: job.slug,
  };
}

/** The units the reporter typed in, kept beside the SI values (a moderator reads "3/8 in" as entered). */
const enteredUnits = (v: { pu?: PressureUnit; lu?: LengthUnit }) => ({
  entered_pressure_unit: v.pu ?? "psi",
  entered_length_unit: v.lu ?? "in",
});

/** Creates or updates a draft from whatever is valid so far; needs a tool and a job. */
export async function saveDraft(
  db: Db,
  userId: number,
  reportId: number | undefined,
  draft: ReturnType<typeof parseDraft>,
) {
  if (!draft.toolModel || !draft.jobType)
    throw new ReportError("A draft needs the tool and the job first", 400, draft.toolModel ? "jobType" : "toolModel");
  const { model, job } = await resolveToolAndJob(db, draft.toolModel, draft.jobType);
  const columns = { ...toColumns(draft), ...enteredUnits(draft) };
  return db.transaction().execute(async (trx) => {
    if (reportId) {
      const r = await ownReport(trx, userId, reportId, true); // a submit in flight waits, or finishes first and wins
      if (!EDITABLE.includes(r.status)) throw new ReportError("This report is no longer editable", 409);
      // A returned report stays complete (the database insists): a field cleared while fixing
      // it keeps its stored value until the report is resubmitted.
      const kept =
        r.status === "returned" ? Object.fromEntries(Object.entries(columns).filter(([, v]) => v !== null)) : columns;
      await trx
        .updateTable("reports")
        .set({
          ...kept,
          tool_model_id: model.id,
          category_id: model.category_id,
          job_type_id: job.id,
          updated_at: sql`now()`,
        })
        .where("id", "=", reportId)
        .execute();
      return reportId;
    }
    const row = await trx
      .insertInto("reports")
      .values({
        ...columns,
        reporter_id: userId,
        tool_model_id: model.id,
        category_id: model.category_id,
        job_type_id: job.id,
        status: "draft",
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    return row.id;
  });
}

/** Validated report → submitted, with flags and a version snapshot, all in one transaction. */
export async function submitReport(db: Db, userId: number, reportId: number | undefined, form: ReportForm) {
  const { model, job } = await resolveToolAndJob(db, form.toolModel, form.jobType);
  const columns = { ...toColumns(form), ...enteredUnits(form) };
  return db.transaction().execute(async (trx) => {
    let id = reportId;
    let version = 1;
    if (id) {
      const r = await trx
        .selectFrom("reports")
        .select(["status", "version"])
        .where("id", "=", id)
        .where("reporter_id", "=", userId)
        .forUpdate()
        .executeTakeFirst();
      if (!r) throw new ReportError("No such report among yours", 404);
      if (!EDITABLE.includes(r.status)) throw new ReportError("This report was already submitted", 409);
      version = r.status === "returned" ? r.version + 1 : r.version;
    } else {
      id = (
        await trx
          .insertInto("reports")
          .values({ reporter_id: userId, tool_model_id: model.id, category_id: model.category_id, job_type_id: job.id })
          .returning("id")
          .executeTakeFirstOrThrow()
      ).id;
    }
    const flags = await submitFlags(trx, {
      id,
      reporterId: userId,
      jobTypeId: job.id,
      inletKpa: columns.inlet_kpa!,
      regulatorKpa: columns.regulator_kpa!,
      maxInletKpa: model.max_inlet_kpa,
      timeS: columns.time_to_result_s!,
    });
    const row = await trx
      .updateTable("reports")
      .set({
        ...columns,
        tool_model_id: model.id,
        category_id: model.category_id,
        job_type_id: job.id,
        status: "submitted",
        version,
        flags,
        submitted_at: sql`now()`,
        updated_at: sql`now()`,
      })
      .where("id", "=", id)
      .returningAll()
      .executeTakeFirstOrThrow();
    await trx
      .insertInto("report_versions")
      .values({ report_id: id, version, snapshot: JSON.stringify(row) })
      .execute();
    return { id, flags };
  });
}

export async function withdrawReport(db: Db, userId: number, reportId: number) {
  const r = await db
    .updateTable("reports")
    .set({ status: "withdrawn", updated_at: sql`now()` })
    .where("id", "=", reportId)
    .where("reporter_id", "=", userId)
    .where("status", "in", WITHDRAWABLE)
    .executeTakeFirst();
  if (r.numUpdatedRows === 0n) {
    await ownReport(db, userId, reportId);
    throw new ReportError("A decided report cannot be withdrawn", 409);
  }
}

export async function listOwnReports(db: Db, userId: number) {
  const reports = await db
    .selectFrom("reports as r")
    .innerJoin("tool_models as m", "m.id", "r.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("job_types as j", "j.id", "r.job_type_id")
    .select([
      "r.id",
      "r.status",
      "r.flags",
      "r.version",
      "r.created_at",
      "r.submitted_at",
      "r.updated_at",
      "r.outcome",
      "m.model_code",
      "mk.name as maker_name",
      "j.name as job_name",
      sql<number>`(select count(*)::int from evidence e where e.report_id = r.id and e.status <> 'pending')`.as(
        "evidence",
      ),
    ])
    .where("r.reporter_id", "=", userId)
    .orderBy("r.updated_at", "desc")
    .limit(200)
    .execute();
  const ids = reports.map((r) => r.id);
  const decisions = ids.length
    ? await db
        .selectFrom("decisions")
        .select(["report_id", "action", "reason_code", "note", "created_at"])
        .where("report_id", "in", ids)
        .orderBy("created_at")
        .execute()
    : [];
  return reports.map((r) => ({ ...r, decisions: decisions.filter((d) => d.report_id === r.id) }));
}

/** The reporter's reports still open to change (drafts, returned), newest first, to continue from /reports/new. */
export async function listOpenDrafts(db: Db, userId: number, limit = 3) {
  const rows = await db
    .selectFrom("reports as r")
    .innerJoin("tool_models as m", "m.id", "r.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("job_types as j", "j.id", "r.job_type_id")
    .select(["r.id", "r.status", "r.updated_at", "m.model_code", "mk.name as maker_name", "j.name as job_name"])
    .where("r.reporter_id", "=", userId)
    .where("r.status", "in", EDITABLE)
    .orderBy("r.updated_at", "desc")
    .orderBy("r.id", "desc")
    .limit(limit)
    .execute();
  return rows.map((r) => ({
    id: r.id,
    status: r.status,
    updatedAt: r.updated_at.toISOString(),
    tool: toolName(r.maker_name, r.model_code),
    job: r.job_name,
  }));
}

/** The reporter's last few distinct air supplies, newest first, for one-tap reuse. */
export async function recentSupplies(db: Db, userId: number, limit = 3) {
  return db
    .selectFrom("reports")
    .select([
      "regulator_kpa",
      "hose_id_mm",
      "hose_length_m",
      "coupler_profile",
      "coupler_count",
      "compressor_lps",
      "tank_l",
      sql<Date>`max(updated_at)`.as("last"),
    ])
    .where("reporter_id", "=", userId)
    .where("regulator_kpa", "is not", null)
    .where("hose_id_mm", "is not", null)
    .where("hose_length_m", "is not", null)
    .groupBy([
      "regulator_kpa",
      "hose_id_mm",
      "hose_length_m",
      "coupler_profile",
      "coupler_count",
      "compressor_lps",
      "tank_l",
    ])
    .orderBy("last", "desc")
    .limit(limit)
    .execute();
}
