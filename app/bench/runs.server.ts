// Bench run reads: the latest accepted runs, one run with its series and trials, a model's runs, and
// the figures of a run (trial means with their interval, blow spread, blow rate, trigger control range).
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { toolName } from "../domain";
import { blowRateAgreement, meanInterval, seriesFigures, triggerControlRange } from "./index";

const day = (column: string) => sql<string>`to_char(${sql.ref(column)}, 'YYYY-MM-DD')`;
/** The confidence level of every bench interval. */
export const BENCH_CONFIDENCE = 0.95;

function runsBase(db: Db) {
  return db
    .selectFrom("bench_runs as br")
    .innerJoin("rigs as r", "r.id", "br.rig_id")
    .innerJoin("bench_protocols as p", "p.id", "br.protocol_id")
    .innerJoin("tool_models as m", "m.id", "br.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .select([
      "br.id",
      "br.status",
      "br.version",
      "br.rig_id",
      "br.protocol_id",
      "br.tool_model_id",
      "br.filed_by",
      "br.unit_serial",
      "br.unit_condition",
      "br.unit_hours",
      day("br.run_on").as("run_on"),
      "br.operator",
      "br.ambient_c",
      "br.video_key",
      "br.notes",
      "br.flags",
      "br.submitted_at",
      "br.accepted_at",
      "r.name as rig_name",
      "r.sensor_capacity",
      "p.slug as protocol_slug",
      "p.version as protocol_version",
      "p.title as protocol_title",
      "p.quantity",
      "m.slug as model_slug",
      "m.model_code",
      "m.blows_per_minute as stated_bpm",
      "mk.name as maker_name",
    ]);
}

/** Each run's headline: the mean of its first full-trigger series' trial means. */
function headline() {
  return sql<number | null>`(
    select avg(tm.mean) from bench_run_series rs
    join bench_protocol_series ps on ps.id = rs.series_id
    join lateral (
      select (select avg(x) from unnest(t.peaks) x) as mean from bench_trials t where t.run_series_id = rs.id
    ) tm on true
    where rs.run_id = br.id and ps.position = (
      select min(ps2.position) from bench_protocol_series ps2
      where ps2.protocol_id = br.protocol_id and ps2.trigger = 'full'
    )
  )`;
}

const withName = <T extends { maker_name: string; model_code: string }>(row: T) => ({
  ...row,
  tool: toolName(row.maker_name, row.model_code),
});

/** The newest accepted runs, newest first, with the full-trigger headline figure. */
export async function latestAcceptedRuns(db: Db, limit = 12) {
  const rows = await runsBase(db)
    .select(headline().as("full_trigger_mean"))
    .where("br.status", "=", "accepted")
    .orderBy("br.accepted_at", "desc")
    .orderBy("br.id", "desc")
    .limit(limit)
    .execute();
  return rows.map(withName);
}

export type RunListItem = Awaited<ReturnType<typeof latestAcceptedRuns>>[number];

/** A model's accepted runs, newest first. */
export async function runsForModel(db: Db, modelId: number) {
  const rows = await runsBase(db)
    .select(headline().as("full_trigger_mean"))
    .where("br.status", "=", "accepted")
    .where("br.tool_model_id", "=", modelId)
    .orderBy("br.run_on", "desc")
    .orderBy("br.id", "desc")
    .execute();
  return rows.map(withName);
}

/** A rig's runs in every state but draft, newest first (the rig page lists them). */
export async function runsOnRig(db: Db, rigId: number) {
  const rows = await runsBase(db)
    .select(headline().as("full_trigger_mean"))
    .where("br.rig_id", "=", rigId)
    .where("br.status", "=", "accepted")
    .orderBy("br.run_on", "desc")
    .execute();
  return rows.map(withName);
}

/** The trials of the runs' series, by series and trial number (the run page and the feed read them so). */
export function trialsOfRuns(db: Db, runIds: readonly number[]) {
  return db
    .selectFrom("bench_trials as t")
    .innerJoin("bench_run_series as rs", "rs.id", "t.run_series_id")
    .select(["t.id", "t.run_series_id", "t.trial_number", "t.peaks", "t.trace_key", "t.rate_hz", "t.blows_per_minute"])
    .where("rs.run_id", "in", runIds)
    .orderBy("t.run_series_id")
    .orderBy("t.trial_number")
    .execute();
}

/** One run with its series (in the protocol's order) and each series' trials; null when there is none. */
export async function getRun(db: Db, id: number) {
  const run = await runsBase(db).where("br.id", "=", id).executeTakeFirst();
  if (!run) return null;
  const [series, trials] = await Promise.all([
    db
      .selectFrom("bench_run_series as rs")
      .innerJoin("bench_protocol_series as ps", "ps.id", "rs.series_id")
      .select([
        "rs.id",
        "rs.series_id",
        "rs.static_inlet_kpa",
        "rs.running_inlet_kpa",
        "ps.position",
        "ps.label",
        "ps.trigger",
        "ps.inlet",
        "ps.inlet_kpa",
        "ps.hose_length_m",
        "ps.hose_id_mm",
        "ps.coupler_count",
        "ps.coupler_profile",
      ])
      .where("rs.run_id", "=", id)
      .orderBy("ps.position")
      .execute(),
    trialsOfRuns(db, [id]),
  ]);
  return {
    run: withName(run),
    series: series.map((s) => ({ ...s, trials: trials.filter((t) => t.run_series_id === s.id) })),
  };
}

export type RunDetail = NonNullable<Awaited<ReturnType<typeof getRun>>>;

/** The figures of each series and of the run: the trial is the unit of replication, not the blow. */
export function runFigures(detail: RunDetail) {
  const series = detail.series.map((s) => {
    const trials = s.trials.map((t) => t.peaks);
    const figures = trials.length > 0 ? seriesFigures(trials) : null;
    const rates = s.trials.flatMap((t) => (t.blows_per_minute == null ? [] : [t.blows_per_minute]));
    const rate = rates.length ? meanInterval(rates, BENCH_CONFIDENCE) : null;
    return {
      id: s.id,
      label: s.label,
      trigger: s.trigger,
      figures,
      measuredBpm: rate?.mean ?? null,
      rateAgreement: rate && detail.run.stated_bpm != null ? blowRateAgreement(rate.mean, detail.run.stated_bpm) : null,
    };
  });
  const full = series.find((s) => s.trigger === "full" && s.figures && s.figures.n >= 2);
  const lightest = series.find((s) => s.trigger === "lightest_steady" && s.figures && s.figures.n >= 2);
  const controlRange =
    full?.figures && lightest?.figures
      ? triggerControlRange(full.figures.trialMeans, lightest.figures.trialMeans)
      : null;
  return { series, controlRange, confidence: BENCH_CONFIDENCE };
}

export type RunFigures = ReturnType<typeof runFigures>;
