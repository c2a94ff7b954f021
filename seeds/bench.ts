// The demo's bench runs: invented rigs at the demo shops, two protocols of our own, about sixty runs
// over the air hammers and impact wrenches, a few with raw traces. Each tool's force comes from the
// same latent power that drives its field success (seeds/reports.ts `toolPower`), so bench and field
// agree as they would in the world; the open-line series gets its running inlet pressure from the
// demo world's own line model. One rig's check standard drifts out of control late in the year (its
// last runs are held for review) and one rig's calibration has expired. Invented data only.
import { KPA_PER_PSI, MM_PER_IN } from "../app/domain";
import { analyseTrace, fitCalibration, individualsChart, synthesizeTrace } from "../app/bench";
import type { Trx } from "../db/database";
import { worldInletKpa } from "./air-world";
import { models, runningAir, type ModelSeed } from "./catalogue";
import { makeRng, type Rng, toolPower } from "./reports";

const PSI = (psi: number) => Math.round(psi * KPA_PER_PSI * 10) / 10;
const fixed = (x: number, digits: number) => Math.round(x * 10 ** digits) / 10 ** digits;
function normal(rng: Rng): number {
  const u = 1 - rng();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rng());
}
const isoDay = (d: Date) => d.toISOString().slice(0, 10);
const addDays = (iso: string, days: number) => isoDay(new Date(Date.parse(`${iso}T00:00:00Z`) + days * 86_400_000));

type Kind = "percussive_force" | "impact_torque";

interface RigSeed {
  name: string;
  shopIndex: number;
  /** The person (seeds/people.ts index) who owns the rig and files its runs. */
  ownerIndex: number;
  kind: Kind;
  capacity: number;
  rateHz: number;
  fixture: string;
  /** The rig's own small multiplicative bias (what rig-to-rig spread is made of). */
  bias: number;
  calibratedOn: string;
  verified: boolean;
  /** The first and last day it runs tools. */
  from: string;
  to: string;
  /** The check standard drifts upward over its last sessions. */
  drifts?: boolean;
}

export const DEMO_RIGS: RigSeed[] = [
  {
    name: "Cinderlane drop-anvil force rig",
    shopIndex: 0,
    ownerIndex: 0,
    kind: "percussive_force",
    capacity: 50_000,
    rateHz: 10_000,
    fixture:
      "Hardened steel anvil on a 50 kN compression load cell, bolted to a 40 mm floor plate; bit guided by a bronze bush.",
    bias: 1.0,
    calibratedOn: "2026-03-09",
    verified: true,
    from: "2026-03-20",
    to: "2026-11-20",
  },
  {
    name: "Northgate bay 4 force bench",
    shopIndex: 1,
    ownerIndex: 1,
    kind: "percussive_force",
    capacity: 100_000,
    rateHz: 20_000,
    fixture:
      "Anvil cap on a 100 kN load cell set in a steel frame anchored to the slab; polymer guard box with a viewing port.",
    bias: 1.04,
    calibratedOn: "2026-01-15",
    verified: true,
    from: "2026-02-01",
    to: "2026-11-10",
  },
  {
    name: "Ridgeback heavy anvil",
    shopIndex: 2,
    ownerIndex: 2,
    kind: "percussive_force",
    capacity: 100_000,
    rateHz: 10_000,
    fixture: "Forged anvil on a 100 kN load cell under a drop-guard cage, bolted to a concrete plinth.",
    bias: 0.97,
    calibratedOn: "2026-02-02",
    verified: true,
    from: "2026-02-20",
    to: "2026-11-25",
    drifts: true,
  },
  {
    name: "Tamarind trailer-bay force rig",
    shopIndex: 3,
    ownerIndex: 3,
    kind: "percussive_force",
    capacity: 50_000,
    rateHz: 10_000,
    fixture: "Anvil on a 50 kN load cell in a welded stand bolted to the bay floor; mesh guard on three sides.",
    bias: 1.02,
    calibratedOn: "2025-04-14",
    verified: true,
    from: "2025-05-01",
    to: "2025-10-30",
  },
  {
    name: "Foxhollow bench anvil",
    shopIndex: 7,
    ownerIndex: 7,
    kind: "percussive_force",
    capacity: 50_000,
    rateHz: 10_000,
    fixture: "Anvil on a 50 kN load cell, bench-mounted with four M16 bolts; hinged polycarbonate guard.",
    bias: 0.99,
    calibratedOn: "2026-05-04",
    verified: true,
    from: "2026-05-10",
    to: "2026-11-15",
  },
  {
    name: "Willowmere torque fixture",
    shopIndex: 4,
    ownerIndex: 4,
    kind: "impact_torque",
    capacity: 3_000,
    rateHz: 5_000,
    fixture:
      "Rotary torque transducer behind a joint-rate simulator (hardened stud and nut on a spring stack), frame bolted down.",
    bias: 1.0,
    calibratedOn: "2026-04-01",
    verified: true,
    from: "2026-04-10",
    to: "2026-11-18",
  },
  {
    name: "Ironbark breakaway fixture",
    shopIndex: 5,
    ownerIndex: 5,
    kind: "impact_torque",
    capacity: 5_000,
    rateHz: 5_000,
    fixture:
      "Torque transducer on a 1 in square drive into a seized-joint simulator (tapered friction stack), anchored to the floor.",
    bias: 1.05,
    calibratedOn: "2026-02-20",
    verified: true,
    from: "2026-03-01",
    to: "2026-11-22",
  },
  {
    name: "Saltmarsh depot torque stand",
    shopIndex: 6,
    ownerIndex: 6,
    kind: "impact_torque",
    capacity: 3_000,
    rateHz: 5_000,
    fixture: "Torque transducer with a soft-joint stack in a guarded stand bolted to the depot floor.",
    bias: 0.96,
    calibratedOn: "2026-06-08",
    verified: true,
    from: "2026-06-15",
    to: "2026-11-28",
  },
];

const HOSE_38_MM = 0.375 * MM_PER_IN;
const OPEN_LINE = { hoseIdMm: HOSE_38_MM, hoseLengthM: 7.6, couplerProfile: "industrial_m", couplerCount: 2 };

const hammerSeries = [
  {
    position: 1,
    label: "Full trigger, inlet regulated to 90 psi at the tool",
    trigger: "full",
    inlet: "regulated_at_tool",
    inlet_kpa: PSI(90),
  },
  {
    position: 2,
    label: "Lightest steady trigger, inlet regulated to 90 psi at the tool",
    trigger: "lightest_steady",
    inlet: "regulated_at_tool",
    inlet_kpa: PSI(90),
  },
  {
    position: 3,
    label: "Full trigger on an open line: regulator at 120 psi, 7.6 m of 3/8 in hose and two couplers",
    trigger: "full",
    inlet: "open_line",
    inlet_kpa: PSI(120),
    hose_length_m: OPEN_LINE.hoseLengthM,
    hose_id_mm: fixed(OPEN_LINE.hoseIdMm, 2),
    coupler_count: OPEN_LINE.couplerCount,
    coupler_profile: "industrial_m",
  },
] as const;

const HAMMER_BASE = {
  slug: "hammer-blow-force",
  title: "Hammer blow force at the anvil",
  categorySlug: "air-hammer",
  quantity: "peak_force_n",
  trials_per_series: 5,
  blows_per_trial: 40,
  seconds_per_trial: null,
  attachment: "Flat-faced test bit of the tool's own shank (0.401 in or 0.498 in), 150 mm, hardened; retainer fitted.",
  warm_up: "Thirty seconds of running against the anvil at the series' pressure before the first trial.",
  oiling: "Three drops of air-tool oil at the inlet before the first series; none between series.",
  summary:
    "Peak force of each blow on a calibrated load cell, in three series that differ by trigger and by how the air reaches the tool. Five trials of forty blows per series; the first blows of each trial are left out while the tool settles.",
} as const;

/** Version 1 left out the first 5 blows of a trial; version 2 leaves out 10 (the tools settle slower than thought). */
export const DEMO_PROTOCOLS = [
  { ...HAMMER_BASE, version: 1, blows_discarded: 5, series: hammerSeries, frozenOn: "2025-05-01" },
  { ...HAMMER_BASE, version: 2, blows_discarded: 10, series: hammerSeries, frozenOn: "2026-02-01" },
  {
    slug: "impact-peak-torque",
    title: "Impact wrench peak torque on a seized-joint fixture",
    categorySlug: "impact-wrench",
    quantity: "peak_torque_nm",
    trials_per_series: 5,
    blows_per_trial: null,
    seconds_per_trial: 5,
    blows_discarded: 3,
    attachment: "Impact-rated 6-point socket of the tool's drive, no extension, no adapter.",
    warm_up: "Ten seconds of free running, then one untimed trial on the fixture.",
    oiling: "Two drops of air-tool oil at the inlet before the first series.",
    summary:
      "Peak torque of each impact on a transducer behind a seized-joint simulator, full trigger, regulated and on an open line. Five timed trials of five seconds per series.",
    version: 1,
    series: [
      { ...hammerSeries[0], label: "Full trigger, inlet regulated to 90 psi at the tool" },
      { ...hammerSeries[2] },
    ],
    frozenOn: "2026-03-01",
  },
] as const;

/** What the world's tool delivers: peak force (N) or torque (N·m) at an inlet pressure, full trigger. */
function truePeak(model: ModelSeed, inletKpa: number) {
  const power = toolPower(model);
  const pressure = inletKpa / PSI(90);
  return model.category === "air-hammer"
    ? 9_500 * power ** 0.75 * pressure ** 1.1
    : 1_000 * power ** 0.9 * pressure ** 1.3;
}

/** A small tool feathers to a lighter share of its full blow (the field's trigger-control ratings agree). */
const lightestShare = (model: ModelSeed) => 0.22 + 0.08 * Math.log(toolPower(model));

export interface DemoTrial {
  peaks: number[];
  blowsPerMinute: number | null;
  trace: {
    key: string;
    rateHz: number;
    seconds: number;
    bpm: number;
    peak: number;
    seed: number;
    capacity: number;
  } | null;
}
export interface DemoRun {
  rigIndex: number;
  protocolIndex: number;
  modelIndex: number;
  runOn: string;
  serial: string;
  condition: "new" | "used";
  hours: number | null;
  operator: string;
  ambientC: number;
  status: "accepted" | "submitted" | "returned" | "rejected";
  flags: string[];
  series: { position: number; staticKpa: number; runningKpa: number; trials: DemoTrial[] }[];
}

const OPERATORS = [
  "R. Ostrander",
  "M. Quill",
  "J. Tennick",
  "A. Varga",
  "L. Osei",
  "P. Danvers",
  "S. Ferreira",
  "K. Holm",
];

/** The check-standard sessions of one rig: every run day plus a session every other week. */
function sessionsOf(rig: RigSeed, runDays: string[], rng: Rng) {
  const days = new Set(runDays);
  for (let d = rig.from; d <= rig.to; d = addDays(d, 14)) days.add(d);
  const sorted = [...days].sort();
  const nominal = rig.kind === "percussive_force" ? 12_000 : 1_100;
  const values = sorted.map((_, i) => {
    const drift = rig.drifts && i >= sorted.length - 6 ? 0.025 * (i - (sorted.length - 7)) : 0;
    return fixed(nominal * rig.bias * (1 + drift + 0.012 * normal(rng)), rig.kind === "percussive_force" ? 0 : 1);
  });
  const chart = individualsChart(values);
  return sorted.map((day, i) => ({ day, value: values[i]!, inControl: !chart.points[i]!.outOfControl }));
}

export function generateBench(seed = "bayproof-bench-v1") {
  const rng = makeRng(seed);
  const hammers = models.flatMap((m, i) => (m.category === "air-hammer" ? [i] : []));
  const wrenches = models.flatMap((m, i) => (m.category === "impact-wrench" ? [i] : []));
  const runs: DemoRun[] = [];
  let traces = 0;
  // Each model on about three rigs of its kind.
  const plan = [...hammers.flatMap((mi) => [mi, mi, mi]), ...wrenches.flatMap((mi) => [mi, mi, mi])].slice(0, 60);
  plan.forEach((mi, k) => {
    const model = models[mi]!;
    const kind: Kind = model.category === "air-hammer" ? "percussive_force" : "impact_torque";
    const rigChoices = DEMO_RIGS.flatMap((r, i) => (r.kind === kind ? [i] : []));
    const rigIndex = rigChoices[(k + Math.floor(k / 3)) % rigChoices.length]!;
    const rig = DEMO_RIGS[rigIndex]!;
    const span = (Date.parse(rig.to) - Date.parse(rig.from)) / 86_400_000;
    const runOn = addDays(rig.from, Math.floor(rng() * span));
    const protocolIndex = kind === "impact_torque" ? 2 : runOn < "2026-02-01" ? 0 : 1;
    const protocol = DEMO_PROTOCOLS[protocolIndex];
    const unitBias = 1 + 0.04 * normal(rng);
    const used = rng() < 0.4;
    const series = protocol.series.map((s) => {
      const running =
        s.inlet === "open_line"
          ? worldInletKpa(s.inlet_kpa, runningAir[mi]!.trueLps, OPEN_LINE).inletKpa
          : s.inlet_kpa - 6 - 10 * rng();
      const full = truePeak(model, running) * rig.bias * unitBias;
      const mean = s.trigger === "full" ? full : full * lightestShare(model);
      const trials = Array.from({ length: protocol.trials_per_series }, (_, t): DemoTrial => {
        const trialMean = mean * (1 + 0.035 * normal(rng));
        const bpm = (model.bpm ?? 1_400) * (s.trigger === "full" ? 1 : 0.8) * (0.93 + 0.08 * rng());
        const blows = protocol.blows_per_trial ?? Math.round((bpm / 60) * (protocol.seconds_per_trial ?? 5));
        // A raw trace for the first trial of every series of every seventh run.
        if (k % 7 === 3 && t === 0) {
          const seconds = fixed(((blows + protocol.blows_discarded + 2) * 60) / bpm, 2);
          traces++;
          return {
            peaks: [],
            blowsPerMinute: null,
            trace: {
              key: `bench/demo-traces/trace-${traces}.csv`,
              rateHz: rig.rateHz,
              seconds,
              bpm,
              peak: trialMean,
              seed: 1000 + traces,
              capacity: rig.capacity,
            },
          };
        }
        const peaks = Array.from({ length: blows }, () =>
          fixed(Math.max(trialMean * 0.2, trialMean * (1 + 0.11 * normal(rng))), kind === "percussive_force" ? 0 : 1),
        );
        return { peaks, blowsPerMinute: fixed(bpm, 0), trace: null };
      });
      return {
        position: s.position,
        staticKpa: fixed(s.inlet_kpa, 1),
        runningKpa: fixed(Math.min(s.inlet_kpa, running), 1),
        trials,
      };
    });
    const u = rng();
    runs.push({
      rigIndex,
      protocolIndex,
      modelIndex: mi,
      runOn,
      serial: `${model.code}-${String(10_000 + Math.floor(rng() * 89_999))}`,
      condition: used ? "used" : "new",
      hours: used ? Math.round(20 + rng() * 600) : null,
      operator: OPERATORS[rigIndex]!,
      ambientC: fixed(14 + rng() * 14, 1),
      status: u < 0.82 ? "accepted" : u < 0.9 ? "submitted" : u < 0.96 ? "returned" : "rejected",
      flags: [],
      series,
    });
  });
  // Check-standard sessions; a run on a session out of control is held for review.
  const sessions = DEMO_RIGS.map((rig, ri) =>
    sessionsOf(
      rig,
      runs.filter((r) => r.rigIndex === ri).map((r) => r.runOn),
      rng,
    ),
  );
  for (const run of runs) {
    const session = sessions[run.rigIndex]!.find((s) => s.day === run.runOn)!;
    if (!session.inControl) {
      run.flags = ["check_standard_out_of_control"];
      run.status = "submitted";
    }
  }
  const calibrations = DEMO_RIGS.map((rig, ri) => {
    const points = [0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8].map((share) => {
      const reference = fixed(rig.capacity * share, 0);
      // Every other rig's cell reads a little high at the top of its range (a quadratic fit suits it).
      const bend = ri % 2 === 1 ? (0.02 * reference ** 2) / rig.capacity : 0;
      const noise = 0.0005 * rig.capacity * normal(rng);
      return { reference, reading: fixed(reference * 1.003 + bend + noise, 1) };
    });
    return { points, fit: fitCalibration(points, "auto") };
  });
  return { runs, sessions, calibrations };
}

/** The samples of one demo trace as the CSV a rig exports: a header, then time (s) and value per line. */
export function demoTraceCsv(trace: NonNullable<DemoTrial["trace"]>, quantity: "N" | "N·m") {
  const { samples } = traceSamples(trace);
  const lines = [`time_s,${quantity === "N" ? "force_n" : "torque_nm"}`];
  for (let i = 0; i < samples.length; i++) lines.push(`${(i / trace.rateHz).toFixed(5)},${samples[i]!.toFixed(1)}`);
  return `${lines.join("\n")}\n`;
}

function traceSamples(trace: NonNullable<DemoTrial["trace"]>) {
  return synthesizeTrace({
    rateHz: trace.rateHz,
    seconds: trace.seconds,
    blowsPerMinute: trace.bpm,
    peak: trace.peak,
    peakSD: trace.peak * 0.11,
    noiseSD: trace.capacity * 0.0008,
    driftPerS: trace.capacity * 0.0004,
    seed: trace.seed,
    capacity: trace.capacity,
  });
}

/** Every demo trace, for the storage step (seeds/demo-evidence.ts puts a file behind each key). */
export function demoTraces() {
  const { runs } = generateBench();
  return runs.flatMap((run) =>
    run.series.flatMap((s) =>
      s.trials.flatMap((t) =>
        t.trace
          ? [
              {
                trace: t.trace,
                unit: DEMO_RIGS[run.rigIndex]!.kind === "percussive_force" ? ("N" as const) : ("N·m" as const),
              },
            ]
          : [],
      ),
    ),
  );
}

interface Ids {
  shops: number[];
  users: number[];
  models: number[];
  categories: Map<string, number>;
  moderators: number[];
}

/** Loads the bench scenario inside the demo's transaction. */
export async function loadBench(trx: Trx, ids: Ids) {
  const { runs, sessions, calibrations } = generateBench();
  const checkModel = (kind: Kind) =>
    ids.models[
      models.findIndex(
        (m) =>
          m.category === (kind === "percussive_force" ? "air-hammer" : "impact-wrench") &&
          m.code.includes(kind === "percussive_force" ? "QH-3" : "BW-12T"),
      )
    ]!;
  const rigRows = await trx
    .insertInto("rigs")
    .values(
      DEMO_RIGS.map((r) => ({
        owner_id: ids.users[r.ownerIndex]!,
        shop_id: ids.shops[r.shopIndex]!,
        name: r.name,
        kind: r.kind,
        sensor_kind: r.kind === "percussive_force" ? ("load_cell" as const) : ("torque_transducer" as const),
        sensor_capacity: r.capacity,
        sample_rate_hz: r.rateHz,
        fixture: r.fixture,
        check_tool_model_id: checkModel(r.kind),
        created_at: new Date(`${r.calibratedOn}T09:00:00Z`),
      })),
    )
    .returning("id")
    .execute();
  const rigIds = rigRows.map((r) => r.id);
  await trx
    .insertInto("rig_calibrations")
    .values(
      DEMO_RIGS.map((r, i) => {
        const { points, fit } = calibrations[i]!;
        return {
          rig_id: rigIds[i]!,
          calibrated_on: r.calibratedOn,
          points: JSON.stringify(points),
          degree: fit.degree,
          coefficients: fit.coefficients,
          residual_sd: fit.residualSD,
          r_squared: Math.min(1, Math.max(0, fit.rSquared)),
          verified_by: r.verified ? ids.moderators[i % ids.moderators.length]! : null,
          verified_at: r.verified ? new Date(`${addDays(r.calibratedOn, 3)}T10:00:00Z`) : null,
        };
      }),
    )
    .execute();
  await trx
    .insertInto("rig_check_readings")
    .values(
      sessions.flatMap((list, i) =>
        list.map((s) => ({ rig_id: rigIds[i]!, session_on: s.day, value: s.value, in_control: s.inControl })),
      ),
    )
    .execute();

  const protocolIds: number[] = [];
  for (const p of DEMO_PROTOCOLS) {
    const { id } = await trx
      .insertInto("bench_protocols")
      .values({
        slug: p.slug,
        version: p.version,
        title: p.title,
        category_id: ids.categories.get(p.categorySlug)!,
        quantity: p.quantity,
        trials_per_series: p.trials_per_series,
        blows_per_trial: p.blows_per_trial,
        seconds_per_trial: p.seconds_per_trial,
        blows_discarded: p.blows_discarded,
        attachment: p.attachment,
        warm_up: p.warm_up,
        oiling: p.oiling,
        summary: p.summary,
        frozen_at: new Date(`${p.frozenOn}T08:00:00Z`),
        created_at: new Date(`${addDays(p.frozenOn, -20)}T08:00:00Z`),
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    protocolIds.push(id);
  }
  const seriesRows = await trx
    .insertInto("bench_protocol_series")
    .values(DEMO_PROTOCOLS.flatMap((p, i) => p.series.map((s) => ({ ...s, protocol_id: protocolIds[i]! }))))
    .returning(["id", "protocol_id", "position"])
    .execute();
  const seriesId = (protocolId: number, position: number) =>
    seriesRows.find((s) => s.protocol_id === protocolId && s.position === position)!.id;

  const rng = makeRng("bayproof-bench-decisions-v1");
  for (const run of runs) {
    const rig = DEMO_RIGS[run.rigIndex]!;
    const protocolId = protocolIds[run.protocolIndex]!;
    const submittedAt = new Date(`${run.runOn}T16:00:00Z`);
    const decidedAt =
      run.status === "submitted" ? null : new Date(submittedAt.getTime() + (20 + rng() * 50) * 3_600_000);
    const { id: runId } = await trx
      .insertInto("bench_runs")
      .values({
        rig_id: rigIds[run.rigIndex]!,
        protocol_id: protocolId,
        tool_model_id: ids.models[run.modelIndex]!,
        filed_by: ids.users[rig.ownerIndex]!,
        status: run.status,
        unit_serial: run.serial,
        unit_condition: run.condition,
        unit_hours: run.hours,
        run_on: run.runOn,
        operator: run.operator,
        ambient_c: run.ambientC,
        flags: run.flags,
        created_at: submittedAt,
        updated_at: decidedAt ?? submittedAt,
        submitted_at: submittedAt,
        decided_at: decidedAt,
        accepted_at: run.status === "accepted" ? decidedAt : null,
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    for (const s of run.series) {
      const { id: runSeriesId } = await trx
        .insertInto("bench_run_series")
        .values({
          run_id: runId,
          protocol_id: protocolId,
          series_id: seriesId(protocolId, s.position),
          static_inlet_kpa: s.staticKpa,
          running_inlet_kpa: s.runningKpa,
        })
        .returning("id")
        .executeTakeFirstOrThrow();
      const discard = DEMO_PROTOCOLS[run.protocolIndex]!.blows_discarded;
      await trx
        .insertInto("bench_trials")
        .values(
          s.trials.map((t, i) => {
            if (!t.trace)
              return {
                run_series_id: runSeriesId,
                trial_number: i + 1,
                peaks: t.peaks,
                blows_per_minute: t.blowsPerMinute,
              };
            const { samples } = traceSamples(t.trace);
            const analysis = analyseTrace(samples, t.trace.rateHz, {
              capacity: t.trace.capacity,
              discardBlows: discard,
            });
            return {
              run_series_id: runSeriesId,
              trial_number: i + 1,
              peaks: analysis.blows.map((b) => fixed(b.peak, 1)),
              trace_key: t.trace.key,
              rate_hz: t.trace.rateHz,
              blows_per_minute: analysis.blowsPerMinute == null ? null : fixed(analysis.blowsPerMinute, 0),
            };
          }),
        )
        .execute();
    }
    if (decidedAt) {
      const action = run.status === "accepted" ? "accept" : run.status === "returned" ? "return" : "reject";
      await trx
        .insertInto("bench_decisions")
        .values({
          run_id: runId,
          moderator_id: ids.moderators[Math.floor(rng() * ids.moderators.length)]!,
          action,
          reason_code:
            action === "accept"
              ? "bench_checks_pass"
              : action === "return"
                ? "trace_missing_for_series"
                : "rig_not_shown",
          note: action === "return" ? "Please add the running inlet pressure of the open-line series." : null,
          checklist: JSON.stringify({
            calibration_current: true,
            check_standard_in_control: true,
            trace_plausible: action !== "reject",
            video_matches_rig: action !== "reject",
          }),
          run_version: 1,
          created_at: decidedAt,
        })
        .execute();
    }
  }
  return runs.length;
}
