// Keeps stats_cells and stats_jobs in step with accepted reports. An accept refreshes its own cell
// and its job's pooled pressure fit (every cell of the job gets its new figure at 90 psi); the
// job's shrinkage prior is kept from the last full refresh (docs/decisions/010). The full refresh
// recomputes everything, one job type at a time. Each read brings a cell's reports as arrays (one
// row per cell, not per report), so a million reports cost little more than the rows themselves.
import { type RawBuilder, sql } from "kysely";
import type { Db } from "../../db/database";
import { operatingInletPressure } from "~/air/supply";
import type { CouplerProfile } from "~/domain";
import { notifyPagesChanged } from "~/http-cache/notify.server";
import { type CellFigures, type CellReport, cellFigures } from "./cells";
import { type FitReport, type JobFit, jobPressureFit, modelAtJobSlope } from "./pressure";
import { shrinkProportions } from "./proportions";

const OUTCOMES = ["freed", "freed_with_help", "not_freed"] as const;
const SOURCES = ["measured_at_inlet", "read_at_regulator", "estimated"] as const;

interface CellArrays {
  m: number;
  rep: number[];
  out: number[];
  t: number[];
  p: number[];
  src: number[];
  above: boolean[];
  /** The line, for correcting regulator readings; the model's rated air use. */
  hid: (number | null)[];
  hlen: (number | null)[];
  cp: (CouplerProfile | null)[];
  cc: (number | null)[];
  lps: number;
}

/** Every accepted report of a job (or of one model on it), one row of arrays per model. */
async function reportArrays(db: Db, jobTypeId: number, modelId?: number): Promise<CellArrays[]> {
  // Each list comes as one comma-joined text (split natively below): several times faster to read
  // than PostgreSQL arrays, which node-pg parses character by character. NULL is written as "".
  const list = (e: RawBuilder<unknown>) => sql`array_to_string(array_agg(${e}), ',', '')`;
  const r = await sql<
    Record<"rep" | "out" | "t" | "p" | "src" | "above" | "hid" | "hlen" | "cp" | "cc", string> & {
      m: number;
      lps: number;
    }
  >`
    select tool_model_id m, ${list(sql`reporter_id`)} rep,
      ${list(sql`case outcome when 'freed' then 0 when 'freed_with_help' then 1 else 2 end`)} "out",
      ${list(sql`time_to_result_s::float8`)} t, ${list(sql`inlet_kpa::float8`)} p,
      ${list(sql`case inlet_source when 'measured_at_inlet' then 0 when 'read_at_regulator' then 1 else 2 end`)} src,
      ${list(sql`(flags @> array['above_rated_inlet'])::int`)} above,
      ${list(sql`hose_id_mm::float8`)} hid, ${list(sql`hose_length_m::float8`)} hlen, ${list(sql`coupler_profile`)} cp, ${list(sql`coupler_count`)} cc,
      (select rated_air_lps::float8 from tool_models where id = tool_model_id) lps
    from reports where job_type_id = ${jobTypeId} and status = 'accepted' ${modelId == null ? sql`` : sql`and tool_model_id = ${modelId}`}
    group by tool_model_id`.execute(db);
  const nums = (t: string) => t.split(",").map(Number);
  const orNull = (t: string) => t.split(",").map((v) => (v === "" ? null : Number(v)));
  return r.rows.map((row) => ({
    m: row.m,
    lps: row.lps,
    rep: nums(row.rep),
    out: nums(row.out),
    t: nums(row.t),
    p: nums(row.p),
    src: nums(row.src),
    above: row.above.split(",").map((v) => v === "1"),
    hid: orNull(row.hid),
    hlen: orNull(row.hlen),
    cp: row.cp.split(",").map((v) => (v === "" ? null : (v as CouplerProfile))),
    cc: orNull(row.cc),
  }));
}

function toReports(a: CellArrays): CellReport[] {
  return a.rep.map((reporterId, i) => ({
    reporterId,
    outcome: OUTCOMES[a.out[i]!]!,
    timeS: a.t[i]!,
    inletKpa: a.p[i]!,
    inletSource: SOURCES[a.src[i]!]!,
    aboveRated: a.above[i]!,
  }));
}

/**
 * The reports of a cell that enter the job's pressure fit: measured at the inlet as given; read at
 * the regulator, the pressure app/air predicts at the inlet for the reported hose and couplers at
 * the tool's rated air use (docs/decisions/010: on the demo data this does better than leaving them
 * out); estimated, set aside, or without the line: not at all.
 */
function fitReportsOf(a: Omit<CellArrays, "rep" | "t">): FitReport[] {
  const out: FitReport[] = [];
  for (let i = 0; i < a.p.length; i++) {
    if (a.above[i]) continue;
    if (a.src[i] === 0) out.push({ model: a.m, inletKpa: a.p[i]!, freed: a.out[i] === 0 });
    else if (
      a.src[i] === 1 &&
      a.hid[i] != null &&
      a.hlen[i] != null &&
      a.cp[i] != null &&
      a.cc[i] != null &&
      a.lps > 0
    ) {
      const at = operatingInletPressure(a.p[i]!, a.lps, {
        hoseIdMm: a.hid[i]!,
        hoseLengthM: a.hlen[i]!,
        couplerProfile: a.cp[i]!,
        couplerCount: a.cc[i]!,
      });
      if (!at.stalled) out.push({ model: a.m, inletKpa: at.inletKpa, freed: a.out[i] === 0 });
    }
  }
  return out;
}

function cellRow(modelId: number, jobTypeId: number, f: CellFigures, now: Date) {
  return {
    tool_model_id: modelId,
    job_type_id: jobTypeId,
    n: f.n,
    successes: f.successes,
    estimate: f.estimate,
    lower: f.lower,
    upper: f.upper,
    reporters: f.reporters,
    design_effect: f.designEffect,
    effective_n: f.effectiveN,
    set_aside: f.setAside,
    time_n: f.time?.n ?? 0,
    time_median_s: f.time?.median ?? null,
    time_lower_s: f.time?.lower ?? null,
    time_upper_s: f.time?.upper ?? null,
    time_coverage: f.time?.coverage ?? null,
    km_n: f.km?.n ?? 0,
    km_median_s: f.km?.median ?? null,
    km_lower_s: f.km?.lower ?? null,
    km_upper_s: f.km?.upper ?? null,
    km_steps: f.km ? JSON.stringify(f.km.steps) : null,
    measured_share: f.measuredShare,
    estimated_share: f.estimatedShare,
    computed_at: now,
  };
}

type Row = ReturnType<typeof cellRow>;

function withPressure(row: Row, fit: JobFit) {
  const m = fit.perModel.get(row.tool_model_id);
  return {
    ...row,
    adj_estimate: m?.adjusted?.estimate ?? null,
    adj_lower: m?.adjusted?.lower ?? null,
    adj_upper: m?.adjusted?.upper ?? null,
    adj_reason: m?.adjusted ? null : (m?.reason ?? fit.reason ?? "No pressure fit on this job."),
    fit: m?.fit ? JSON.stringify(m.fit) : null,
  };
}

async function upsertCells(db: Db, rows: (Row & Record<string, unknown>)[]) {
  if (rows.length === 0) return;
  const columns = Object.keys(rows[0]!).filter((c) => c !== "tool_model_id" && c !== "job_type_id");
  for (let i = 0; i < rows.length; i += 500) {
    await db
      .insertInto("stats_cells")
      .values(rows.slice(i, i + 500))
      .onConflict((oc) =>
        oc
          .columns(["tool_model_id", "job_type_id"])
          .doUpdateSet(Object.fromEntries(columns.map((c) => [c, sql.ref(`excluded.${c}`)]))),
      )
      .execute();
  }
}

async function storeJob(
  db: Db,
  jobTypeId: number,
  fit: JobFit,
  setAside: number,
  prior: { alpha: number; beta: number } | null,
  now: Date,
) {
  const values = {
    fit_n: fit.n,
    fit_models: fit.models,
    slope: fit.slope,
    slope_se: fit.slopeSE,
    converged: fit.converged,
    fit_reason: fit.reason,
    set_aside: setAside,
    prior_alpha: prior?.alpha ?? null,
    prior_beta: prior?.beta ?? null,
    computed_at: now,
  };
  await db
    .insertInto("stats_jobs")
    .values({ job_type_id: jobTypeId, ...values })
    .onConflict((oc) => oc.column("job_type_id").doUpdateSet(values))
    .execute();
}

/** Every cell of one job from one read of its reports. */
async function refreshJob(db: Db, jobTypeId: number) {
  const now = new Date();
  const arrays = await reportArrays(db, jobTypeId);
  const figures = arrays.map((a) => ({ m: a.m, f: cellFigures(toReports(a)) }));
  const setAside = figures.reduce((acc, { f }, i) => acc + (f ? f.setAside : arrays[i]!.rep.length), 0);
  const kept = figures.filter((x): x is { m: number; f: CellFigures } => x.f != null);
  const fit = jobPressureFit(
    arrays.flatMap(fitReportsOf),
    kept.map((x) => x.m),
  );
  let prior: { alpha: number; beta: number } | null = null;
  const rows = kept.map(({ m, f }) => withPressure(cellRow(m, jobTypeId, f, now), fit));
  let shrunk: { shrunk_estimate: number | null; shrunk_lower: number | null; shrunk_upper: number | null }[] = [];
  if (kept.length > 0) {
    const s = shrinkProportions(kept.map(({ f }) => ({ successes: f.successes, trials: f.n })));
    prior = { alpha: s.prior.alpha, beta: s.prior.beta };
    shrunk = s.groups.map((g) => ({ shrunk_estimate: g.estimate, shrunk_lower: g.lower, shrunk_upper: g.upper }));
  }
  await db
    .deleteFrom("stats_cells")
    .where("job_type_id", "=", jobTypeId)
    .where("tool_model_id", "not in", kept.length ? kept.map((x) => x.m) : [-1])
    .execute();
  await upsertCells(
    db,
    rows.map((r, i) => ({ ...r, ...shrunk[i]! })),
  );
  await storeJob(db, jobTypeId, fit, setAside, prior, now);
  return kept.length;
}

/** A job whose pooled fit is older than this is refitted whole on its next accept. */
export const JOB_REFIT_AFTER_MS = 60 * 60 * 1000;

/**
 * After an accept: that cell's figures, its shrunk rate from the job's stored prior, and its figure
 * at 90 psi from its own reports at the job's stored slope (modelAtJobSlope). The job is refitted
 * whole instead when it has no fit yet or its fit is over JOB_REFIT_AFTER_MS old — so the cost of an
 * accept is one cell's reports, not the job's (docs/decisions/010).
 */
export async function refreshCell(db: Db, modelId: number, jobTypeId: number) {
  await db.transaction().execute(async (trx) => {
    const job = await trx
      .selectFrom("stats_jobs")
      .select(["slope", "slope_se", "prior_alpha", "prior_beta", "computed_at"])
      .where("job_type_id", "=", jobTypeId)
      .forUpdate()
      .executeTakeFirst();
    const stale =
      !job ||
      job.slope == null ||
      job.slope_se == null ||
      job.prior_alpha == null ||
      job.prior_beta == null ||
      Date.now() - new Date(job.computed_at).getTime() > JOB_REFIT_AFTER_MS;
    if (stale) {
      await refreshJob(trx, jobTypeId);
      return;
    }
    const [mine, old] = await Promise.all([
      reportArrays(trx, jobTypeId, modelId),
      trx
        .selectFrom("stats_cells")
        .select("set_aside")
        .where("tool_model_id", "=", modelId)
        .where("job_type_id", "=", jobTypeId)
        .executeTakeFirst(),
    ]);
    const f = mine[0] ? cellFigures(toReports(mine[0])) : null;
    const setAsideNow = f ? f.setAside : (mine[0]?.rep.length ?? 0);
    if (!f)
      await trx
        .deleteFrom("stats_cells")
        .where("tool_model_id", "=", modelId)
        .where("job_type_id", "=", jobTypeId)
        .execute();
    else {
      const s = shrinkProportions([{ successes: f.successes, trials: f.n }], 0.95, {
        alpha: job.prior_alpha!,
        beta: job.prior_beta!,
      });
      const m = modelAtJobSlope(fitReportsOf(mine[0]!), { slope: job.slope!, sigma: 1 / job.slope_se! ** 2 });
      await upsertCells(trx, [
        {
          ...cellRow(modelId, jobTypeId, f, new Date()),
          adj_estimate: m.adjusted?.estimate ?? null,
          adj_lower: m.adjusted?.lower ?? null,
          adj_upper: m.adjusted?.upper ?? null,
          adj_reason: m.adjusted ? null : m.reason,
          fit: m.fit ? JSON.stringify(m.fit) : null,
          shrunk_estimate: s.groups[0]!.estimate,
          shrunk_lower: s.groups[0]!.lower,
          shrunk_upper: s.groups[0]!.upper,
        },
      ]);
    }
    const delta = setAsideNow - (old?.set_aside ?? 0);
    if (delta !== 0)
      await trx
        .updateTable("stats_jobs")
        .set((eb) => ({ set_aside: eb("set_aside", "+", delta) }))
        .where("job_type_id", "=", jobTypeId)
        .execute();
    await notifyPagesChanged(trx, "stats");
  });
}

/**
 * Every cell, recomputed from the accepted reports: one transaction per job type, up to
 * `concurrency` at once so one job's reading and writing overlaps another's arithmetic.
 */
export async function refreshAll(db: Db, { concurrency = 4 } = {}) {
  const jobs = await db.selectFrom("job_types").select("id").orderBy("id").execute();
  let cells = 0;
  let next = 0;
  const worker = async () => {
    while (next < jobs.length) {
      const job = jobs[next++]!;
      const stored = await db.transaction().execute((trx) => refreshJob(trx, job.id));
      cells += stored;
    }
  };
  await Promise.all(Array.from({ length: Math.min(concurrency, jobs.length) }, worker));
  await notifyPagesChanged(db, "stats");
  return cells;
}
