// Catalogue reads for the public pages. Each takes `db` first so callers can share a transaction.
import { sql } from "kysely";
import type { Db } from "../../db/database";

export function modelsBase(db: Db) {
  return db
    .selectFrom("tool_models as m")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("tool_categories as c", "c.id", "m.category_id")
    .select([
      "m.id",
      "m.slug",
      "m.model_code",
      "m.name",
      "m.fitting",
      "m.weight_kg",
      "m.length_mm",
      "m.street_price_cents",
      "m.rated_air_lps",
      "m.running_air_lps",
      "m.running_air_source",
      "m.running_air_factor",
      "mk.name as maker_name",
      "mk.slug as maker_slug",
      "c.name as category_name",
      "c.slug as category_slug",
    ]);
}

export async function listModels(db: Db) {
  return (
    modelsBase(db)
      // Counted from the stored stats cells, which the refresh job keeps in step with accepts.
      .select(
        sql<number>`(select coalesce(sum(s.n + s.set_aside), 0)::int from stats_cells s where s.tool_model_id = m.id)`.as(
          "accepted_reports",
        ),
      )
      .orderBy("c.name")
      .orderBy("mk.name")
      .orderBy("m.model_code")
      .execute()
  );
}

export async function getModelBySlug(db: Db, slug: string) {
  return modelsBase(db)
    .select([
      "m.bore_mm",
      "m.stroke_mm",
      "m.blows_per_minute",
      "m.free_speed_rpm",
      "m.max_torque_nm",
      "m.air_inlet",
      "m.max_inlet_kpa",
      "m.measured_specs",
      "c.action as category_action",
      "m.category_id",
    ])
    .where("m.slug", "=", slug)
    .executeTakeFirst();
}

export async function listJobs(db: Db) {
  return db
    .selectFrom("job_types as j")
    .innerJoin("tool_categories as c", "c.id", "j.category_id")
    .select([
      "j.id",
      "j.slug",
      "j.name",
      "j.description",
      "c.name as category_name",
      "c.slug as category_slug",
      "c.action as category_action",
    ])
    .select(
      sql<number>`(select coalesce(sum(s.n + s.set_aside), 0)::int from stats_cells s where s.job_type_id = j.id)`.as(
        "accepted_reports",
      ),
    )
    .orderBy("c.name")
    .orderBy("j.name")
    .execute();
}

export async function getJobBySlug(db: Db, slug: string) {
  return db
    .selectFrom("job_types as j")
    .innerJoin("tool_categories as c", "c.id", "j.category_id")
    .select([
      "j.id",
      "j.slug",
      "j.name",
      "j.description",
      "j.seized",
      "c.name as category_name",
      "c.action as category_action",
    ])
    .where("j.slug", "=", slug)
    .executeTakeFirst();
}

export interface ReportFilter {
  modelId?: number;
  jobId?: number;
  limit: number;
  offset?: number;
}

export async function acceptedReports(db: Db, { modelId, jobId, limit, offset = 0 }: ReportFilter) {
  let q = db
    .selectFrom("reports as r")
    .innerJoin("tool_models as m", "m.id", "r.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("job_types as j", "j.id", "r.job_type_id")
    .innerJoin("users as u", "u.id", "r.reporter_id")
    .select([
      "r.id",
      "r.accepted_at",
      "r.vehicle_class",
      "r.corrosion_level",
      "r.inlet_kpa",
      "r.inlet_source",
      "r.hose_id_mm",
      "r.hose_length_m",
      "r.outcome",
      "r.time_to_result_s",
      "r.attempts",
      "m.slug as model_slug",
      "m.model_code",
      "mk.name as maker_name",
      "j.slug as job_slug",
      "j.name as job_name",
      "u.handle as reporter_handle",
    ])
    .where("r.status", "=", "accepted");
  if (modelId != null) q = q.where("r.tool_model_id", "=", modelId);
  if (jobId != null) q = q.where("r.job_type_id", "=", jobId);
  return q.orderBy("r.accepted_at", "desc").orderBy("r.id", "desc").limit(limit).offset(offset).execute();
}

/** Accepted reports, counted from the stored stats cells (kept in step by the refresh job). */
export async function countAccepted(db: Db, { modelId, jobId }: { modelId?: number; jobId?: number } = {}) {
  let q = db.selectFrom("stats_cells").select(sql<number>`coalesce(sum(n + set_aside), 0)::int`.as("n"));
  if (modelId != null) q = q.where("tool_model_id", "=", modelId);
  if (jobId != null) q = q.where("job_type_id", "=", jobId);
  return (await q.executeTakeFirstOrThrow()).n;
}

export type AcceptedReportRow = Awaited<ReturnType<typeof acceptedReports>>[number];

/** Published evidence of a model's accepted reports (app/reports/public.server.ts), beside the model's other reads. */
export { publishedEvidenceForModel } from "~/reports/public.server";
