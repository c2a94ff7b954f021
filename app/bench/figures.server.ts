// Keeps the stored bench figures in step with accepted bench runs (and, for the force a job takes,
// with accepted reports): everything is recomputed in one transaction, so a reader sees the old
// figures or the new ones, never a mix. Run by the worker's bench-figures queue after an accept, at
// db:prepare when none are stored, and by `npm run bench:refresh`.
import { sql } from "kysely";
import type { Db, Trx } from "../../db/database";
import { operatingInletPressure } from "~/air/supply";
import { enqueue, QUEUES } from "~/jobs/queue.server";
import { calibrationStatus } from "./calibration";
import { forceForJob, type ForceFit, type ForceRow } from "./force-for-job";
import {
  agreementOf,
  benchForceAt,
  type ForceAtPressure,
  pooledFigures,
  pressureSlopes,
  runAgreements,
  type RunSeriesData,
} from "./stored-figures";

/** Enqueues a full refresh of the bench figures inside the transaction that accepts a run. */
export function enqueueBenchFiguresRefresh(trx: Trx) {
  return enqueue(trx, QUEUES.benchFigures, {});
}

/** Rigs whose runs count now: a calibration verified by a moderator and not older than the rig's limit. */
async function countingRigs(db: Db, now: Date): Promise<Set<number>> {
  const rows = await db
    .selectFrom("rig_calibrations as c")
    .innerJoin("rigs as r", "r.id", "c.rig_id")
    .select(["c.rig_id", "c.calibrated_on", "c.verified_at", "r.check_interval_months"])
    .where("c.verified_at", "is not", null)
    .execute();
  const ok = new Set<number>();
  for (const c of rows) {
    const state = calibrationStatus({
      verifiedAt: c.verified_at ? new Date(c.verified_at) : null,
      calibratedOn: new Date(c.calibrated_on),
      now,
      maxAgeMonths: c.check_interval_months,
    });
    if (state.status === "current") ok.add(c.rig_id);
  }
  return ok;
}

/** Every accepted run's series on a counting rig, with each trial's peaks. */
export async function loadRunSeries(db: Db, now = new Date()): Promise<RunSeriesData[]> {
  const rigs = await countingRigs(db, now);
  if (rigs.size === 0) return [];
  const rows = await db
    .selectFrom("bench_runs as r")
    .innerJoin("bench_run_series as rs", "rs.run_id", "r.id")
    .innerJoin("bench_protocol_series as ps", "ps.id", "rs.series_id")
    .innerJoin("bench_trials as t", "t.run_series_id", "rs.id")
    .select([
      "r.id as runId",
      "r.rig_id as rigId",
      "r.tool_model_id as modelId",
      "r.protocol_id as protocolId",
      "rs.series_id as seriesId",
      "rs.id as runSeriesId",
      "ps.trigger",
      "ps.inlet",
      "ps.inlet_kpa as inletKpa",
      "rs.running_inlet_kpa as runningInletKpa",
      "t.peaks",
    ])
    .where("r.status", "=", "accepted")
    .where("r.rig_id", "in", [...rigs])
    .orderBy("rs.id")
    .orderBy("t.trial_number")
    .execute();
  const bySeries = new Map<number, RunSeriesData>();
  for (const { runSeriesId, peaks, ...row } of rows) {
    const s = bySeries.get(runSeriesId) ?? { ...row, trials: [] };
    s.trials.push(peaks.map(Number));
    bySeries.set(runSeriesId, s);
  }
  return [...bySeries.values()];
}

/** In-control check-standard readings of counting rigs, grouped by the reference tool they measure. */
async function checkReadings(db: Db, rigs: Set<number>) {
  if (rigs.size === 0) return new Map<number, { rigId: number; value: number }[]>();
  const rows = await db
    .selectFrom("rig_check_readings as c")
    .innerJoin("rigs as r", "r.id", "c.rig_id")
    .select(["r.check_tool_model_id as modelId", "c.rig_id as rigId", "c.value"])
    .where("r.check_tool_model_id", "is not", null)
    .where("c.in_control", "=", true)
    .where("c.rig_id", "in", [...rigs])
    .execute();
  const byModel = new Map<number, { rigId: number; value: number }[]>();
  for (const r of rows) {
    const list = byModel.get(r.modelId!) ?? [];
    list.push({ rigId: r.rigId, value: r.value });
    byModel.set(r.modelId!, list);
  }
  return byModel;
}

const json = (v: unknown) => JSON.stringify(v);

export interface RefreshCounts {
  pooled: number;
  agreements: number;
  slopes: number;
  jobs: number;
}

/** Recomputes every stored bench figure in one transaction. `now` decides which calibrations are current. */
export async function refreshBenchFigures(
  db: Db,
  { now = new Date(), confidence = 0.95 } = {},
): Promise<RefreshCounts> {
  const run = async (trx: Trx) => {
    // One refresh at a time: a second waits here rather than interleaving deletes and inserts.
    await sql`select pg_advisory_xact_lock(hashtext('bench-figures-refresh'))`.execute(trx);
    const series = await loadRunSeries(trx, now);
    const rigs = await countingRigs(trx, now);
    await trx.deleteFrom("bench_job_force").execute();
    await trx.deleteFrom("bench_pressure_slopes").execute();
    await trx.deleteFrom("bench_rig_agreement").execute();
    await trx.deleteFrom("bench_pooled_figures").execute();

    const pooled = pooledFigures(series, confidence);
    for (const f of pooled) {
      const p = f.pooled;
      await trx
        .insertInto("bench_pooled_figures")
        .values({
          tool_model_id: f.modelId,
          series_id: f.seriesId,
          protocol_id: f.protocolId,
          figure: f.figure,
          estimate: p.estimate,
          lower: p.lower,
          upper: p.upper,
          standard_error: p.standardError,
          tau2: p.tau2,
          i2: p.i2,
          prediction_lower: p.predictionLower,
          prediction_upper: p.predictionUpper,
          runs: f.runs,
          rigs: f.rigs,
          method: p.method,
          confidence,
          computed_at: now,
        })
        .execute();
    }

    const agreements = [
      ...[...(await checkReadings(trx, rigs))].flatMap(([modelId, readings]) => {
        const agreement = agreementOf(readings, confidence);
        return agreement ? [{ modelId, source: "check_readings" as const, seriesId: null, agreement }] : [];
      }),
      ...runAgreements(series, confidence),
    ];
    for (const a of agreements) {
      const g = a.agreement;
      const { id } = await trx
        .insertInto("bench_rig_agreement")
        .values({
          tool_model_id: a.modelId,
          source: a.source,
          series_id: a.seriesId,
          repeatability_sd: g.repeatabilitySD,
          reproducibility_sd: g.reproducibilitySD,
          between_rig_sd: g.betweenRigSD,
          grand_mean: g.grandMean,
          rigs: g.p,
          readings: g.total,
          confidence,
          computed_at: now,
        })
        .returning("id")
        .executeTakeFirstOrThrow();
      await trx
        .insertInto("bench_rig_bias")
        .values(g.rigs.map((r) => ({ agreement_id: id, rig_id: Number(r.rig), ...pick(r) })))
        .execute();
    }

    const slopes = pressureSlopes(series, confidence);
    for (const s of slopes) {
      const f = s.slope;
      await trx
        .insertInto("bench_pressure_slopes")
        .values({
          tool_model_id: s.modelId,
          protocol_id: s.protocolId,
          slope: f.slope,
          slope_lower: f.slopeLower,
          slope_upper: f.slopeUpper,
          intercept: f.intercept,
          at_kpa: f.atKpa,
          predicted: f.predicted,
          predicted_lower: f.predictedLower,
          predicted_upper: f.predictedUpper,
          residual_sd: f.residualSD,
          n: f.n,
          points: json(s.points),
          band: json(f.band),
          confidence,
          computed_at: now,
        })
        .execute();
    }

    const jobs = await refreshJobForce(trx, confidence, now);
    return { pooled: pooled.length, agreements: agreements.length, slopes: slopes.length, jobs };
  };
  return db.isTransaction ? run(db as Trx) : db.transaction().execute(run);
}

const pick = (r: { n: number; mean: number; bias: number; lower: number; upper: number }) => ({
  n: r.n,
  mean: r.mean,
  bias: r.bias,
  lower: r.lower,
  upper: r.upper,
});

/**
 * Each model's bench force as a function of inlet pressure, per tool category: its pressure line
 * where it has one, else the pooled full-trigger force of the regulated series with the most runs.
 */
export async function benchForces(db: Db) {
  const lines = await db
    .selectFrom("bench_pressure_slopes as s")
    .innerJoin("bench_protocols as p", "p.id", "s.protocol_id")
    .select([
      "s.tool_model_id as modelId",
      "p.category_id as categoryId",
      "p.quantity",
      "s.intercept",
      "s.slope",
      "s.n",
      "s.points",
    ])
    .orderBy("s.n", "desc")
    .execute();
  const pooled = await db
    .selectFrom("bench_pooled_figures as f")
    .innerJoin("bench_protocol_series as ps", "ps.id", "f.series_id")
    .innerJoin("bench_protocols as p", "p.id", "f.protocol_id")
    .select(["f.tool_model_id as modelId", "p.category_id as categoryId", "p.quantity", "f.estimate", "f.runs"])
    .where("f.figure", "=", "force")
    .where("ps.trigger", "=", "full")
    .where("ps.inlet", "=", "regulated_at_tool")
    .orderBy("f.runs", "desc")
    .execute();
  const forces = new Map<string, ForceAtPressure & { quantity: string }>();
  const key = (categoryId: number, modelId: number) => `${categoryId}:${modelId}`;
  for (const l of lines) {
    const k = key(l.categoryId, l.modelId);
    if (forces.has(k)) continue;
    const ps = l.points.map((p) => p.pressureKpa);
    const line = { intercept: l.intercept, slope: l.slope, lowKpa: Math.min(...ps), highKpa: Math.max(...ps) };
    forces.set(k, { modelId: l.modelId, quantity: l.quantity, line, pooled: null });
  }
  for (const p of pooled) {
    const k = key(p.categoryId, p.modelId);
    const f = forces.get(k);
    if (f) f.pooled ??= p.estimate;
    else forces.set(k, { modelId: p.modelId, quantity: p.quantity, line: null, pooled: p.estimate });
  }
  return { get: (categoryId: number, modelId: number) => forces.get(key(categoryId, modelId)) ?? null };
}

/**
 * The rows of one job's force fit: each accepted report of a model with bench data, its bench force at
 * the report's inlet pressure (measured at the inlet as given; read at the regulator, the pressure
 * app/air predicts at the inlet for the reported line — as the stats cells do; estimated, not at all)
 * and whether it freed the job.
 */
export async function jobForceRows(db: Db, jobTypeId: number) {
  const job = await db.selectFrom("job_types").select("category_id").where("id", "=", jobTypeId).executeTakeFirst();
  if (!job) return { rows: [] as (ForceRow & { modelId: number })[], quantity: null };
  const forces = await benchForces(db);
  const reports = await db
    .selectFrom("reports as r")
    .innerJoin("tool_models as m", "m.id", "r.tool_model_id")
    .select([
      "r.tool_model_id as modelId",
      "r.outcome",
      "r.inlet_kpa",
      "r.inlet_source",
      "r.hose_id_mm",
      "r.hose_length_m",
      "r.coupler_profile",
      "r.coupler_count",
      "m.rated_air_lps",
    ])
    .where("r.job_type_id", "=", jobTypeId)
    .where("r.status", "=", "accepted")
    .where("r.inlet_source", "in", ["measured_at_inlet", "read_at_regulator"])
    .where("r.inlet_kpa", "is not", null)
    .execute();
  const rows: (ForceRow & { modelId: number })[] = [];
  let quantity: string | null = null;
  for (const r of reports) {
    const f = forces.get(job.category_id, r.modelId);
    if (!f) continue;
    quantity ??= f.quantity;
    let inletKpa = r.inlet_kpa!;
    if (r.inlet_source === "read_at_regulator") {
      if (r.hose_id_mm == null || r.hose_length_m == null || r.coupler_profile == null || r.coupler_count == null)
        continue;
      if (!(r.rated_air_lps > 0)) continue;
      const at = operatingInletPressure(inletKpa, r.rated_air_lps, {
        hoseIdMm: r.hose_id_mm,
        hoseLengthM: r.hose_length_m,
        couplerProfile: r.coupler_profile,
        couplerCount: r.coupler_count,
      });
      if (at.stalled) continue;
      inletKpa = at.inletKpa;
    }
    const force = benchForceAt(f, inletKpa);
    if (force === null) continue;
    rows.push({ modelId: r.modelId, force, y: r.outcome === "freed" ? 1 : 0 });
  }
  return { rows, quantity };
}

/** Maximum likelihood, or Firth's penalised fit when the reports separate by force; null when neither gives a finite ED50. */
export function fitJobForce(rows: readonly ForceRow[], confidence = 0.95): ForceFit | null {
  if (rows.length < 3 || new Set(rows.map((r) => r.force)).size < 2) return null;
  for (const firth of [false, true]) {
    const fit = forceForJob(rows, confidence, { firth });
    if (fit.converged && Number.isFinite(fit.ed50) && fit.slope !== 0) return fit;
  }
  return null;
}

async function refreshJobForce(trx: Trx, confidence: number, now: Date) {
  const jobs = await trx.selectFrom("job_types").select("id").orderBy("id").execute();
  let stored = 0;
  for (const { id } of jobs) {
    const { rows, quantity } = await jobForceRows(trx, id);
    const fit = fitJobForce(rows, confidence);
    if (!fit || !quantity) continue;
    const forces = rows.map((r) => r.force);
    await trx
      .insertInto("bench_job_force")
      .values({
        job_type_id: id,
        quantity: quantity as "peak_force_n" | "peak_torque_nm",
        intercept: fit.intercept,
        slope: fit.slope,
        var_intercept: fit.covariance[0][0],
        cov_intercept_slope: fit.covariance[0][1],
        var_slope: fit.covariance[1][1],
        ed50: fit.ed50,
        ed50_lower: fit.ed50Lower,
        ed50_upper: fit.ed50Upper,
        method: fit.method,
        firth: fit.firth,
        converged: fit.converged,
        reports: rows.length,
        models: new Set(rows.map((r) => r.modelId)).size,
        force_min: Math.min(...forces),
        force_max: Math.max(...forces),
        confidence,
        computed_at: now,
      })
      .execute();
    stored++;
  }
  return stored;
}
