// Success rates when one reporter files several reports, and whether two rates can be told apart.
import { checkConfidence } from "./distributions";
import { differenceInterval, hybridDifference, wilsonAt, type Group, type Interval } from "./proportions";

export interface ClusteredInterval extends Interval {
  /** Design effect: cluster-robust variance over binomial variance, floored at 1. */
  designEffect: number;
  /** n / designEffect, the sample size the Wilson interval is worked at. */
  effectiveN: number;
  /** Number of clusters (reporters) with at least one report. */
  clusters: number;
}

/**
 * Success rate from clusters of reports (one cluster per reporter), with the Wilson interval at
 * the effective sample size n / deff (Korn & Graubard 1998, Survey Methodology 24:193–201).
 *
 * p = Σyᵢ / Σmᵢ is a ratio estimator; its linearisation (cluster-robust) variance over K clusters is
 * v = K/(K−1) · Σ(yᵢ − p·mᵢ)² / n² (the ratio estimator's variance in Cochran 1977, Sampling Techniques;
 * with-replacement form, no finite-population correction).
 * deff = v / v₀, v₀ = n/(n−1) · p(1−p)/n: the binomial variance p(1−p)/n with the same
 * small-sample factor, i.e. the same estimator with every report its own cluster, so one report
 * per reporter gives deff = 1 exactly and the plain Wilson interval. deff is floored at 1 (clustering
 * is not allowed to make a rate look surer than independent reports would). Where the variance
 * cannot be estimated — p = 0 or 1, fewer than two reporters, a single report — deff = 1.
 */
export function clusteredWilson(clusters: readonly Group[], confidence = 0.95): ClusteredInterval {
  checkConfidence(confidence);
  for (const c of clusters) {
    if (
      !Number.isInteger(c.successes) ||
      !Number.isInteger(c.trials) ||
      c.trials < 0 ||
      c.successes < 0 ||
      c.successes > c.trials
    ) {
      throw new RangeError("need whole numbers with 0 ≤ successes ≤ trials");
    }
  }
  const used = clusters.filter((c) => c.trials > 0);
  const n = used.reduce((acc, c) => acc + c.trials, 0);
  if (n === 0) throw new RangeError("need at least one report");
  const p = used.reduce((acc, c) => acc + c.successes, 0) / n;
  const K = used.length;
  let designEffect = 1;
  if (p > 0 && p < 1 && K >= 2 && n >= 2) {
    const ss = used.reduce((acc, c) => acc + (c.successes - p * c.trials) ** 2, 0);
    const clusterVariance = ((K / (K - 1)) * ss) / (n * n);
    const binomialVariance = ((n / (n - 1)) * p * (1 - p)) / n;
    const ratio = clusterVariance / binomialVariance;
    // With one report per reporter the ratio is 1 in exact arithmetic; rounding must not lift it.
    designEffect = ratio > 1 + 1e-9 ? ratio : 1;
  }
  const effectiveN = n / designEffect;
  return { ...wilsonAt(p, effectiveN, confidence), designEffect, effectiveN, clusters: K };
}

export interface Distinguishable {
  distinguishable: boolean;
  difference: Interval;
}

/**
 * Whether two success rates can be told apart at `confidence`: Newcombe's hybrid score interval
 * for p1 − p2 (Newcombe 1998, Statistics in Medicine 17:873–890, method 10) excludes 0. Not the
 * overlap of the two single intervals: two 95 % intervals can overlap while the difference is
 * clear (Schenker & Gentleman 2001, The American Statistician 55:182–186).
 * With design effects (from `clusteredWilson`), each rate's Wilson limits are worked at its
 * effective sample size n / deff before they are combined.
 */
export function distinguishable(
  s1: number,
  n1: number,
  s2: number,
  n2: number,
  confidence = 0.95,
  { designEffect1 = 1, designEffect2 = 1 }: { designEffect1?: number; designEffect2?: number } = {},
): Distinguishable {
  if (!(designEffect1 >= 1 && designEffect2 >= 1)) throw new RangeError("design effects must be ≥ 1");
  const difference =
    designEffect1 === 1 && designEffect2 === 1
      ? differenceInterval(s1, n1, s2, n2, confidence)
      : hybridDifference(
          wilsonAt(rate(s1, n1), n1 / designEffect1, confidence),
          wilsonAt(rate(s2, n2), n2 / designEffect2, confidence),
        );
  return { distinguishable: difference.lower > 0 || difference.upper < 0, difference };
}

function rate(s: number, n: number) {
  if (!Number.isInteger(s) || !Number.isInteger(n) || n < 1 || s < 0 || s > n) {
    throw new RangeError("need whole numbers with 0 ≤ successes ≤ trials and trials ≥ 1");
  }
  return s / n;
}
