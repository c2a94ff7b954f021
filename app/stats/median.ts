// Distribution-free interval for a median from order statistics. Pure functions.
import { checkConfidence } from "./distributions";
import type { Interval } from "./proportions";

export interface MedianInterval extends Interval {
  /** The exact probability that [lower, upper] covers the population median: 1 − 2·P(B ≤ k − 1). */
  coverage: number;
}

/**
 * Median with the distribution-free interval [x(k), x(n−k+1)] from the order statistics (Conover,
 * Practical Nonparametric Statistics, 3rd ed. 1999, the binomial test's interval for a quantile):
 * it covers the population median with probability 1 − 2·P(B ≤ k − 1), B ~ Binomial(n, ½), for any
 * continuous distribution. k is the largest with that coverage ≥ `confidence`; `coverage` is the
 * exact level achieved (never below the one asked). Null where even [x(1), x(n)] falls short:
 * its coverage is 1 − 2^(1−n), so n ≤ 5 at 95 %. Sorting makes it O(n log n); the binomial tail
 * is summed in log space, so large n does not underflow.
 */
export function medianInterval(values: readonly number[], confidence = 0.95): MedianInterval | null {
  checkConfidence(confidence);
  if (values.some((v) => !Number.isFinite(v))) throw new RangeError("values must be finite numbers");
  return medianIntervalOfTally(tally(values), confidence);
}

/** Values as their distinct values, ascending, and how often each occurs. */
export interface Tally {
  values: readonly number[];
  counts: readonly number[];
}

/** A list of values as a tally (sorted distinct values with counts). */
export function tally(values: readonly number[]): Tally {
  const sorted = Float64Array.from(values).sort();
  const distinct: number[] = [];
  const counts: number[] = [];
  for (const v of sorted) {
    if (distinct.length > 0 && distinct[distinct.length - 1] === v) counts[counts.length - 1]!++;
    else {
      distinct.push(v);
      counts.push(1);
    }
  }
  return { values: distinct, counts };
}

/**
 * The i-th smallest value (0-based) of a tally, walking its counts: x(i+1) without the values
 * themselves. The full refresh reads each cell's times as a tally, not one row per report.
 */
export function orderStatistic(t: Tally, i: number): number {
  let seen = 0;
  for (let j = 0; j < t.counts.length; j++) {
    seen += t.counts[j]!;
    if (i < seen) return t.values[j]!;
  }
  throw new RangeError("order statistic beyond the values");
}

/** The sample median of a tally (the mean of the two middle values for an even count); null when empty. */
export function medianOfTally(t: Tally): number | null {
  const n = t.counts.reduce((a, b) => a + b, 0);
  if (n === 0) return null;
  return n % 2 === 1 ? orderStatistic(t, (n - 1) / 2) : (orderStatistic(t, n / 2 - 1) + orderStatistic(t, n / 2)) / 2;
}

/** medianInterval of values given as a tally (ascending distinct values with their counts). */
export function medianIntervalOfTally(t: Tally, confidence = 0.95): MedianInterval | null {
  checkConfidence(confidence);
  const n = t.counts.reduce((a, b) => a + b, 0);
  if (n === 0) return null;
  const estimate = medianOfTally(t)!;
  // Walk k up from 1 while the coverage of the next k still reaches the level asked.
  // tail(k) = P(B ≤ k − 1); coverage(k) = 1 − 2·tail(k). Slack of 1e-12 absorbs rounding only.
  const maxTail = (1 - confidence) / 2 + 1e-12;
  const logHalfN = -n * Math.LN2;
  let logPmf = logHalfN; // log P(B = 0)
  let logTail = logPmf; // log P(B ≤ 0), the tail for k = 1
  if (Math.exp(logTail) > maxTail) return null;
  let k = 1;
  while (k < Math.floor((n + 1) / 2)) {
    // P(B = k) from P(B = k − 1): multiply by (n − k + 1) / k.
    logPmf += Math.log(n - k + 1) - Math.log(k);
    const next = logAdd(logTail, logPmf); // P(B ≤ k), the tail for k + 1
    if (Math.exp(next) > maxTail) break;
    logTail = next;
    k++;
  }
  return {
    estimate,
    lower: orderStatistic(t, k - 1),
    upper: orderStatistic(t, n - k),
    coverage: Math.max(0, 1 - 2 * Math.exp(logTail)),
  };
}

const logAdd = (a: number, b: number) => (a > b ? a + Math.log1p(Math.exp(b - a)) : b + Math.log1p(Math.exp(a - b)));
