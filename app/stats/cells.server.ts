// Reads of the stored cells for pages and the API. Pages never recompute from raw reports.
import type { Db } from "../../db/database";
import { survivalSteps } from "./refresh.server";
import { orderCells, tellApart } from "./standings";

/** The stored figures of a cell, as every reader (pages, compare, the feed) selects them. */
export const cellColumns = [
  "s.n",
  "s.successes",
  "s.estimate",
  "s.lower",
  "s.upper",
  "s.shrunk_estimate",
  "s.shrunk_lower",
  "s.shrunk_upper",
  "s.reporters",
  "s.design_effect",
  "s.effective_n",
  "s.set_aside",
  "s.time_n",
  "s.time_median_s",
  "s.time_lower_s",
  "s.time_upper_s",
  "s.time_coverage",
  "s.km_n",
  "s.km_median_s",
  "s.km_lower_s",
  "s.km_upper_s",
  "s.adj_estimate",
  "s.adj_lower",
  "s.adj_upper",
  "s.adj_reason",
  "s.fit",
  "s.measured_share",
  "s.estimated_share",
  "s.confidence",
  "s.computed_at",
] as const;

export async function cellsForModel(db: Db, modelId: number) {
  return db
    .selectFrom("stats_cells as s")
    .innerJoin("job_types as j", "j.id", "s.job_type_id")
    .select([...cellColumns, "j.slug as job_slug", "j.name as job_name"])
    .where("s.tool_model_id", "=", modelId)
    .orderBy("s.n", "desc")
    .execute();
}

/** A job's cells in one query (the order is `orderCells`'s business). */
export async function cellsForJob(db: Db, jobTypeId: number) {
  return db
    .selectFrom("stats_cells as s")
    .innerJoin("tool_models as m", "m.id", "s.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .select([
      ...cellColumns,
      "s.tool_model_id",
      "m.slug as model_slug",
      "m.model_code",
      "m.fitting",
      "m.weight_kg",
      "m.street_price_cents",
      "m.rated_air_lps",
      "m.running_air_lps",
      "m.running_air_source",
      "m.running_air_factor",
      "mk.name as maker_name",
    ])
    .where("s.job_type_id", "=", jobTypeId)
    .execute();
}

export async function jobFit(db: Db, jobTypeId: number) {
  return db
    .selectFrom("stats_jobs")
    .select(["fit_n", "fit_models", "slope", "slope_se", "fit_reason", "set_aside"])
    .where("job_type_id", "=", jobTypeId)
    .executeTakeFirst();
}

/** A job's tools in the one order every page uses, with each tool's mark against the top tool. */
export async function jobStandings(db: Db, jobTypeId: number) {
  const [cells, fit] = await Promise.all([cellsForJob(db, jobTypeId), jobFit(db, jobTypeId)]);
  const { basis, rows } = orderCells(cells, fit?.slope != null);
  return { basis, rows, fit: fit ?? null, setAside: fit?.set_aside ?? 0 };
}

/**
 * The compare page's figures: the chosen tools' standings on the job (the same rule as the job
 * page: one read of the job's cells), every pair between them, and the chosen tools' time-to-free
 * curves (worked out from their reports: only this page draws them). Unknown or empty slugs are dropped.
 */
export async function compareOnJob(db: Db, jobTypeId: number, modelSlugs: readonly string[]) {
  const standings = await jobStandings(db, jobTypeId);
  const top = standings.rows.find((r) => r.mark === "top")?.cell ?? null;
  const chosen = modelSlugs.map((s) => standings.rows.find((r) => r.cell.model_slug === s)).filter((r) => r != null);
  const pairs = chosen.flatMap((a, i) =>
    chosen.slice(i + 1).map((b) => ({ a: a.cell.model_slug, b: b.cell.model_slug, ...tellApart(a.cell, b.cell) })),
  );
  const steps = await survivalSteps(
    db,
    jobTypeId,
    chosen.map((r) => r.cell.tool_model_id),
  );
  return { ...standings, top, chosen, pairs, steps };
}

export async function cellBySlugs(db: Db, modelSlug: string, jobSlug: string) {
  return db
    .selectFrom("stats_cells as s")
    .innerJoin("tool_models as m", "m.id", "s.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("job_types as j", "j.id", "s.job_type_id")
    .select([
      ...cellColumns,
      "m.slug as model_slug",
      "m.model_code",
      "mk.name as maker_name",
      "j.slug as job_slug",
      "j.name as job_name",
    ])
    .where("m.slug", "=", modelSlug)
    .where("j.slug", "=", jobSlug)
    .executeTakeFirst();
}

export type JobCell = Awaited<ReturnType<typeof cellsForJob>>[number];
export type ModelCell = Awaited<ReturnType<typeof cellsForModel>>[number];
export type JobStandings = Awaited<ReturnType<typeof jobStandings>>;
