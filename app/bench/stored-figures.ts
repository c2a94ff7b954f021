// The bench figures that are stored, worked out from accepted runs (pure: the loading and storing are
// figures.server.ts). Each run's series is one study: its trial means' mean, with variance s²/n of the
// trial means (the trial is the unit of replication). docs/decisions/014-bench-figures-across-rigs.md.
import { randomEffects, type RandomEffects, type Study } from "./across-rigs";
import { rigAgreement, type RigAgreement } from "./agreement";
import { meanInterval } from "./figures";
import { pressureSlope, type PressureSlope } from "./pressure-slope";
import { groupBy } from "~/utils/group";

/** One accepted run's series, with each trial's blow peaks. */
export interface RunSeriesData {
  runId: number;
  rigId: number;
  modelId: number;
  protocolId: number;
  seriesId: number;
  trigger: "full" | "lightest_steady";
  inlet: "regulated_at_tool" | "open_line";
  inletKpa: number;
  runningInletKpa: number;
  trials: number[][];
}

export interface RunStudy extends Study {
  trialMeans: number[];
  sd: number;
  n: number;
}

/** A run-series as a study: null under two trials or with no spread between trials (no variance to weigh by). */
export function runStudy(trials: readonly number[][]): RunStudy | null {
  const trialMeans = trials.filter((t) => t.length > 0).map((t) => t.reduce((a, v) => a + v, 0) / t.length);
  const m = meanInterval(trialMeans);
  if (!m || !(m.sd > 0)) return null;
  return { mean: m.mean, variance: (m.sd * m.sd) / m.n, trialMeans, sd: m.sd, n: m.n };
}

export interface PooledFigure {
  modelId: number;
  protocolId: number;
  seriesId: number;
  figure: "force" | "trigger_range";
  pooled: RandomEffects;
  runs: number;
  rigs: number;
}

/** The full-trigger series a lightest-steady one is compared with: same inlet, else the first regulated one. */
function partnerOf<T extends RunSeriesData>(light: T, run: readonly T[]): T | null {
  const full = run.filter((s) => s.trigger === "full");
  return (
    full.find((s) => s.inlet === light.inlet && s.inletKpa === light.inletKpa) ??
    full.find((s) => s.inlet === "regulated_at_tool") ??
    null
  );
}

type SeriesStudy = { modelId: number; protocolId: number; seriesId: number; rigId: number; study: Study };

/** One random-effects figure per model and series, pooling the runs' studies. */
function poolBySeries(
  studies: readonly SeriesStudy[],
  figure: PooledFigure["figure"],
  confidence: number,
): PooledFigure[] {
  return [...groupBy(studies, (s) => `${s.modelId}:${s.seriesId}`).values()].map((group) => {
    const first = group[0]!;
    return {
      modelId: first.modelId,
      protocolId: first.protocolId,
      seriesId: first.seriesId,
      figure,
      pooled: randomEffects(
        group.map((s) => s.study),
        confidence,
      ),
      runs: group.length,
      rigs: new Set(group.map((s) => s.rigId)).size,
    };
  });
}

/**
 * Per model and series, the runs' means pooled by `randomEffects`; and per model and lightest-steady
 * series, the trigger control range (full minus lightest steady) of each run pooled the same way, its
 * variance per run the sum of the two series' s²/n.
 */
export function pooledFigures(series: readonly RunSeriesData[], confidence = 0.95): PooledFigure[] {
  const studied = series.flatMap((s) => {
    const study = runStudy(s.trials);
    return study ? [{ ...s, study }] : [];
  });
  const ranges: SeriesStudy[] = [];
  for (const run of groupBy(studied, (s) => String(s.runId)).values()) {
    for (const light of run.filter((s) => s.trigger === "lightest_steady")) {
      const full = partnerOf(light, run);
      if (!full) continue;
      ranges.push({
        modelId: light.modelId,
        protocolId: light.protocolId,
        seriesId: light.seriesId,
        rigId: light.rigId,
        study: { mean: full.study.mean - light.study.mean, variance: full.study.variance + light.study.variance },
      });
    }
  }
  return [...poolBySeries(studied, "force", confidence), ...poolBySeries(ranges, "trigger_range", confidence)];
}

export interface AgreementFigure {
  modelId: number;
  source: "check_readings" | "runs";
  seriesId: number | null;
  agreement: RigAgreement;
}

/** `rigAgreement` where it is defined (two rigs or more, one of them with two readings); else null. */
export function agreementOf(readings: readonly { rigId: number; value: number }[], confidence = 0.95) {
  const rigs = new Set(readings.map((r) => r.rigId));
  if (rigs.size < 2 || readings.length - rigs.size < 1) return null;
  return rigAgreement(
    readings.map((r) => ({ rig: String(r.rigId), value: r.value })),
    confidence,
  );
}

/** Rig agreement from runs: one model's series measured on several rigs, each trial mean a reading. */
export function runAgreements(series: readonly RunSeriesData[], confidence = 0.95): AgreementFigure[] {
  const out: AgreementFigure[] = [];
  for (const group of groupBy(series, (s) => `${s.modelId}:${s.seriesId}`).values()) {
    const readings = group.flatMap((s) =>
      s.trials
        .filter((t) => t.length > 0)
        .map((t) => ({ rigId: s.rigId, value: t.reduce((a, v) => a + v, 0) / t.length })),
    );
    const agreement = agreementOf(readings, confidence);
    if (agreement) out.push({ modelId: group[0]!.modelId, source: "runs", seriesId: group[0]!.seriesId, agreement });
  }
  return out;
}

export interface SlopeFigure {
  modelId: number;
  protocolId: number;
  slope: PressureSlope;
  points: { pressureKpa: number; force: number; rigId: number }[];
}

/** Per model and protocol version, full-trigger force on the running inlet pressure, where pressures vary. */
export function pressureSlopes(series: readonly RunSeriesData[], confidence = 0.95): SlopeFigure[] {
  const out: SlopeFigure[] = [];
  const full = series.filter((s) => s.trigger === "full");
  for (const group of groupBy(full, (s) => `${s.modelId}:${s.protocolId}`).values()) {
    const points = group.flatMap((s) => {
      const study = runStudy(s.trials);
      return study ? [{ pressureKpa: s.runningInletKpa, force: study.mean, rigId: s.rigId }] : [];
    });
    const slope = pressureSlope(points, undefined, confidence);
    if (slope) out.push({ modelId: group[0]!.modelId, protocolId: group[0]!.protocolId, slope, points });
  }
  return out;
}

/** A model's bench force as a function of inlet pressure: its line where it has one (held to the measured range), else its pooled force. */
export interface ForceAtPressure {
  modelId: number;
  line: { intercept: number; slope: number; lowKpa: number; highKpa: number } | null;
  pooled: number | null;
}

export function benchForceAt(f: ForceAtPressure, inletKpa: number): number | null {
  if (f.line) {
    const p = Math.min(f.line.highKpa, Math.max(f.line.lowKpa, inletKpa));
    return f.line.intercept + f.line.slope * p;
  }
  return f.pooled;
}
