// Reads of the stored cells for pages and the API. Pages never recompute from raw reports.
import type { Db } from "../../db/database";


const cellColumns = [
  "s.n", "s.successes", "s.estimate", "s.lower", "s.upper", "s.shrunk_estimate", "s.shrunk_lower", "s.shrunk_upper",
  "s.time_n", "s.time_median_s", "s.time_lower_s", "s.time_upper_s", "s.adj_estimate", "s.adj_lower", "s.adj_upper", "s.adj_reason",
  "s.fit", "s.measured_share", "s.estimated_share", "s.confidence", "s.computed_at",
] as const;

export async function cellsForModel(db: Db, modelId: number) {
  return db.selectFrom("stats_cells as s").innerJoin("job_types as j", "j.id", "s.job_type_id")
    .select([...cellColumns, "j.slug as job_slug", "j.name as job_name"])
    .where("s.tool_model_id", "=", modelId).orderBy("s.n", "desc").execute();
}

/** A job's cells, ordered by the interval's lower bound (best supported first). */
export async function cellsForJob(db: Db, jobTypeId: number) {
  return db.selectFrom("stats_cells as s").innerJoin("tool_models as m", "m.id", "s.tool_model_id").innerJoin("makers as mk", "mk.id", "m.maker_id")
    .select([...cellColumns, "m.slug as model_slug", "m.model_code", "m.fitting", "m.weight_kg", "m.street_price_cents", "m.rated_air_lps", "mk.name as maker_name"])
    .where("s.job_type_id", "=", jobTypeId).orderBy("s.lower", "desc").orderBy("s.n", "desc").execute();
}

export async function cellBySlugs(db: Db, modelSlug: string, jobSlug: string) {
  return db.selectFrom("stats_cells as s").innerJoin("tool_models as m", "m.id", "s.tool_model_id").innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("job_types as j", "j.id", "s.job_type_id")
    .select([...cellColumns, "m.slug as model_slug", "m.model_code", "mk.name as maker_name", "j.slug as job_slug", "j.name as job_name"])
    .where("m.slug", "=", modelSlug).where("j.slug", "=", jobSlug).executeTakeFirst();
}

export type JobCell = Awaited<ReturnType<typeof cellsForJob>>[number];
export type ModelCell = Awaited<ReturnType<typeof cellsForModel>>[number];
