// Raw counts of accepted reports per (tool model, job type) cell, the input the statistics start
// from. Intervals, shrinkage and pressure adjustment are built on these in app/stats.
import { type Kysely, sql } from "kysely";
import type { Database } from "../../db/schema";
import { modelsBase } from "~/catalogue/queries.server";

type Db = Kysely<Database>;

/** Raw counts per job for one model (accepted reports only). Intervals come from app/stats. */
export async function jobSummaryForModel(db: Db, modelId: number) {
  return db
    .selectFrom("job_types as j")
    .leftJoin("reports as r", (join) =>
      join.onRef("r.job_type_id", "=", "j.id").on("r.tool_model_id", "=", modelId).on("r.status", "=", "accepted"),
    )
    .innerJoin("tool_models as m", (join) => join.onRef("m.category_id", "=", "j.category_id").on("m.id", "=", modelId))
    .select([
      "j.slug", "j.name",
      sql<number>`count(r.id)::int`.as("n"),
      sql<number>`(count(*) filter (where r.outcome = 'freed'))::int`.as("freed"),
      sql<number | null>`percentile_cont(0.5) within group (order by r.time_to_result_s) filter (where r.outcome = 'freed')`.as("median_time_s"),
      sql<number | null>`percentile_cont(0.5) within group (order by r.inlet_kpa)`.as("median_inlet_kpa"),
    ])
    .groupBy(["j.id", "j.slug", "j.name"])
    .orderBy("n", "desc")
    .execute();
}

/** Raw counts per model for one job (accepted reports only). */
export async function modelSummaryForJob(db: Db, jobId: number) {
  return modelsBase(db)
    .innerJoin("reports as r", (join) => join.onRef("r.tool_model_id", "=", "m.id").on("r.job_type_id", "=", jobId).on("r.status", "=", "accepted"))
    .select([
      sql<number>`count(r.id)::int`.as("n"),
      sql<number>`(count(*) filter (where r.outcome = 'freed'))::int`.as("freed"),
      sql<number | null>`percentile_cont(0.5) within group (order by r.time_to_result_s) filter (where r.outcome = 'freed')`.as("median_time_s"),
      sql<number | null>`percentile_cont(0.5) within group (order by r.inlet_kpa)`.as("median_inlet_kpa"),
    ])
    .groupBy(["m.id", "mk.id", "c.id"])
    .orderBy("n", "desc")
    .execute();
}
