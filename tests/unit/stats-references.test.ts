// The stats module against published worked examples (sources named beside each check; see
// ../shared/REFERENCES.md) and against jStat, the reference library.
import fc from "fast-check";
import seedrandom from "seedrandom";
import { describe, expect, it } from "vitest";
import {
  bootstrapInterval,
  correlation,
  differenceInterval,
  logisticFit,
  logisticPredict,
  meanIntervalFromSummary,
  probabilityGreater,
  shrinkProportions,
  tCritical,
  wilsonInterval,
  zCritical,
} from "~/stats";

const near = (actual: number, expected: number, tol: number) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol);

describe("Wilson score interval", () => {
  // Newcombe R.G. (1998), Statistics in Medicine 17:857–872, method 3 (published for 81/263 and
  // 15/148; from memory for 0/20 and 1/29; all recomputed). Four decimals, tolerance 5e-5.
  it.each([
    [81, 263, 0.2553, 0.3662],
    [15, 148, 0.0624, 0.1605],
    [0, 20, 0.0, 0.1611],
    [1, 29, 0.0061, 0.1718],
  ])("%i/%i → %f–%f", (s, n, lo, hi) => {
    const w = wilsonInterval(s, n);
    near(w.lower, lo, 5e-5);
    near(w.upper, hi, 5e-5);
  });

  it("uses z = 1.959964 at 95 % (REFERENCES.md; jStat normal quantile)", () => {
    near(zCritical(0.95), 1.959964, 1e-6);
  });

  const counts = fc
    .integer({ min: 1, max: 500 })
    .chain((n) => fc.tuple(fc.integer({ min: 0, max: n }), fc.constant(n)));
  it("lies in [0, 1] and contains its estimate (property)", () => {
    fc.assert(
      fc.property(counts, ([s, n]) => {
        const w = wilsonInterval(s, n);
        return w.lower >= 0 && w.upper <= 1 && w.lower <= w.estimate && w.estimate <= w.upper;
      }),
    );
  });
  it("narrows as n grows with the rate fixed (property)", () => {
    fc.assert(
      fc.property(counts, fc.integer({ min: 2, max: 10 }), ([s, n], k) => {
        const a = wilsonInterval(s, n);
        const b = wilsonInterval(s * k, n * k);
        return b.upper - b.lower < a.upper - a.lower;
      }),
    );
  });
});

describe("Student t interval", () => {
  it("reproduces the NIST/SEMATECH heat-flow meter example", () => {
    // NIST/SEMATECH e-Handbook of Statistical Methods §1.3.5.2, ZARR13 (n = 195): mean 9.261460,
    // s 0.02278881, t(0.975, 194) = 1.972268 (published), interval 9.258241–9.264679 (recomputed).
    near(tCritical(0.95, 194), 1.972268, 1e-6);
    const ci = meanIntervalFromSummary(9.26146, 0.02278881, 195);
    near(ci.lower, 9.258241, 1e-6);
    near(ci.upper, 9.264679, 1e-6);
    expect(ci.df).toBe(194);
  });
});

describe("bootstrap", () => {
  // Efron & Tibshirani (1993), An Introduction to the Bootstrap, Table 3.1: law school data.
  const lsat = [576, 635, 558, 578, 666, 580, 555, 661, 651, 605, 653, 575, 545, 572, 594];
  const gpa = [3.39, 3.3, 2.81, 3.03, 3.44, 3.07, 3.0, 3.43, 3.36, 3.13, 3.12, 2.74, 2.76, 2.88, 2.96];
  const pairs = lsat.map((l, i) => [l, gpa[i]!] as const);

  it("computes the published correlation 0.776374", () => {
    near(correlation(pairs), 0.776374, 1e-6);
  });

  it("gives a bootstrap standard error near 0.13 (Table 6.1, from memory: .132 at B = 3200)", () => {
    const b = bootstrapInterval(pairs, (s) => correlation(s), { resamples: 3200, seed: "law-school" });
    near(b.se, 0.132, 0.015);
    expect(b.lower).toBeLessThan(0.776374);
    expect(b.upper).toBeGreaterThan(0.776374);
    expect(b.upper).toBeLessThanOrEqual(1);
  });

  it("is reproducible: same seed, same answer", () => {
    const a = bootstrapInterval(pairs, correlation, { seed: 7 });
    const b = bootstrapInterval(pairs, correlation, { seed: 7 });
    expect(a).toEqual(b);
  });
});

describe("logistic regression", () => {
  // Dalal, Fowlkes & Hoadley (1989), JASA 84:945–957: Challenger O-ring data, 23 flights.
  const temp = [66, 70, 69, 68, 67, 72, 73, 70, 57, 63, 70, 78, 67, 53, 67, 75, 70, 81, 76, 79, 75, 76, 58];
  const distress = [0, 1, 0, 0, 0, 0, 0, 0, 1, 1, 1, 0, 0, 1, 0, 0, 0, 0, 0, 0, 1, 0, 1];

  it("matches the textbook maximum-likelihood fit (from memory, recomputed), to 1e-3", () => {
    const fit = logisticFit(temp, distress);
    expect(fit.converged).toBe(true);
    near(fit.intercept, 15.0429, 1e-3);
    near(fit.slope, -0.23216, 1e-3);
    near(fit.interceptSE, 7.3786, 1e-3);
    near(fit.slopeSE, 0.10824, 1e-3);
  });

  it("predicts with an interval that contains the estimate", () => {
    const fit = logisticFit(temp, distress);
    const at31 = logisticPredict(fit, 31);
    expect(at31.estimate).toBeGreaterThan(0.99);
    const at70 = logisticPredict(fit, 70);
    expect(at70.lower).toBeLessThan(at70.estimate);
    expect(at70.upper).toBeGreaterThan(at70.estimate);
  });
});

describe("difference of two proportions", () => {
  it("follows the hybrid score method (recomputed from the Wilson limits)", () => {
    // Newcombe (1998), Stat Med 17:873–890, example (a) 56/70 vs 48/80; method 10 gives
    // 0.0524 to 0.3339 (from memory). Recomputed here from the single-proportion Wilson limits.
    const d = differenceInterval(56, 70, 48, 80);
    near(d.estimate, 0.2, 1e-12);
    near(d.lower, 0.0524, 5e-5);
    near(d.upper, 0.3339, 5e-5);
    const a = wilsonInterval(56, 70),
      b = wilsonInterval(48, 80);
    near(d.lower, 0.2 - Math.hypot(a.estimate - a.lower, b.upper - b.estimate), 1e-12);
  });
});

describe("probability that one rate beats another", () => {
  it("agrees with a seeded simulation of the Beta posteriors to 0.005", () => {
    const rng = seedrandom("beta-check");
    // Beta(a, b) as the a-th of (a + b − 1) uniform order statistics, for integer parameters.
    const beta = (a: number, b: number) => {
      const u = Array.from({ length: a + b - 1 }, () => rng()).sort((x, y) => x - y);
      return u[a - 1]!;
    };
    const [s1, n1, s2, n2] = [30, 40, 22, 35];
    let wins = 0;
    const draws = 40_000;
    for (let i = 0; i < draws; i++) if (beta(1 + s1, 1 + n1 - s1) > beta(1 + s2, 1 + n2 - s2)) wins++;
    near(probabilityGreater(s1, n1, s2, n2), wins / draws, 0.005);
  });

  it("is 1/2 for identical records and complements itself", () => {
    near(probabilityGreater(7, 10, 7, 10), 0.5, 1e-9);
    near(probabilityGreater(9, 12, 4, 15) + probabilityGreater(4, 15, 9, 12), 1, 1e-9);
  });
});

describe("empirical-Bayes shrinkage", () => {
  it("pulls small groups toward the pooled rate more than large ones", () => {
    const r = shrinkProportions([
      { successes: 3, trials: 3 },
      { successes: 80, trials: 100 },
      { successes: 40, trials: 100 },
      { successes: 30, trials: 60 },
      { successes: 1, trials: 4 },
    ]);
    const [small, big] = [r.groups[0]!, r.groups[1]!];
    expect(small.estimate).toBeLessThan(small.raw);
    expect(Math.abs(big.estimate - big.raw)).toBeLessThan(Math.abs(small.estimate - small.raw));
    for (const g of r.groups) expect(g.lower <= g.estimate && g.estimate <= g.upper).toBe(true);
    expect(r.prior.alpha).toBeGreaterThan(0);
    expect(r.prior.beta).toBeGreaterThan(0);
  });
});

describe("median", () => {
  it("equals the middle of the sorted values, ties and even counts included (property)", async () => {
    const { median } = await import("~/stats");
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 30 }), { minLength: 1, maxLength: 60 }), (v) => {
        const s = [...v].sort((a, b) => a - b);
        const n = s.length;
        return median(v) === (n % 2 ? s[n >> 1]! : (s[(n >> 1) - 1]! + s[n >> 1]!) / 2);
      }),
    );
  });
});

describe("fast bootstrap of the median", () => {
  it("gives exactly what the general bootstrap gives for the same seed (property)", async () => {
    const { bootstrapMedianInterval, median } = await import("~/stats");
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 1, max: 500 }), { minLength: 1, maxLength: 40 }),
        fc.integer(),
        (v, seed) => {
          const a = bootstrapInterval(v, median, { resamples: 50, seed });
          const b = bootstrapMedianInterval(v, { resamples: 50, seed });
          return (
            a.lower === b.lower && a.upper === b.upper && a.estimate === b.estimate && Math.abs(a.se - b.se) < 1e-9
          );
        },
      ),
      { numRuns: 200 },
    );
  });
});
