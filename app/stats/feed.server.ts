// The feed's stats records (/api/v1/stats): every figure the job and compare pages show, from the
// stored cells and the same ordering rule (standings.ts). Field meanings: app/feed/fields.ts STAT_FIELDS.
import type { Db } from "../../db/database";
import { cellColumns } from "./cells.server";
import { REFERENCE_INLET_KPA } from "./pressure";
import { orderCells } from "./standings";

export async function statRecords(db: Db, f: { modelId?: number; jobId?: number; categoryId?: number }) {
  // The order needs every cell of a job, so read whole jobs and filter by model afterwards.
  const cells = await db
    .selectFrom("stats_cells as s")
    .innerJoin("tool_models as m", "m.id", "s.tool_model_id")
    .innerJoin("job_types as j", "j.id", "s.job_type_id")
    .leftJoin("stats_jobs as sj", "sj.job_type_id", "s.job_type_id")
    .select([
      "m.slug as model_slug",
      "j.slug as job",
      "s.tool_model_id",
      "s.job_type_id",
      ...cellColumns,
      "sj.fit_n",
      "sj.fit_models",
      "sj.slope",
      "sj.slope_se",
    ])
    .$if(!!f.jobId, (q) => q.where("s.job_type_id", "=", f.jobId!))
    .$if(!!f.categoryId, (q) => q.where("j.category_id", "=", f.categoryId!))
    .$if(!!f.modelId, (q) =>
      q.where("s.job_type_id", "in", (eb) =>
        eb.selectFrom("stats_cells").select("job_type_id").where("tool_model_id", "=", f.modelId!),
      ),
    )
    .execute();
  const byJob = new Map<number, typeof cells>();
  for (const c of cells) byJob.set(c.job_type_id, [...(byJob.get(c.job_type_id) ?? []), c]);
  const out = [];
  for (const jobCells of byJob.values()) {
    const { basis, rows } = orderCells(jobCells, jobCells[0]!.slope != null);
    const top = rows.find((r) => r.mark === "top")?.cell.model_slug ?? null;
    for (const [i, { cell: s, mark, orderedBy, vsTop }] of rows.entries()) {
      if (f.modelId && s.tool_model_id !== f.modelId) continue;
      const adjusted = s.adj_estimate != null && s.adj_lower != null && s.adj_upper != null;
      out.push({
        model: s.model_slug,
        job: s.job,
        n: s.n,
        successes: s.successes,
        estimate: s.estimate,
        lower: s.lower,
        upper: s.upper,
        method: "wilson_score",
        confidence: s.confidence,
        reporters: s.reporters,
        design_effect: s.design_effect,
        effective_n: s.effective_n ?? s.n,
        set_aside: s.set_aside,
        time_freed:
          s.time_median_s == null
            ? null
            : {
                n: s.time_n,
                median: s.time_median_s,
                lower: s.time_lower_s,
                upper: s.time_upper_s,
                coverage: s.time_coverage,
                method: "order_statistic",
              },
        time_to_free:
          s.km_n === 0
            ? null
            : {
                n: s.km_n,
                censored: s.km_n - s.successes,
                median: s.km_median_s,
                lower: s.km_lower_s,
                upper: s.km_upper_s,
                method: "kaplan_meier_brookmeyer_crowley",
              },
        pressure_adjusted: adjusted
          ? {
              inlet_kpa: REFERENCE_INLET_KPA,
              estimate: s.adj_estimate!,
              lower: s.adj_lower!,
              upper: s.adj_upper!,
              method: "pooled_logistic_firth_wald",
            }
          : null,
        pressure_adjusted_reason: adjusted ? null : (s.adj_reason ?? "no pressure fit"),
        pressure_fit:
          s.fit && s.slope != null
            ? {
                job_reports: s.fit_n ?? 0,
                job_models: s.fit_models ?? 0,
                slope_per_bar: s.slope,
                slope_se: s.slope_se!,
                model_reports: s.fit.n,
                p10_kpa: s.fit.p10Kpa,
                p90_kpa: s.fit.p90Kpa,
                min_kpa: s.fit.minKpa,
                max_kpa: s.fit.maxKpa,
              }
            : null,
        order: {
          position: i + 1,
          job_basis: basis,
          ordered_by: orderedBy,
          mark,
          top_model: top,
          told_apart_from_top: vsTop ? vsTop.distinguishable : null,
        },
        difference_from_top: vsTop
          ? {
              estimate: vsTop.estimate,
              lower: vsTop.lower,
              upper: vsTop.upper,
              method: "newcombe_hybrid_score_effective_n",
            }
          : null,
        computed_at: new Date(s.computed_at).toISOString(),
      });
    }
  }
  return out.sort((a, b) => a.model.localeCompare(b.model) || a.job.localeCompare(b.job));
}
