// The feed's bench reads: accepted runs with their series and trials, rigs, protocol versions and the
// stored figures across rigs, each as a record of app/feed/bench-fields.ts. Only accepted runs are
// read; rigs and protocols carry what their public pages show. The data are small (tens of runs per
// model), so records are put together here rather than by PostgreSQL as the report lines are.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { seriesFigures } from "~/bench/figures";
import { peakSummary } from "~/bench/peaks";
import { protocolSeries } from "~/bench/protocols.server";
import { listRigs } from "~/bench/rigs.server";
import { trialsOfRuns } from "~/bench/runs.server";
import { groupBy } from "~/utils/group";
import { BENCH_UNITS } from "./bench-fields";
import { feedError } from "./http.server";
import { fromMicros, iso, resolveSlugs, SETTLE } from "./queries.server";

const day = (column: string) => sql<string>`to_char(${sql.ref(column)}, 'YYYY-MM-DD')`;
/** The confidence level of every bench interval (as on the run pages). */
const CONFIDENCE = 0.95;

export interface BenchRunFilters {
  modelId?: number;
  rigId?: number;
  protocol?: string;
}

/** The filters' rows, once known to exist; a slug or rig that names nothing is a 400 naming its parameter. */
export async function resolveBenchFilters(
  db: Db,
  f: { model?: string; rig?: number; protocol?: string },
): Promise<BenchRunFilters> {
  const { modelId } = await resolveSlugs(db, { model: f.model });
  if (f.rig !== undefined) {
    const rig = await db.selectFrom("rigs").select("id").where("id", "=", f.rig).executeTakeFirst();
    if (!rig) throw feedError(400, "unknown_value", `"rig": no rig has the number ${f.rig} (see /api/v1/rigs).`, "rig");
  }
  if (f.protocol !== undefined) {
    const p = await db.selectFrom("bench_protocols").select("id").where("slug", "=", f.protocol).executeTakeFirst();
    if (!p)
      throw feedError(
        400,
        "unknown_value",
        `"protocol": no protocol has the slug "${f.protocol}" (see /api/v1/bench-protocols).`,
        "protocol",
      );
  }
  return { modelId, rigId: f.rig, protocol: f.protocol };
}

function acceptedRuns(db: Db) {
  return db
    .selectFrom("bench_runs as br")
    .innerJoin("tool_models as m", "m.id", "br.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("tool_categories as c", "c.id", "m.category_id")
    .innerJoin("bench_protocols as p", "p.id", "br.protocol_id")
    .innerJoin("users as u", "u.id", "br.filed_by")
    .select([
      "br.id",
      iso(sql`br.accepted_at`)
        .$castTo<string>()
        .as("accepted_at"),
      sql<string>`(extract(epoch from br.accepted_at) * 1000000)::bigint::text`.as("cursor_micros"),
      "br.version",
      "m.slug as model",
      "mk.slug as maker",
      "c.slug as category",
      "br.rig_id as rig",
      "p.slug as protocol",
      "p.version as protocol_version",
      "p.quantity",
      "br.unit_serial",
      "br.unit_condition",
      "br.unit_hours",
      day("br.run_on").as("run_on"),
      "u.feed_pseudonym as operator",
      "br.ambient_c",
      "br.flags",
    ])
    .where("br.status", "=", "accepted");
}

type RunRow = Awaited<ReturnType<ReturnType<typeof acceptedRuns>["execute"]>>[number];

const mean = (xs: number[]) => xs.reduce((a, v) => a + v, 0) / xs.length;

/** The runs' records, series and trials read in two queries for all of them, in the order given. */
async function runRecords(db: Db, origin: string, runs: RunRow[]) {
  if (runs.length === 0) return [];
  const ids = runs.map((r) => r.id);
  const [series, trials] = await Promise.all([
    db
      .selectFrom("bench_run_series as rs")
      .innerJoin("bench_protocol_series as ps", "ps.id", "rs.series_id")
      .select([
        "rs.id",
        "rs.run_id",
        "rs.series_id",
        "ps.position",
        "ps.label",
        "ps.trigger",
        "ps.inlet",
        "ps.inlet_kpa",
        "rs.static_inlet_kpa",
        "rs.running_inlet_kpa",
      ])
      .where("rs.run_id", "in", ids)
      .orderBy("rs.run_id")
      .orderBy("ps.position")
      .execute(),
    trialsOfRuns(db, ids),
  ]);
  const trialsOf = groupBy(trials, (t) => t.run_series_id);
  const seriesOf = groupBy(series, (s) => s.run_id);
  return runs.map((r) => ({
    id: r.id,
    accepted_at: r.accepted_at,
    version: r.version,
    model: r.model,
    maker: r.maker,
    category: r.category,
    rig: r.rig,
    protocol: r.protocol,
    protocol_version: r.protocol_version,
    quantity: r.quantity,
    value_unit: BENCH_UNITS[r.quantity],
    unit_serial: r.unit_serial,
    unit_condition: r.unit_condition,
    unit_hours: r.unit_hours,
    run_on: r.run_on,
    operator: r.operator,
    ambient_c: r.ambient_c,
    check_standard_in_control: !r.flags.includes("check_standard_out_of_control"),
    series: (seriesOf.get(r.id) ?? []).map((s) => {
      const ts = (trialsOf.get(s.id) ?? []).map((t) => ({ ...t, peaks: t.peaks.map(Number) }));
      const figures = seriesFigures(
        ts.map((t) => t.peaks),
        CONFIDENCE,
      );
      return {
        series: s.series_id,
        position: s.position,
        label: s.label,
        trigger: s.trigger,
        inlet: s.inlet,
        inlet_kpa: s.inlet_kpa,
        static_inlet_kpa: s.static_inlet_kpa,
        running_inlet_kpa: s.running_inlet_kpa,
        mean: figures.mean,
        lower: figures.lower,
        upper: figures.upper,
        trials: ts.map((t) => {
          const spread = peakSummary(t.peaks);
          return {
            trial: t.trial_number,
            source: t.trace_key ? ("trace" as const) : ("typed" as const),
            blows: t.peaks.length,
            peaks: t.peaks,
            mean_peak: mean(t.peaks),
            median_peak: spread.median,
            p10_peak: spread.p10,
            p90_peak: spread.p90,
            blows_per_minute: t.blows_per_minute,
            trace_rate_hz: t.rate_hz,
            trace_url: t.trace_key ? `${origin}/api/v1/bench-traces/${t.id}` : null,
          };
        }),
      };
    }),
  }));
}

export type BenchRunRecord = Awaited<ReturnType<typeof runRecords>>[number];

/** The horizon of a new walk: the newest accepted time that has settled, in microseconds (as for reports). */
export async function benchHorizon(db: Db): Promise<string> {
  const r = await sql<{ micros: string }>`
    select (extract(epoch from coalesce(
      (select max(accepted_at) from bench_runs where status = 'accepted' and accepted_at <= now() - ${SETTLE}::interval),
      now() - ${SETTLE}::interval)) * 1000000)::bigint::text as micros`.execute(db);
  return r.rows[0]!.micros;
}

/** A page of accepted runs in (accepted_at, id) order, up to the walk's horizon. */
export async function benchRunPage(
  db: Db,
  origin: string,
  f: BenchRunFilters,
  limit: number,
  asOfMicros: string,
  after?: { micros: string; id: number },
) {
  const rows = await acceptedRuns(db)
    .$if(f.modelId !== undefined, (q) => q.where("br.tool_model_id", "=", f.modelId!))
    .$if(f.rigId !== undefined, (q) => q.where("br.rig_id", "=", f.rigId!))
    .$if(f.protocol !== undefined, (q) => q.where("p.slug", "=", f.protocol!))
    .where(sql<boolean>`br.accepted_at <= ${fromMicros(asOfMicros)}`)
    .$if(!!after, (q) => q.where(sql<boolean>`(br.accepted_at, br.id) > (${fromMicros(after!.micros)}, ${after!.id})`))
    .orderBy("br.accepted_at")
    .orderBy("br.id")
    .limit(limit + 1)
    .execute();
  const page = rows.slice(0, limit);
  const last = page.at(-1);
  return {
    records: await runRecords(db, origin, page),
    next: rows.length > limit && last ? { micros: last.cursor_micros, id: last.id } : null,
  };
}

/** One accepted run; null for any other state and for no run. */
export async function benchRunById(db: Db, origin: string, id: number) {
  const row = await acceptedRuns(db).where("br.id", "=", id).executeTakeFirst();
  return row ? (await runRecords(db, origin, [row]))[0]! : null;
}

/** Every accepted run, in feed order (the bulk files). */
export async function allBenchRuns(db: Db, origin: string) {
  return runRecords(db, origin, await acceptedRuns(db).orderBy("br.accepted_at").orderBy("br.id").execute());
}

/** A run as the CSV's rows: one per trial, its run's and series' columns repeated (BENCH_TRIAL_ROW_FIELDS). */
export function trialRows({ id, series, ...run }: BenchRunRecord) {
  return series.flatMap(({ trials, series: seriesId, ...s }) =>
    trials.map((t) => ({
      run: id,
      ...run,
      series: seriesId,
      ...Object.fromEntries(Object.entries(s).map(([k, v]) => [`series_${k}`, v])),
      ...t,
    })),
  );
}

/** Every rig with its calibration standing as the bench pages show it (as of `now`), by id. */
export async function rigRecords(db: Db, now = new Date()) {
  const rigs = await listRigs(db, now);
  const calibrationIds = rigs.flatMap((r) => (r.calibration_id == null ? [] : [r.calibration_id]));
  const [extra, calibrations] = await Promise.all([
    db
      .selectFrom("rigs as r")
      .innerJoin("users as u", "u.id", "r.owner_id")
      .leftJoin("tool_models as cm", "cm.id", "r.check_tool_model_id")
      .select(["r.id", "u.feed_pseudonym as owner", "cm.slug as check_model"])
      .select((eb) =>
        eb
          .selectFrom("bench_runs as br")
          .whereRef("br.rig_id", "=", "r.id")
          .where("br.status", "=", "accepted")
          .select(sql<number>`count(*)::int`.as("n"))
          .as("accepted_runs"),
      )
      .execute(),
    calibrationIds.length
      ? db
          .selectFrom("rig_calibrations")
          .select([
            "id",
            "degree",
            "coefficients",
            "residual_sd",
            "r_squared",
            sql<number>`jsonb_array_length(points)`.as("points"),
          ])
          .where("id", "in", calibrationIds)
          .execute()
      : Promise.resolve([]),
  ]);
  const extraOf = new Map(extra.map((e) => [e.id, e]));
  const calibrationOf = new Map(calibrations.map((c) => [c.id, c]));
  const isoDay = (d: Date | null) => (d ? d.toISOString().slice(0, 10) : null);
  return rigs
    .map((r) => {
      const e = extraOf.get(r.id)!;
      const c = r.calibration_id == null ? undefined : calibrationOf.get(r.calibration_id);
      const s = r.standing;
      return {
        id: r.id,
        name: r.name,
        kind: r.kind,
        sensor_kind: r.sensor_kind,
        value_unit: BENCH_UNITS[r.kind === "percussive_force" ? "peak_force_n" : "peak_torque_nm"],
        sensor_capacity: r.sensor_capacity,
        sample_rate_hz: r.sample_rate_hz,
        fixture: r.fixture,
        shop_name: r.shop_name,
        shop_city: r.shop_city,
        owner: e.owner,
        calibration_status: s.status,
        calibration_max_age_months: r.check_interval_months,
        calibration:
          c && s.calibratedOn
            ? {
                calibrated_on: s.calibratedOn,
                verified: s.verifiedAt !== null,
                expires_on: isoDay(s.expiresOn)!,
                degree: c.degree,
                coefficients: c.coefficients.map(Number),
                residual_sd: c.residual_sd,
                r_squared: c.r_squared,
                points: c.points,
              }
            : null,
        check_model: e.check_model,
        last_check_on: s.lastCheckOn,
        last_check_in_control: s.lastCheckInControl,
        accepted_runs: e.accepted_runs ?? 0,
      };
    })
    .sort((a, b) => a.id - b.id);
}

/** Every protocol version, by slug and version, with its series and its accepted runs. */
export async function benchProtocolRecords(db: Db) {
  const protocols = await db
    .selectFrom("bench_protocols as p")
    .innerJoin("tool_categories as c", "c.id", "p.category_id")
    .select([
      "p.id",
      "p.slug",
      "p.version",
      "p.title",
      "c.slug as category",
      "p.quantity",
      "p.trials_per_series",
      "p.blows_per_trial",
      "p.seconds_per_trial",
      "p.blows_discarded",
      "p.attachment",
      "p.warm_up",
      "p.oiling",
      "p.summary",
      iso(sql`p.frozen_at`)
        .$castTo<string | null>()
        .as("frozen_at"),
    ])
    .select((eb) =>
      eb
        .selectFrom("bench_runs as br")
        .whereRef("br.protocol_id", "=", "p.id")
        .where("br.status", "=", "accepted")
        .select(sql<number>`count(*)::int`.as("n"))
        .as("accepted_runs"),
    )
    .orderBy("p.slug")
    .orderBy("p.version")
    .execute();
  const series = await protocolSeries(
    db,
    protocols.map((p) => p.id),
  );
  const seriesOf = groupBy(series, (s) => s.protocol_id);
  return protocols.map(({ id, frozen_at, accepted_runs, ...p }) => ({
    slug: p.slug,
    version: p.version,
    title: p.title,
    category: p.category,
    quantity: p.quantity,
    value_unit: BENCH_UNITS[p.quantity],
    trials_per_series: p.trials_per_series,
    blows_per_trial: p.blows_per_trial,
    seconds_per_trial: p.seconds_per_trial,
    blows_discarded: p.blows_discarded,
    attachment: p.attachment,
    warm_up: p.warm_up,
    oiling: p.oiling,
    summary: p.summary,
    frozen: frozen_at !== null,
    frozen_at,
    accepted_runs: accepted_runs ?? 0,
    series: (seriesOf.get(id) ?? []).map((s) => ({
      id: s.id,
      position: s.position,
      label: s.label,
      trigger: s.trigger,
      inlet: s.inlet,
      inlet_kpa: s.inlet_kpa,
      hose_length_m: s.hose_length_m,
      hose_id_mm: s.hose_id_mm,
      coupler_count: s.coupler_count,
      coupler_profile: s.coupler_profile,
    })),
  }));
}

export interface BenchFigureFilters {
  modelId?: number;
  protocol?: string;
  series?: number;
}

/** The stored figures across rigs, each force figure of a full-trigger series with the model's pressure line. */
export async function benchFigureRecords(db: Db, f: BenchFigureFilters) {
  const rows = await db
    .selectFrom("bench_pooled_figures as f")
    .innerJoin("tool_models as m", "m.id", "f.tool_model_id")
    .innerJoin("bench_protocols as p", "p.id", "f.protocol_id")
    .innerJoin("bench_protocol_series as s", "s.id", "f.series_id")
    .leftJoin("bench_pressure_slopes as ps", (join) =>
      join.onRef("ps.tool_model_id", "=", "f.tool_model_id").onRef("ps.protocol_id", "=", "f.protocol_id"),
    )
    .select([
      "m.slug as model",
      "p.slug as protocol",
      "p.version as protocol_version",
      "f.series_id as series",
      "s.label as series_label",
      "s.position",
      "s.trigger",
      "s.inlet",
      "s.inlet_kpa",
      "f.figure",
      "p.quantity",
      "f.estimate",
      "f.lower",
      "f.upper",
      "f.standard_error",
      "f.tau2",
      "f.i2",
      "f.prediction_lower",
      "f.prediction_upper",
      "f.method",
      "f.confidence",
      "f.runs",
      "f.rigs",
      iso(sql`f.computed_at`)
        .$castTo<string>()
        .as("computed_at"),
      "ps.slope",
      "ps.slope_lower",
      "ps.slope_upper",
      "ps.intercept",
      "ps.at_kpa",
      "ps.predicted",
      "ps.predicted_lower",
      "ps.predicted_upper",
      "ps.residual_sd",
      "ps.n",
      "ps.confidence as slope_confidence",
    ])
    .$if(f.modelId !== undefined, (q) => q.where("f.tool_model_id", "=", f.modelId!))
    .$if(f.protocol !== undefined, (q) => q.where("p.slug", "=", f.protocol!))
    .$if(f.series !== undefined, (q) => q.where("f.series_id", "=", f.series!))
    .orderBy("m.slug")
    .orderBy("p.slug")
    .orderBy("p.version")
    .orderBy("s.position")
    .orderBy("f.figure")
    .execute();
  return rows.map((r) => ({
    model: r.model,
    protocol: r.protocol,
    protocol_version: r.protocol_version,
    series: r.series,
    series_label: r.series_label,
    trigger: r.trigger,
    inlet: r.inlet,
    inlet_kpa: r.inlet_kpa,
    figure: r.figure,
    quantity: r.quantity,
    value_unit: BENCH_UNITS[r.quantity],
    estimate: r.estimate,
    lower: r.lower,
    upper: r.upper,
    standard_error: r.standard_error,
    tau2: r.tau2,
    i2: r.i2,
    prediction_lower: r.prediction_lower,
    prediction_upper: r.prediction_upper,
    method: r.method,
    confidence: r.confidence,
    runs: r.runs,
    rigs: r.rigs,
    computed_at: r.computed_at,
    pressure_slope:
      r.figure === "force" && r.trigger === "full" && r.slope !== null
        ? {
            slope: r.slope,
            slope_lower: r.slope_lower!,
            slope_upper: r.slope_upper!,
            intercept: r.intercept!,
            at_kpa: r.at_kpa!,
            predicted: r.predicted!,
            predicted_lower: r.predicted_lower!,
            predicted_upper: r.predicted_upper!,
            residual_sd: r.residual_sd!,
            n: r.n!,
            confidence: r.slope_confidence!,
          }
        : null,
  }));
}

/** A published trace: the storage key of a traced trial of an accepted run; null otherwise. */
export async function publishedTraceKey(db: Db, trialId: number) {
  const row = await db
    .selectFrom("bench_trials as t")
    .innerJoin("bench_run_series as rs", "rs.id", "t.run_series_id")
    .innerJoin("bench_runs as br", "br.id", "rs.run_id")
    .select("t.trace_key")
    .where("t.id", "=", trialId)
    .where("br.status", "=", "accepted")
    .where("t.trace_key", "is not", null)
    .executeTakeFirst();
  return row?.trace_key ?? null;
}
