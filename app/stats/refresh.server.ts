// Keeps stats_cells in step with accepted reports. A single accept refreshes its own cell and
// re-shrinks its job type (a few dozen rows); the full refresh recomputes everything.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { type CellFigures, type CellReport, cellFigures } from "./cells";
import { shrinkProportions } from "./proportions";


async function acceptedReports(db: Db, jobTypeId: number, modelId?: number) {
  let q = db.selectFrom("reports").select(["tool_model_id", "outcome", "time_to_result_s", "inlet_kpa", "inlet_source"])
    .where("job_type_id", "=", jobTypeId).where("status", "=", "accepted");
  if (modelId != null) q = q.where("tool_model_id", "=", modelId);
  const rows = await q.execute();
  const byModel = new Map<number, CellReport[]>();
  for (const r of rows) {
    const list = byModel.get(r.tool_model_id) ?? [];
    list.push({ freed: r.outcome === "freed", timeS: r.time_to_result_s!, inletKpa: r.inlet_kpa!, inletSource: r.inlet_source! });
    byModel.set(r.tool_model_id, list);
  }
  return byModel;
}

function row(modelId: number, jobTypeId: number, f: CellFigures) {
  return {
    tool_model_id: modelId, job_type_id: jobTypeId, n: f.n, successes: f.successes, estimate: f.estimate, lower: f.lower, upper: f.upper,
    time_n: f.time?.n ?? 0, time_median_s: f.time?.median ?? null, time_lower_s: f.time?.lower ?? null, time_upper_s: f.time?.upper ?? null,
    adj_estimate: f.adjusted?.estimate ?? null, adj_lower: f.adjusted?.lower ?? null, adj_upper: f.adjusted?.upper ?? null,
    adj_reason: f.adjustedReason, fit: f.fit ? JSON.stringify(f.fit) : null,
    measured_share: f.measuredShare, estimated_share: f.estimatedShare, computed_at: new Date(),
  };
}

/** Empirical-Bayes shrinkage within one job type, over the stored counts of its cells. */
async function reshrink(db: Db, jobTypeId: number) {
  const cells = await db.selectFrom("stats_cells").select(["tool_model_id", "n", "successes"]).where("job_type_id", "=", jobTypeId).orderBy("tool_model_id").execute();
  if (cells.length === 0) return;
  const shrunk = shrinkProportions(cells.map((c) => ({ successes: c.successes, trials: c.n })));
  const values = cells.map((c, i) => sql`(${c.tool_model_id}::int, ${shrunk.groups[i]!.estimate}::float8, ${shrunk.groups[i]!.lower}::float8, ${shrunk.groups[i]!.upper}::float8)`);
  await sql`update stats_cells s set shrunk_estimate = v.e, shrunk_lower = v.l, shrunk_upper = v.u
    from (values ${sql.join(values)}) as v(m, e, l, u) where s.job_type_id = ${jobTypeId} and s.tool_model_id = v.m`.execute(db);
}

async function store(db: Db, jobTypeId: number, byModel: Map<number, CellReport[]>) {
  const rows = [...byModel].map(([modelId, reports]) => row(modelId, jobTypeId, cellFigures(reports, `${modelId}-${jobTypeId}`)));
  for (let i = 0; i < rows.length; i += 500) {
    await db.insertInto("stats_cells").values(rows.slice(i, i + 500))
      .onConflict((oc) => oc.columns(["tool_model_id", "job_type_id"]).doUpdateSet((eb) => ({
        n: eb.ref("excluded.n"), successes: eb.ref("excluded.successes"), estimate: eb.ref("excluded.estimate"), lower: eb.ref("excluded.lower"),
        upper: eb.ref("excluded.upper"), time_n: eb.ref("excluded.time_n"), time_median_s: eb.ref("excluded.time_median_s"),
        time_lower_s: eb.ref("excluded.time_lower_s"), time_upper_s: eb.ref("excluded.time_upper_s"), adj_estimate: eb.ref("excluded.adj_estimate"),
        adj_lower: eb.ref("excluded.adj_lower"), adj_upper: eb.ref("excluded.adj_upper"), adj_reason: eb.ref("excluded.adj_reason"),
        fit: eb.ref("excluded.fit"), measured_share: eb.ref("excluded.measured_share"), estimated_share: eb.ref("excluded.estimated_share"),
        computed_at: eb.ref("excluded.computed_at"),
      }))).execute();
  }
}

/** After an accept: that cell, then its job type's shrinkage. */
export async function refreshCell(db: Db, modelId: number, jobTypeId: number) {
  await db.transaction().execute(async (trx) => {
    const byModel = await acceptedReports(trx, jobTypeId, modelId);
    if (byModel.size === 0) await trx.deleteFrom("stats_cells").where("tool_model_id", "=", modelId).where("job_type_id", "=", jobTypeId).execute();
    else await store(trx, jobTypeId, byModel);
    await reshrink(trx, jobTypeId);
  });
}

/** Every cell, recomputed from the accepted reports. */
export async function refreshAll(db: Db) {
  const jobs = await db.selectFrom("job_types").select("id").orderBy("id").execute();
  let cells = 0;
  for (const job of jobs) {
    await db.transaction().execute(async (trx) => {
      const byModel = await acceptedReports(trx, job.id);
      await trx.deleteFrom("stats_cells").where("job_type_id", "=", job.id)
        .where("tool_model_id", "not in", byModel.size ? [...byModel.keys()] : [-1]).execute();
      await store(trx, job.id, byModel);
      await reshrink(trx, job.id);
      cells += byModel.size;
    });
  }
  return cells;
}
