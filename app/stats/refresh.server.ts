// Keeps stats_cells and stats_jobs in step with accepted reports. An accept refreshes its own cell
// and its job's pooled pressure fit (every cell of the job gets its new figure at 90 psi); the
// job's shrinkage prior is kept from the last full refresh (docs/decisions/010). The full refresh
// recomputes everything from one read that tallies the reports per cell in SQL (counts, packed
// times, reporters and pressures; the table's two halves on two connections under one snapshot),
// then writes one statement per table (docs/decisions/010).
import { type RawBuilder, sql } from "kysely";
import type { Db, Trx } from "../../db/database";
import { operatingInletPressure } from "~/air/supply";
import type { CouplerProfile } from "~/domain";
import { notifyPagesChanged } from "~/http-cache/notify.server";
import { type CellFigures, type CellTally, cellFiguresOfTally } from "./cells";
import { type FitColumns, type JobFit, jobPressureFitOfColumns, modelAtJobSlope } from "./pressure";
import { type Group, shrinkProportions } from "./proportions";
import type { SurvivalTally } from "./survival";

/** One model's reports on one job, as the figures and the pressure fit need them. */
interface ModelTally {
  m: number;
  tally: CellTally;
  fit: FitColumns;
}

interface Scope {
  job?: number;
  model?: number;
}

const scoped = ({ job, model }: Scope) =>
  sql`${job == null ? sql`` : sql`and job_type_id = ${job}`} ${model == null ? sql`` : sql`and tool_model_id = ${model}`}`;

/** Packed values from one or more parts (one per share of the table), or none. */
type Packed = Buffer | Buffer[] | null;

const partsOf = (b: Packed): Buffer[] => (b == null ? [] : Array.isArray(b) ? b : [b]);

/** Values packed big-endian, `width` bytes each, from every part, in order, read back exactly. */
function unpack<T extends Float64Array | Int32Array>(
  b: Packed,
  width: number,
  make: (length: number) => T,
  read: (view: DataView, offset: number) => number,
): T {
  const parts = partsOf(b);
  const out = make(parts.reduce((acc, p) => acc + p.length / width, 0));
  let i = 0;
  for (const p of parts) {
    const view = new DataView(p.buffer, p.byteOffset, p.byteLength);
    for (let o = 0; o < p.length; o += width) out[i++] = read(view, o);
  }
  return out;
}

/** Doubles packed by float8send. */
const doubles = (b: Packed) =>
  unpack(
    b,
    8,
    (n) => new Float64Array(n),
    (v, o) => v.getFloat64(o),
  );
/** Reporter ids packed by int4send. */
const int32s = (b: Packed) =>
  unpack(
    b,
    4,
    (n) => new Int32Array(n),
    (v, o) => v.getInt32(o),
  );

/** A share of the table's pages, [from, to) (to null: to the end), for reads split across connections. */
type Pages = readonly [from: number, to: number | null];

interface CellRead {
  j: number;
  m: number;
  lps: number | null;
  aside: number;
  measured: number;
  estimated: number;
  tf: Packed;
  tc: Packed;
  rf: Packed;
  rc: Packed;
  ff: Packed;
  fl: Packed;
  lines: string | null;
}

/**
 * Every accepted report in scope, tallied in SQL, one row per cell: its counts, the times and
 * reporters of the counted reports freed and not freed, and the pressures its pressure fit needs
 * (inlet-measured ones by outcome; regulator readings with their line). Times, pressures and
 * reporters come packed (float8send, int4send): exact, and far cheaper on both sides than text or
 * PostgreSQL arrays (node-pg parses those character by character). `pages` limits the read to a
 * share of the table (a TID range scan), so the full refresh can read on two connections at once.
 */
function readCells(db: Db, scope: Scope, pages?: Pages) {
  const counted = (and: RawBuilder<unknown> = sql`true`) => sql`filter (where not aside and ${and})`;
  const packed = (send: "float8send" | "int4send", column: string, and?: RawBuilder<unknown>) =>
    sql`string_agg(${sql.raw(send)}(${sql.ref(column)}), ''::bytea) ${counted(and)}`;
  const measured = sql`inlet_source = 'measured_at_inlet'`;
  const share = pages
    ? sql`and ctid >= ${`(${pages[0]},0)`}::tid ${pages[1] == null ? sql`` : sql`and ctid < ${`(${pages[1]},0)`}::tid`}`
    : sql``;
  return sql<CellRead>`
    select job_type_id j, tool_model_id m, (select rated_air_lps::float8 from tool_models where id = tool_model_id) lps,
      count(*) filter (where aside)::int aside,
      count(*) ${counted(measured)}::int measured,
      count(*) ${counted(sql`inlet_source = 'estimated'`)}::int estimated,
      ${packed("float8send", "time_to_result_s", sql`freed`)} tf,
      ${packed("float8send", "time_to_result_s", sql`not freed`)} tc,
      ${packed("int4send", "reporter_id", sql`freed`)} rf,
      ${packed("int4send", "reporter_id", sql`not freed`)} rc,
      ${packed("float8send", "inlet_kpa", sql`freed and ${measured}`)} ff,
      ${packed("float8send", "inlet_kpa", sql`not freed and ${measured}`)} fl,
      string_agg(concat_ws(' ', inlet_kpa, hose_id_mm, hose_length_m, coupler_profile, coupler_count, freed::int), ';')
        ${counted(sql`inlet_source = 'read_at_regulator' and hose_id_mm is not null and hose_length_m is not null
          and coupler_profile is not null and coupler_count is not null`)} lines
    from (
      select job_type_id, tool_model_id, reporter_id, time_to_result_s, inlet_kpa, inlet_source, hose_id_mm, hose_length_m,
        coupler_profile, coupler_count, flags @> array['above_rated_inlet'] aside, outcome = 'freed' freed
      from reports where status = 'accepted' ${scoped(scope)} ${share}
      offset 0 -- each row's flags worked out once, not once per aggregate above
    ) r
    group by job_type_id, tool_model_id`
    .execute(db)
    .then((r) => r.rows);
}

/** One cell's rows from several shares of the table, as one. */
function mergeReads(parts: readonly CellRead[][]): CellRead[] {
  if (parts.length === 1) return parts[0]!;
  const byCell = new Map<string, CellRead[]>();
  for (const part of parts)
    for (const row of part) {
      const key = `${row.j}/${row.m}`;
      const list = byCell.get(key);
      if (list) list.push(row);
      else byCell.set(key, [row]);
    }
  const joinBytes = (rows: CellRead[], k: "tf" | "tc" | "rf" | "rc" | "ff" | "fl") =>
    rows.flatMap((r) => partsOf(r[k]));
  return [...byCell.values()].map((rows) =>
    rows.length === 1
      ? rows[0]!
      : {
          ...rows[0]!,
          aside: rows.reduce((a, r) => a + r.aside, 0),
          measured: rows.reduce((a, r) => a + r.measured, 0),
          estimated: rows.reduce((a, r) => a + r.estimated, 0),
          tf: joinBytes(rows, "tf"),
          tc: joinBytes(rows, "tc"),
          rf: joinBytes(rows, "rf"),
          rc: joinBytes(rows, "rc"),
          ff: joinBytes(rows, "ff"),
          fl: joinBytes(rows, "fl"),
          lines: rows.flatMap((r) => (r.lines ? [r.lines] : [])).join(";") || null,
        },
  );
}

/** One (reports, freed) pair per reporter of a cell, in reporter order. */
function clustersOf(freedBy: Int32Array, notFreedBy: Int32Array): Group[] {
  const byReporter = new Map<number, Group>();
  const add = (ids: Int32Array, freed: number) => {
    for (const id of ids) {
      const c = byReporter.get(id);
      if (c) {
        c.trials++;
        c.successes += freed;
      } else byReporter.set(id, { trials: 1, successes: freed });
    }
  };
  add(freedBy, 1);
  add(notFreedBy, 0);
  return [...byReporter.entries()].sort((a, b) => a[0] - b[0]).map(([, c]) => c);
}

/** A cell's times, freed (events) and not (censored), as one ascending tally. */
function survivalTally(freed: Float64Array, censored: Float64Array): SurvivalTally {
  freed.sort();
  censored.sort();
  const out: SurvivalTally = { times: [], events: [], censored: [] };
  let i = 0;
  let j = 0;
  while (i < freed.length || j < censored.length) {
    const t = j >= censored.length || (i < freed.length && freed[i]! <= censored[j]!) ? freed[i]! : censored[j]!;
    let d = 0;
    let c = 0;
    for (; i < freed.length && freed[i] === t; i++) d++;
    for (; j < censored.length && censored[j] === t; j++) c++;
    out.times.push(t);
    out.events.push(d);
    out.censored.push(c);
  }
  return out;
}

/**
 * Every cell in scope, tallied, by job type. `read` reads the cells (the full refresh splits the
 * table across two connections).
 */
async function readTallies(
  db: Db,
  scope: Scope,
  read: (scope: Scope) => Promise<CellRead[]> = (s) => readCells(db, s),
): Promise<Map<number, ModelTally[]>> {
  const cells = await read(scope);
  const byJob = new Map<number, ModelTally[]>();
  // The inlet pressure app/air predicts for one regulator reading and line, worked out once.
  const corrected = new Map<string, number | null>();
  for (const row of cells) {
    const freed = doubles(row.ff);
    const failed = doubles(row.fl);
    const regulator: { kpa: number; freed: number }[] = [];
    if (row.lines && row.lps != null && row.lps > 0) {
      for (const line of row.lines.split(";")) {
        const [p, hid, hlen, cp, cc, ok] = line.split(" ");
        const key = `${row.lps} ${line.slice(0, -2)}`;
        let at = corrected.get(key);
        if (at === undefined) {
          const point = operatingInletPressure(Number(p), row.lps, {
            hoseIdMm: Number(hid),
            hoseLengthM: Number(hlen),
            couplerProfile: cp as CouplerProfile,
            couplerCount: Number(cc),
          });
          at = point.stalled ? null : point.inletKpa;
          corrected.set(key, at);
        }
        if (at != null) regulator.push({ kpa: at, freed: ok === "1" ? 1 : 0 });
      }
    }
    const fit: FitColumns = {
      kpa: new Float64Array(freed.length + failed.length + regulator.length),
      freed: new Uint8Array(freed.length + failed.length + regulator.length),
    };
    fit.kpa.set(freed);
    fit.freed.fill(1, 0, freed.length);
    fit.kpa.set(failed, freed.length);
    regulator.forEach((r, i) => {
      fit.kpa[freed.length + failed.length + i] = r.kpa;
      fit.freed[freed.length + failed.length + i] = r.freed;
    });
    const tally: CellTally = {
      setAside: row.aside,
      measured: row.measured,
      estimated: row.estimated,
      clusters: clustersOf(int32s(row.rf), int32s(row.rc)),
      times: survivalTally(doubles(row.tf), doubles(row.tc)),
    };
    const list = byJob.get(row.j) ?? [];
    list.push({ m: row.m, tally, fit });
    byJob.set(row.j, list);
  }
  // In model order, whatever order the hash aggregate gave: the job's fits and prior then sum in
  // the same order on every refresh.
  for (const list of byJob.values()) list.sort((a, b) => a.m - b.m);
  return byJob;
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
    fit: m?.fit ?? null,
  };
}

type CellRow = ReturnType<typeof withPressure> & {
  shrunk_estimate: number | null;
  shrunk_lower: number | null;
  shrunk_upper: number | null;
};

/** The cells' column types that are not double precision, for the typed arrays below. */
const CELL_TYPES: Record<string, string> = {
  tool_model_id: "int4",
  job_type_id: "int4",
  n: "int4",
  successes: "int4",
  reporters: "int4",
  set_aside: "int4",
  time_n: "int4",
  km_n: "int4",
  adj_reason: "text",
  fit: "jsonb",
  computed_at: "timestamptz",
};

/**
 * Writes many cells in one statement: one typed array per column, unnested into rows, then one
 * INSERT … ON CONFLICT. Far less to send and parse than a JSON object per row (the column names
 * once, not once per row). node-pg writes each number as its shortest round-trip text, so every
 * stored figure is exact; a non-finite number is stored as null, as JSON would have it.
 */
async function upsertCells(db: Db, rows: CellRow[]) {
  if (rows.length === 0) return;
  const columns = Object.keys(rows[0]!) as (keyof CellRow)[];
  const key = ["tool_model_id", "job_type_id"];
  const arrays = columns.map((c) => {
    const type = CELL_TYPES[c] ?? "float8";
    const values = rows.map((r) => {
      const v = r[c];
      if (typeof v === "number") return Number.isFinite(v) ? v : null;
      if (type === "jsonb") return v == null ? null : JSON.stringify(v);
      return v ?? null;
    });
    return sql`${values}::${sql.raw(type)}[]`;
  });
  const list = sql.join(columns.map((c) => sql.ref(c)));
  const updates = sql.join(
    columns.filter((c) => !key.includes(c)).map((c) => sql`${sql.ref(c)} = excluded.${sql.ref(c)}`),
  );
  await sql`
    insert into stats_cells (${list})
    select * from unnest(${sql.join(arrays)})
    on conflict (tool_model_id, job_type_id) do update set ${updates}`.execute(db);
}

/**
 * Writes the jobs' rows (one per job type, a few dozen) in one statement: the rows go as one JSON
 * parameter that PostgreSQL turns into records of the table (json_populate_recordset).
 */
async function upsertJobs(db: Db, rows: Record<string, unknown>[]) {
  if (rows.length === 0) return;
  const columns = Object.keys(rows[0]!);
  const list = sql.join(columns.map((c) => sql.ref(c)));
  const updates = sql.join(
    columns.filter((c) => c !== "job_type_id").map((c) => sql`${sql.ref(c)} = excluded.${sql.ref(c)}`),
  );
  await sql`
    insert into stats_jobs (${list})
    select ${list} from json_populate_recordset(null::stats_jobs, ${JSON.stringify(rows)}::json)
    on conflict (job_type_id) do update set ${updates}`.execute(db);
}

interface JobResult {
  jobTypeId: number;
  rows: CellRow[];
  job: Record<string, unknown>;
}

/** Every cell of one job from its tallies: figures, the pooled pressure fit and the shrunk rates. */
function computeJob(jobTypeId: number, tallies: readonly ModelTally[], now: Date): JobResult {
  const figures = tallies.map((t) => ({ m: t.m, f: cellFiguresOfTally(t.tally) }));
  const setAside = tallies.reduce((acc, t) => acc + t.tally.setAside, 0);
  const kept = figures.filter((x): x is { m: number; f: CellFigures } => x.f != null);
  const fit = jobPressureFitOfColumns(
    new Map(tallies.map((t) => [t.m, t.fit])),
    kept.map((x) => x.m),
  );
  let prior: { alpha: number; beta: number } | null = null;
  let shrunk: Pick<CellRow, "shrunk_estimate" | "shrunk_lower" | "shrunk_upper">[] = [];
  if (kept.length > 0) {
    const s = shrinkProportions(kept.map(({ f }) => ({ successes: f.successes, trials: f.n })));
    prior = { alpha: s.prior.alpha, beta: s.prior.beta };
    shrunk = s.groups.map((g) => ({ shrunk_estimate: g.estimate, shrunk_lower: g.lower, shrunk_upper: g.upper }));
  }
  return {
    jobTypeId,
    rows: kept.map(({ m, f }, i) => ({ ...withPressure(cellRow(m, jobTypeId, f, now), fit), ...shrunk[i]! })),
    job: {
      job_type_id: jobTypeId,
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
    },
  };
}

/**
 * Stores computed jobs: their cells (one statement), then the cells in scope that were not
 * rewritten now (no counted reports left) deleted, and each job's row.
 */
async function storeJobs(trx: Trx, results: readonly JobResult[], scope: Scope, now: Date) {
  const rows = results.flatMap((r) => r.rows);
  for (let i = 0; i < rows.length; i += 5000) await upsertCells(trx, rows.slice(i, i + 5000));
  await deleteUnwritten(trx, scope, now);
  await upsertJobs(
    trx,
    results.map((r) => r.job),
  );
}

/** Every cell written by a refresh carries its time; any other in its scope has no counted reports left. */
const deleteUnwritten = (trx: Trx, scope: Scope, now: Date) =>
  trx
    .deleteFrom("stats_cells")
    .where("computed_at", "<>", now)
    .$if(scope.job != null, (q) => q.where("job_type_id", "=", scope.job!))
    .execute();

/** Every cell of one job from one read of its reports. */
async function refreshJob(trx: Trx, jobTypeId: number) {
  const tallies = await readTallies(trx, { job: jobTypeId });
  const now = new Date();
  const result = computeJob(jobTypeId, tallies.get(jobTypeId) ?? [], now);
  await storeJobs(trx, [result], { job: jobTypeId }, now);
  return result.rows.length;
}

/**
 * The Kaplan–Meier steps of a few cells of one job, from their reports as they are now: only
 * /compare draws the curves, for two to four tools, so they are not stored with every cell.
 */
export async function survivalSteps(db: Db, jobTypeId: number, modelIds: readonly number[]) {
  const out = new Map<number, { time: number; survival: number }[]>();
  await Promise.all(
    modelIds.map(async (model) => {
      const mine = (await readTallies(db, { job: jobTypeId, model })).get(jobTypeId)?.[0];
      const km = mine ? cellFiguresOfTally(mine.tally)?.km : null;
      if (km) out.set(model, km.steps);
    }),
  );
  return out;
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
    const mine = (await readTallies(trx, { job: jobTypeId, model: modelId })).get(jobTypeId)?.[0];
    const old = await trx
      .selectFrom("stats_cells")
      .select("set_aside")
      .where("tool_model_id", "=", modelId)
      .where("job_type_id", "=", jobTypeId)
      .executeTakeFirst();
    const f = mine ? cellFiguresOfTally(mine.tally) : null;
    const setAsideNow = mine?.tally.setAside ?? 0;
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
      const reports = Array.from(mine!.fit.kpa, (inletKpa, i) => ({
        model: modelId,
        inletKpa,
        freed: mine!.fit.freed[i] === 1,
      }));
      const m = modelAtJobSlope(reports, { slope: job.slope!, sigma: 1 / job.slope_se! ** 2 });
      await upsertCells(trx, [
        {
          ...cellRow(modelId, jobTypeId, f, new Date()),
          adj_estimate: m.adjusted?.estimate ?? null,
          adj_lower: m.adjusted?.lower ?? null,
          adj_upper: m.adjusted?.upper ?? null,
          adj_reason: m.adjusted ? null : m.reason,
          fit: m.fit,
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
 * The full refresh's read: the table's pages in two shares, read side by side on two connections
 * under one snapshot (the first exports it, the second imports it), each hashing its cells in memory;
 * the shares' rows of a cell are then joined.
 */
async function readAllCells(db: Db): Promise<CellRead[]> {
  const { pages } = (
    await sql<{ pages: number }>`
      select (pg_relation_size('reports') / current_setting('block_size')::int)::int pages`.execute(db)
  ).rows[0]!;
  const half = Math.ceil(pages / 2);
  let shareSnapshot!: (id: string) => void;
  let noSnapshot!: (e: unknown) => void;
  let snapshotTaken!: () => void;
  const snapshot = new Promise<string>((resolve, reject) => ((shareSnapshot = resolve), (noSnapshot = reject)));
  snapshot.catch(() => {}); // the first share's own failure is what the refresh reports
  const taken = new Promise<void>((resolve) => (snapshotTaken = resolve));
  // Hash aggregation over every cell wants more than the default work_mem, and the planner, not
  // knowing how large the packed arrays grow, still prefers to sort every report by cell (twice
  // the time at a million reports): so more memory, and no sort, for these reads only.
  const roomy = async (trx: Trx) => {
    await sql`set local work_mem = '256MB'`.execute(trx);
    await sql`set local enable_sort = off`.execute(trx);
  };
  const first = db
    .transaction()
    .setIsolationLevel("repeatable read")
    .execute(async (trx) => {
      try {
        shareSnapshot((await sql<{ id: string }>`select pg_export_snapshot() id`.execute(trx)).rows[0]!.id);
      } catch (e) {
        noSnapshot(e);
        throw e;
      }
      await roomy(trx);
      const rows = await readCells(trx, {}, [0, half]);
      await taken; // the snapshot lives as long as this transaction: kept until the second has it
      return rows;
    });
  const second = db
    .transaction()
    .setIsolationLevel("repeatable read")
    .execute(async (trx) => {
      try {
        await sql`set transaction snapshot ${sql.lit(await snapshot)}`.execute(trx);
      } finally {
        snapshotTaken();
      }
      await roomy(trx);
      return readCells(trx, {}, [half, null]);
    });
  return mergeReads(await Promise.all([first, second]));
}

/** Every job type, and every cell's tally by job type; `split`: the table read in two shares at once. */
const readAll = (db: Db, split: boolean) =>
  Promise.all([
    db.selectFrom("job_types").select("id").orderBy("id").execute(),
    readTallies(db, {}, split ? () => readAllCells(db) : undefined),
  ]);

/**
 * Every cell's row as the full refresh would store it, not stored: for checks that the table read
 * in two shares gives what one read of it gives.
 */
export async function computeAllCells(db: Db, { split = true } = {}) {
  const now = new Date();
  const [jobs, tallies] = await readAll(db, split);
  return jobs.flatMap((j) => computeJob(j.id, tallies.get(j.id) ?? [], now).rows);
}

/** Jobs computed per write of the full refresh (each write overlaps the next batch's computing). */
const JOBS_PER_WRITE = 8;

/**
 * Every cell, recomputed from the accepted reports. One read tallies every report at once (split
 * across two connections); JavaScript then works per cell and per job (the pooled fit reads its
 * reports' pressures), and one transaction writes it all: the cells a batch of jobs at a time,
 * each batch written while the next is computed (PostgreSQL inserts on one core while JavaScript
 * works on the other), then the cells no longer backed by reports removed and the jobs' rows.
 */
export async function refreshAll(db: Db) {
  const now = new Date();
  const [jobs, tallies] = await readAll(db, true);
  let cells = 0;
  await db.transaction().execute(async (trx) => {
    const jobRows: JobResult["job"][] = [];
    let writing: Promise<void> = Promise.resolve();
    for (let i = 0; i < jobs.length; i += JOBS_PER_WRITE) {
      const batch = jobs.slice(i, i + JOBS_PER_WRITE).map((j) => computeJob(j.id, tallies.get(j.id) ?? [], now));
      await writing;
      const rows = batch.flatMap((r) => r.rows);
      cells += rows.length;
      jobRows.push(...batch.map((r) => r.job));
      writing = upsertCells(trx, rows);
    }
    await writing;
    await deleteUnwritten(trx, {}, now);
    await upsertJobs(trx, jobRows);
  });
  await notifyPagesChanged(db, "stats");
  return cells;
}
