// Intervals for means, medians and other statistics of measured values. Pure functions.
import seedrandom from "seedrandom";
import { checkConfidence, tCritical } from "./distributions";
import type { Interval } from "./proportions";
import { select } from "../utils/quickselect";

/** Student t interval for a mean from summary statistics: x̄ ± t(1−α/2, n−1) · s/√n. */
export function meanIntervalFromSummary(
  mean: number,
  sd: number,
  n: number,
  confidence = 0.95,
): Interval & { df: number } {
  if (!Number.isInteger(n) || n < 2) throw new RangeError("need at least two values");
  if (!(sd >= 0)) throw new RangeError("standard deviation must be zero or more");
  checkConfidence(confidence);
  const df = n - 1;
  const half = (tCritical(confidence, df) * sd) / Math.sqrt(n);
  return { estimate: mean, lower: mean - half, upper: mean + half, df };
}

export function meanInterval(values: number[], confidence = 0.95): Interval & { df: number } {
  const n = values.length;
  if (n < 2) throw new RangeError("need at least two values");
  const mean = values.reduce((s, v) => s + v, 0) / n;
  const sd = Math.sqrt(values.reduce((s, v) => s + (v - mean) ** 2, 0) / (n - 1));
  return meanIntervalFromSummary(mean, sd, n, confidence);
}

export function median(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError("need at least one value");
  const a = Float64Array.from(values);
  const mid = a.length >> 1;
  if (a.length % 2) return select(a, a.length, mid);
  const upper = select(a, a.length, mid);
  let lower = -Infinity;
  for (let i = 0; i < mid; i++) if (a[i]! > lower) lower = a[i]!; // after select, a[0..mid) ≤ a[mid]
  return (lower + upper) / 2;
}

/** Linear-interpolation quantile of sorted values (type 7, the common default). */
function quantileSorted(sorted: number[], p: number): number {
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  return sorted[lo]! + (h - lo) * ((sorted[Math.min(lo + 1, sorted.length - 1)] ?? sorted[lo]!) - sorted[lo]!);
}

export interface BootstrapOptions {
  resamples?: number;
  seed: string | number;
  confidence?: number;
}

/**
 * Percentile bootstrap interval (Efron & Tibshirani 1993, ch. 13): resample with replacement
 * `resamples` times from a seeded generator (same seed → same answer), take the statistic of each,
 * and read its α/2 and 1−α/2 quantiles. Also returns the bootstrap standard error.
 */
export function bootstrapInterval<T>(
  values: readonly T[],
  statistic: (sample: T[]) => number,
  { resamples = 2000, seed, confidence = 0.95 }: BootstrapOptions,
): Interval & { se: number } {
  if (values.length === 0) throw new RangeError("need at least one value");
  if (!Number.isInteger(resamples) || resamples < 10) throw new RangeError("need at least 10 resamples");
  checkConfidence(confidence);
  const rng = seedrandom(String(seed));
  const n = values.length;
  const stats = new Array<number>(resamples);
  const sample = new Array<T>(n);
  for (let b = 0; b < resamples; b++) {
    for (let i = 0; i < n; i++) sample[i] = values[Math.floor(rng() * n)]!;
    stats[b] = statistic(sample);
  }
  const mean = stats.reduce((s, v) => s + v, 0) / resamples;
  const se = Math.sqrt(stats.reduce((s, v) => s + (v - mean) ** 2, 0) / (resamples - 1));
  stats.sort((a, b) => a - b);
  const tail = (1 - confidence) / 2;
  return {
    estimate: statistic([...values]),
    lower: quantileSorted(stats, tail),
    upper: quantileSorted(stats, 1 - tail),
    se,
  };
}

/** Pearson correlation of [x, y] pairs. */
export function correlation(pairs: readonly (readonly [number, number])[]): number {
  const n = pairs.length;
  const mx = pairs.reduce((s, p) => s + p[0], 0) / n;
  const my = pairs.reduce((s, p) => s + p[1], 0) / n;
  let sxy = 0,
    sxx = 0,
    syy = 0;
  for (const [x, y] of pairs) {
    sxy += (x - mx) * (y - my);
    sxx += (x - mx) ** 2;
    syy += (y - my) ** 2;
  }
  return sxy / Math.sqrt(sxx * syy);
}

/**
 * The percentile bootstrap of the median, as `bootstrapInterval(values, median, options)` gives
 * (same seed, same draws, same answer), but fast: the values are sorted once, and since a
 * resample's median is the value at the median of its drawn ranks, each resample only counts ranks.
 */
export function bootstrapMedianInterval(
  values: readonly number[],
  { resamples = 2000, seed, confidence = 0.95 }: BootstrapOptions,
): Interval & { se: number } {
  const n = values.length;
  if (n === 0) throw new RangeError("need at least one value");
  if (!Number.isInteger(resamples) || resamples < 10) throw new RangeError("need at least 10 resamples");
  checkConfidence(confidence);
  const sorted = Float64Array.from(values).sort();
  const rng = seedrandom(String(seed));
  const counts = new Uint32Array(n);
  const stats = new Array<number>(resamples);
  const mid = n >> 1;
  // Rank order is value order only after sorting the original values; draws index the originals.
  const order = Array.from(values.keys()).sort((a, b) => values[a]! - values[b]! || a - b);
  const rankOf = new Uint32Array(n);
  order.forEach((original, rank) => (rankOf[original] = rank));
  for (let b = 0; b < resamples; b++) {
    counts.fill(0);
    for (let i = 0; i < n; i++) counts[rankOf[Math.floor(rng() * n)]!]!++;
    // The k-th smallest drawn rank, for k = mid (and mid − 1 when n is even).
    let seen = 0,
      r = 0,
      lowerRank = -1;
    for (; r < n; r++) {
      seen += counts[r]!;
      if (lowerRank < 0 && n % 2 === 0 && seen >= mid) lowerRank = r;
      if (seen > mid) break;
    }
    stats[b] = n % 2 ? sorted[r]! : (sorted[lowerRank]! + sorted[r]!) / 2;
  }
  const mean = stats.reduce((s, v) => s + v, 0) / resamples;
  const se = Math.sqrt(stats.reduce((s, v) => s + (v - mean) ** 2, 0) / (resamples - 1));
  stats.sort((a, b) => a - b);
  const tail = (1 - confidence) / 2;
  return { estimate: median(values), lower: quantileSorted(stats, tail), upper: quantileSorted(stats, 1 - tail), se };
}
