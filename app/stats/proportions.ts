// Intervals for success rates. Pure functions.
import { betaQuantile, checkConfidence, logBeta, zCritical } from "./distributions";

export interface Interval {
  estimate: number;
  lower: number;
  upper: number;
}

function checkCounts(successes: number, trials: number) {
  if (!Number.isInteger(successes) || !Number.isInteger(trials) || trials < 1 || successes < 0 || successes > trials) {
    throw new RangeError("need whole numbers with 0 ≤ successes ≤ trials and trials ≥ 1");
  }
}

/**
 * Wilson score interval, no continuity correction (Wilson 1927; Newcombe 1998, method 3):
 * (p + z²/2n ± z·√(p(1−p)/n + z²/4n²)) / (1 + z²/n).
 */
export function wilsonInterval(successes: number, trials: number, confidence = 0.95): Interval {
  checkCounts(successes, trials);
  return wilsonAt(successes / trials, trials, confidence);
}

/**
 * The same Wilson score formula at a rate p and a sample size n that need not be whole (an
 * effective sample size n / deff; Korn & Graubard 1998). p = 0 and p = 1 keep their exact limit.
 */
export function wilsonAt(p: number, n: number, confidence = 0.95): Interval {
  if (!(p >= 0 && p <= 1) || !(n > 0)) throw new RangeError("need 0 ≤ p ≤ 1 and n > 0");
  checkConfidence(confidence);
  const z = zCritical(confidence);
  const z2 = z * z;
  const centre = p + z2 / (2 * n);
  const half = z * Math.sqrt((p * (1 - p)) / n + z2 / (4 * n * n));
  const denom = 1 + z2 / n;
  return {
    estimate: p,
    lower: p === 0 ? 0 : (centre - half) / denom,
    upper: p === 1 ? 1 : (centre + half) / denom,
  };
}

/**
 * Difference p1 − p2 of independent proportions by Newcombe's hybrid score method (Newcombe 1998,
 * "Interval estimation for the difference between independent proportions", method 10): the
 * Wilson limits of each proportion combined as δ − √((p1−l1)² + (u2−p2)²), δ + √((u1−p1)² + (p2−l2)²).
 */
export function differenceInterval(s1: number, n1: number, s2: number, n2: number, confidence = 0.95): Interval {
  return hybridDifference(wilsonInterval(s1, n1, confidence), wilsonInterval(s2, n2, confidence));
}

/** Newcombe's hybrid combination of two single-proportion intervals (a − b), whatever made them. */
export function hybridDifference(a: Interval, b: Interval): Interval {
  const d = a.estimate - b.estimate;
  return {
    estimate: d,
    lower: d - Math.sqrt((a.estimate - a.lower) ** 2 + (b.upper - b.estimate) ** 2),
    upper: d + Math.sqrt((a.upper - a.estimate) ** 2 + (b.estimate - b.lower) ** 2),
  };
}

/**
 * P(p1 > p2) when p1 ~ Beta(1 + s1, 1 + n1 − s1) and p2 ~ Beta(1 + s2, 1 + n2 − s2) (uniform
 * priors), by the exact finite sum for integer Beta parameters:
 * P(X > Y) = Σ_{i=0}^{a1−1} B(a2 + i, b1 + b2) / ((b1 + i) · B(1 + i, b1) · B(a2, b2)).
 */
export function probabilityGreater(s1: number, n1: number, s2: number, n2: number): number {
  checkCounts(s1, n1);
  checkCounts(s2, n2);
  const [a1, b1, a2, b2] = [1 + s1, 1 + n1 - s1, 1 + s2, 1 + n2 - s2];
  let total = 0;
  for (let i = 0; i < a1; i++) {
    total += Math.exp(logBeta(a2 + i, b1 + b2) - Math.log(b1 + i) - logBeta(1 + i, b1) - logBeta(a2, b2));
  }
  return Math.min(1, Math.max(0, total));
}

export interface Group {
  successes: number;
  trials: number;
}

export interface ShrinkResult {
  prior: { alpha: number; beta: number; mean: number };
  groups: (Interval & { raw: number })[];
}

/**
 * Empirical-Bayes beta-binomial shrinkage: the Beta(α, β) prior maximising the beta-binomial
 * marginal likelihood of all groups (searched over mean and log concentration), then each group's
 * posterior Beta(α + s, β + n − s): its mean and central 95 % interval.
 * `prior` skips the search and uses the one given (a prior found earlier for the same job type:
 * one more report moves it by next to nothing, and the search is the costly part).
 */
export function shrinkProportions(
  groups: Group[],
  confidence = 0.95,
  prior?: { alpha: number; beta: number },
): ShrinkResult {
  if (groups.length === 0) throw new RangeError("need at least one group");
  for (const g of groups) checkCounts(g.successes, g.trials);
  if (prior) return posteriors(groups, prior.alpha, prior.beta, confidence);
  // Groups with the same counts add the same term: sum each distinct (s, n) once, times its count.
  const distinct = new Map<string, { s: number; f: number; count: number }>();
  for (const g of groups) {
    const key = `${g.successes}/${g.trials}`;
    const d = distinct.get(key);
    if (d) d.count++;
    else distinct.set(key, { s: g.successes, f: g.trials - g.successes, count: 1 });
  }
  const terms = [...distinct.values()];
  const loglik = (mu: number, logK: number) => {
    const k = Math.exp(logK);
    const a = mu * k;
    const b = (1 - mu) * k;
    const prior = logBeta(a, b);
    let l = 0;
    for (const t of terms) l += t.count * (logBeta(a + t.s, b + t.f) - prior);
    return l;
  };
  const pooled = groups.reduce((s, g) => s + g.successes, 0) / groups.reduce((s, g) => s + g.trials, 0);
  let mu = Math.min(0.99, Math.max(0.01, pooled));
  let logK = Math.log(10);
  // Alternate golden-section searches on each coordinate; the likelihood is smooth and unimodal
  // enough in each for this to settle in a few rounds. One new evaluation per step (the other
  // interior point is kept), stopping once the bracket is below 1e-7; rounds stop when both settle.
  const golden = (f: (x: number) => number, lo: number, hi: number) => {
    const g = (Math.sqrt(5) - 1) / 2;
    let a = lo,
      b = hi,
      c = b - g * (b - a),
      d = a + g * (b - a);
    let fc = f(c),
      fd = f(d);
    while (b - a > 1e-7) {
      if (fc > fd) {
        b = d;
        d = c;
        fd = fc;
        c = b - g * (b - a);
        fc = f(c);
      } else {
        a = c;
        c = d;
        fc = fd;
        d = a + g * (b - a);
        fd = f(d);
      }
    }
    return (a + b) / 2;
  };
  for (let round = 0; round < 8; round++) {
    const [m0, k0] = [mu, logK];
    mu = golden((m) => loglik(m, logK), 1e-4, 1 - 1e-4);
    logK = golden((k) => loglik(mu, k), Math.log(0.5), Math.log(1e5));
    if (Math.abs(mu - m0) < 1e-6 && Math.abs(logK - k0) < 1e-5) break;
  }
  const k = Math.exp(logK);
  return posteriors(groups, mu * k, (1 - mu) * k, confidence);
}

function posteriors(groups: Group[], alpha: number, beta: number, confidence: number): ShrinkResult {
  const tail = (1 - confidence) / 2;
  const mu = alpha / (alpha + beta);
  return {
    prior: { alpha, beta, mean: mu },
    groups: groups.map((g) => {
      const a = alpha + g.successes;
      const b = beta + g.trials - g.successes;
      return {
        raw: g.successes / g.trials,
        estimate: a / (a + b),
        lower: betaQuantile(tail, a, b),
        upper: betaQuantile(1 - tail, a, b),
      };
    }),
  };
}
