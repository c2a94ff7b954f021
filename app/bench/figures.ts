// Figures of a bench run's series. The trial is the unit of replication: blows within a trial share
// the trial's air supply, temperature and setup, so intervals are built on trial means, and the
// blow-to-blow spread is shown as a distribution beside them, not folded into the interval.
import { meanIntervalFromSummary, tCritical } from "~/stats";
import { peakSummary, type PeakSummary } from "./peaks";

export { peakSummary, type PeakSummary };

/**
 * Student t interval for a mean: x̄ ± t(1 − α/2, n − 1)·s/√n, through the stats module's
 * meanIntervalFromSummary (jStat's t quantile). null for fewer than two values: one trial has no spread.
 */
export function meanInterval(
  values: number[],
  confidence = 0.95,
): { mean: number; lower: number; upper: number; sd: number; n: number } | null {
  const n = values.length;
  if (n < 2) return null;
  if (!values.every(Number.isFinite)) throw new RangeError("every value must be a finite number");
  const mean = values.reduce((s, v) => s + v, 0) / n;
  const sd = Math.sqrt(values.reduce((s, v) => s + (v - mean) ** 2, 0) / (n - 1));
  const { lower, upper } = meanIntervalFromSummary(mean, sd, n, confidence);
  return { mean, lower, upper, sd, n };
}

/**
 * A series' figures from its trials' blow peaks: each trial's mean peak (trials with no blows are
 * left out), the mean of those trial means with its t interval (lower and upper null under two
 * trials; mean null with none), and the blow-to-blow distribution of all peaks pooled.
 */
export function seriesFigures(
  trials: number[][],
  confidence = 0.95,
): {
  trialMeans: number[];
  mean: number | null;
  lower: number | null;
  upper: number | null;
  n: number;
  blows: PeakSummary;
} {
  const withBlows = trials.filter((t) => t.length > 0);
  const trialMeans = withBlows.map((t) => t.reduce((s, v) => s + v, 0) / t.length);
  const interval = meanInterval(trialMeans, confidence);
  const mean = trialMeans.length === 0 ? null : trialMeans.reduce((s, v) => s + v, 0) / trialMeans.length;
  return {
    trialMeans,
    mean,
    lower: interval?.lower ?? null,
    upper: interval?.upper ?? null,
    n: trialMeans.length,
    blows: peakSummary(withBlows.flat()),
  };
}

/**
 * The trigger's control range: full-trigger trial means minus lightest-steady trial means, with a
 * Welch t interval (unequal variances; Welch 1947, degrees of freedom by Satterthwaite 1946):
 * d ± t(1 − α/2, ν)·√(s₁²/n₁ + s₂²/n₂). null when either series has fewer than two trials.
 */
export function triggerControlRange(
  full: number[],
  lightest: number[],
  confidence = 0.95,
): { estimate: number; lower: number; upper: number; df: number } | null {
  const a = meanInterval(full, confidence);
  const b = meanInterval(lightest, confidence);
  if (!a || !b) return null;
  const va = (a.sd * a.sd) / a.n;
  const vb = (b.sd * b.sd) / b.n;
  const estimate = a.mean - b.mean;
  const se = Math.sqrt(va + vb);
  if (se === 0) return { estimate, lower: estimate, upper: estimate, df: a.n + b.n - 2 };
  const df = (va + vb) ** 2 / ((va * va) / (a.n - 1) + (vb * vb) / (b.n - 1));
  const half = tCritical(confidence, df) * se;
  return { estimate, lower: estimate - half, upper: estimate + half, df };
}

/** Our plausibility rule: a measured blow rate within ±15 % of the maker's stated rate agrees with it. */
export const BLOW_RATE_TOLERANCE = 0.15;

/**
 * Measured blow rate against the maker's stated rate: ratio = measured / stated, within tolerance
 * when |ratio − 1| ≤ 15 % (our rule). With no stated rate (or no measured one) the ratio is null and
 * the rate is not counted as agreeing: there is nothing to agree with, and the moderator looks.
 */
export function blowRateAgreement(
  measuredBpm: number | null,
  statedBpm: number | null,
): { ratio: number | null; withinTolerance: boolean } {
  if (measuredBpm === null || statedBpm === null || !(statedBpm > 0) || !Number.isFinite(measuredBpm)) {
    return { ratio: null, withinTolerance: false };
  }
  const ratio = measuredBpm / statedBpm;
  return { ratio, withinTolerance: Math.abs(ratio - 1) <= BLOW_RATE_TOLERANCE + 1e-12 };
}
