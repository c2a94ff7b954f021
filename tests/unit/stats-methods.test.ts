// The methods of issue 16 against worked examples and independent recomputation (sources named
// beside each check; see ../shared/REFERENCES.md). "Recomputed (numpy/scipy)" means the value was
// worked out again outside this code base with a separate dense implementation in numpy/scipy.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  clusteredWilson,
  differenceInterval,
  distinguishable,
  kaplanMeier,
  logisticFit,
  medianInterval,
  pooledLogisticFit,
  pooledPredict,
  wilsonInterval,
  type PooledRow,
} from "~/stats";

const near = (actual: number | null | undefined, expected: number, tol: number) => {
  expect(actual).not.toBeNull();
  expect(Math.abs(actual! - expected)).toBeLessThanOrEqual(tol);
};
const seed = 16;
const logit = (p: number) => Math.log(p / (1 - p));

/** P(B ≤ k − 1), B ~ Binomial(n, ½), exactly, in integer arithmetic. */
function exactTail(n: number, k: number): number {
  let c = 1n,
    sum = 0n;
  for (let i = 0; i < k; i++) {
    sum += c;
    c = (c * BigInt(n - i)) / BigInt(i + 1);
  }
  return Number((sum * 10n ** 18n) / 2n ** BigInt(n)) / 1e18;
}

describe("medianInterval", () => {
  // Conover (1999), Practical Nonparametric Statistics, 3rd ed. (method from memory); coverage
  // 1 − 2·P(B ≤ k − 1) recomputed from the binomial (scipy: 0.96875 and 0.978515625).
  it("n = 6 → [x(1), x(6)] at 0.96875 (recomputed)", () => {
    const m = medianInterval([6, 1, 5, 2, 4, 3])!;
    expect(m).toEqual({ estimate: 3.5, lower: 1, upper: 6, coverage: expect.closeTo(0.96875, 12) });
  });
  it("n = 10 → [x(2), x(9)] at 0.978515625 (recomputed)", () => {
    const m = medianInterval([10, 9, 8, 7, 6, 5, 4, 3, 2, 1])!;
    expect([m.lower, m.upper, m.estimate]).toEqual([2, 9, 5.5]);
    expect(m.coverage).toBeCloseTo(0.978515625, 12);
  });
  it("is null for n ≤ 5 at 95 %: [x(1), x(5)] covers only 0.9375 (recomputed)", () => {
    for (let n = 0; n <= 5; n++) expect(medianInterval(Array.from({ length: n }, (_, i) => i))).toBeNull();
    expect(medianInterval([1, 2, 3, 4, 5], 0.9)).toMatchObject({ lower: 1, upper: 5, coverage: 0.9375 });
  });
  it("stays finite for large n (no underflow of 2^−n)", () => {
    const m = medianInterval(Array.from({ length: 5000 }, (_, i) => i))!;
    expect(m.coverage).toBeGreaterThanOrEqual(0.95);
    expect(m.coverage).toBeLessThan(0.96);
  });

  it("contains its estimate, reaches the level asked, and the next k would not (property; exact integer binomial)", () => {
    const values = fc.array(fc.integer({ min: -1000, max: 1000 }), { minLength: 1, maxLength: 120 });
    const level = fc.constantFrom(0.8, 0.9, 0.95, 0.99);
    fc.assert(
      fc.property(values, level, (xs, conf) => {
        const m = medianInterval(xs, conf);
        const n = xs.length;
        const coverage = (k: number) => 1 - 2 * exactTail(n, k);
        if (m === null) return coverage(1) < conf;
        const k = [...Array(n).keys()].map((i) => i + 1).find((j) => Math.abs(coverage(j) - m.coverage) < 1e-9);
        if (k === undefined) return false;
        const sorted = [...xs].sort((a, b) => a - b);
        return (
          m.lower === sorted[k - 1] &&
          m.upper === sorted[n - k] &&
          m.lower <= m.estimate &&
          m.estimate <= m.upper &&
          m.coverage >= conf &&
          coverage(k + 1) < conf
        );
      }),
      { seed, numRuns: 300 },
    );
  });
});

describe("kaplanMeier", () => {
  // Freireich et al. (1963), Blood 21:699–716, 6-MP arm, as printed by Gehan (1965), Biometrika
  // 52:203–223 (weeks; + censored). Data as in REFERENCES.md; the set is documented as R's MASS::gehan
  // and KMsurv::drug6mp (their help pages were found, but they describe the data without printing a
  // survival table, and no printed table could be reached): the steps below are from memory and
  // recomputed exactly as products of (1 − d/n), e.g. S(7) = 18/21 · 16/17 (and with numpy/scipy).
  const times = [6, 6, 6, 6, 7, 9, 10, 10, 11, 13, 16, 17, 19, 20, 22, 23, 25, 32, 32, 34, 35];
  const freed = [1, 1, 1, 0, 1, 0, 1, 0, 0, 1, 1, 0, 0, 0, 1, 1, 0, 0, 0, 0, 0].map(Boolean);
  const km = kaplanMeier(times, freed);

  it("reproduces the product-limit steps (from memory, recomputed)", () => {
    const expected: [number, number, number, number][] = [
      [6, 21, 3, 18 / 21],
      [7, 17, 1, (18 / 21) * (16 / 17)],
      [10, 15, 1, 0.752941],
      [13, 12, 1, 0.690196],
      [16, 11, 1, 0.627451],
      [22, 7, 1, 0.537815],
      [23, 6, 1, 0.448179],
    ];
    expect(km.steps.map((s) => [s.time, s.atRisk, s.events])).toEqual(expected.map(([t, n, d]) => [t, n, d]));
    km.steps.forEach((s, i) => near(s.survival, expected[i]![3], 1e-6));
    // The three-decimal values quoted for this example: .857 .807 .753 .690 .627 .538 .448 (from memory).
    expect(km.steps.map((s) => s.survival.toFixed(3))).toEqual([
      "0.857",
      "0.807",
      "0.753",
      "0.690",
      "0.627",
      "0.538",
      "0.448",
    ]);
  });
  it("gives median 23 weeks (from memory: Gehan's 6-MP arm), log-log Brookmeyer–Crowley limits 13 to not reached (recomputed)", () => {
    // Bands S^exp(±z·se), Greenwood: at 13 weeks 0.4316–0.8491 (first lower band ≤ 0.5); the upper
    // band ends at 0.6801 at 23 weeks, so the upper limit is not reached (recomputed, numpy/scipy;
    // R's survfit with conf.type = "log-log" prints 23, 13, NA — from memory).
    expect(km.median).toBe(23);
    expect(km.lower).toBe(13);
    expect(km.upper).toBeNull();
  });
  it("has no median where the curve stays above 0.5, and takes the midpoint where it sits at 0.5 (R's convention)", () => {
    expect(kaplanMeier([1, 2, 3, 4], [true, false, false, false])).toMatchObject({ median: null, upper: null });
    expect(kaplanMeier([1, 2, 3, 4], [true, true, true, true]).median).toBe(2.5);
  });
  it("throws on mismatched lengths (programmer error)", () => {
    expect(() => kaplanMeier([1, 2], [true])).toThrow(RangeError);
  });

  it("is non-increasing in [0, 1], and lower ≤ median ≤ upper where they exist (property)", () => {
    const job = fc.record({ t: fc.integer({ min: 1, max: 40 }), freed: fc.boolean() });
    fc.assert(
      fc.property(fc.array(job, { minLength: 1, maxLength: 80 }), (jobs) => {
        const r = kaplanMeier(
          jobs.map((j) => j.t),
          jobs.map((j) => j.freed),
        );
        let prev = 1;
        for (const s of r.steps) {
          if (!(s.survival >= 0 && s.survival <= prev)) return false;
          prev = s.survival;
        }
        if (r.median !== null && r.lower !== null && r.lower > r.median) return false;
        if (r.median !== null && r.upper !== null && r.upper < r.median) return false;
        return true;
      }),
      { seed, numRuns: 300 },
    );
  });
});

describe("pooledLogisticFit", () => {
  // Dalal, Fowlkes & Hoadley (1989), JASA 84:945–957: Challenger O-ring data (REFERENCES.md).
  const temp = [66, 70, 69, 68, 67, 72, 73, 70, 57, 63, 70, 78, 67, 53, 67, 75, 70, 81, 76, 79, 75, 76, 58];
  const distress = [0, 1, 0, 0, 0, 0, 0, 0, 1, 1, 1, 0, 0, 1, 0, 0, 0, 0, 0, 0, 1, 0, 1];
  const challenger: PooledRow[] = temp.map((x, i) => ({ group: "flights", x, y: distress[i]! }));

  it("without the penalty, one group reproduces the textbook ML fit (from memory, recomputed), to 1e-3", () => {
    const fit = pooledLogisticFit(challenger, { firth: false });
    expect(fit.converged).toBe(true);
    near(fit.groups[0]!.intercept, 15.0429, 1e-3);
    near(fit.groups[0]!.se, 7.3786, 1e-3);
    near(fit.slope, -0.23216, 1e-3);
    near(fit.slopeSE, 0.10824, 1e-3);
    // and agrees with the one-predictor fit already in the module
    const single = logisticFit(temp, distress);
    near(fit.groups[0]!.intercept, single.intercept, 1e-7);
    near(fit.covariance[0]![1], single.covariance[0][1], 1e-7);
  });

  it("without the penalty, two groups sharing a slope (recomputed by construction from Dalal et al.'s fit)", () => {
    // The same flights again as a second group with x shifted by 10: the common-slope ML fit is then
    // exact for both — slope unchanged, α₂ = α₁ − 10·β. Each group adds the same information about
    // the slope, so its SE is divided by √2; an intercept's variance becomes V_αα − V_αβ²/(2·V_ββ)
    // (block inverse, worked from the one-group covariance).
    const rows = [...challenger, ...temp.map((x, i) => ({ group: "shifted", x: x + 10, y: distress[i]! }))];
    const fit = pooledLogisticFit(rows, { firth: false });
    near(fit.slope, -0.23216, 1e-3);
    near(fit.groups[0]!.intercept, 15.0429, 1e-3);
    near(fit.groups[1]!.intercept, 15.0429 + 10 * 0.23216, 1e-2);
    near(fit.slopeSE, 0.10824 / Math.SQRT2, 1e-3);
    const [[vaa, vab], [, vbb]] = logisticFit(temp, distress).covariance;
    near(fit.groups[0]!.se, Math.sqrt(vaa - (vab * vab) / (2 * vbb)), 1e-6);
  });

  it("without the penalty, two groups match a dense fit with group dummies (recomputed, numpy/scipy)", () => {
    // Second group invented for the check; dense Newton–Raphson on the design [dummy a, dummy b, x].
    const xb = [55, 58, 60, 62, 64, 65, 66, 68, 70, 71, 72, 74, 75, 77, 80];
    const yb = [1, 1, 0, 1, 1, 0, 1, 0, 1, 0, 0, 0, 1, 0, 0];
    const fit = pooledLogisticFit([...challenger, ...xb.map((x, i) => ({ group: "b", x, y: yb[i]! }))], {
      firth: false,
    });
    near(fit.groups[0]!.intercept, 12.6177093681, 1e-6);
    near(fit.groups[1]!.intercept, 13.1474305899, 1e-6);
    near(fit.slope, -0.1964832667, 1e-8);
    near(fit.groups[0]!.se, 4.8673398403, 1e-6);
    near(fit.groups[1]!.se, 4.8429282031, 1e-6);
    near(fit.slopeSE, 0.0711842656, 1e-8);
    near(fit.covariance[0]![1], 23.241597083, 1e-5);
    near(fit.covariance[1]![2], -0.34195252119, 1e-7);
  });

  it("with Firth, a saturated two-cell model adds ½ to each cell even under separation (recomputed: exact property)", () => {
    // One group, x ∈ {0, 1}: the penalty factorises into ½·log(p(1−p)) per cell, so each cell's
    // estimate is (s + ½)/(n + 1) (Firth 1993; the Jeffreys-prior posterior mode). 0/6 at x = 0 and
    // 5/5 at x = 1 is completely separated: ML has no finite estimate.
    const rows: PooledRow[] = [
      ...Array.from({ length: 6 }, () => ({ group: 1, x: 0, y: 0 })),
      ...Array.from({ length: 5 }, () => ({ group: 1, x: 1, y: 1 })),
    ];
    const fit = pooledLogisticFit(rows);
    expect(fit.converged).toBe(true);
    near(fit.groups[0]!.intercept, logit(0.5 / 7), 1e-8);
    near(fit.slope, logit(5.5 / 6) - logit(0.5 / 7), 1e-8);
    const ml = pooledLogisticFit(rows, { firth: false });
    expect(ml.converged).toBe(false);
  });

  it("with Firth, three groups with one separated group give finite estimates (recomputed, numpy/scipy)", () => {
    // No published Firth example could be reached (logistf's sex2 data found by name only).
    const groups: [string, number[], number[]][] = [
      ["A", [-1, -0.5, 0, 0.5, 1], [1, 1, 1, 1, 1]],
      ["B", [-1, -0.5, 0, 0.5, 1, 1.5], [0, 0, 1, 0, 1, 1]],
      ["C", [-1.5, -1, 0, 0.5, 1], [0, 0, 0, 1, 0]],
    ];
    const rows = groups.flatMap(([group, xs, ys]) => xs.map((x, i) => ({ group, x, y: ys[i]! })));
    const fit = pooledLogisticFit(rows);
    expect(fit.converged).toBe(true);
    const expected = [
      [2.6612801174, 1.6933865809],
      [-0.294401463, 0.9359933798],
      [-1.1377285538, 1.1436182923],
    ];
    fit.groups.forEach((row, k) => {
      near(row.intercept, expected[k]![0]!, 1e-6);
      near(row.se, expected[k]![1]!, 1e-6);
    });
    near(fit.slope, 1.1776058521, 1e-6);
    near(fit.slopeSE, 0.871459548, 1e-6);
    const atZero = pooledPredict(fit, "A", 0);
    expect(atZero.estimate).toBeLessThan(1);
    expect(atZero.lower).toBeLessThan(atZero.estimate);
  });

  it("with Firth, a job of 8,300 reports over 100 models settles in a few steps, whatever the rows' order (recomputed: exact property)", () => {
    // At this size the penalised likelihood (≈ −4,300) cannot be summed to better than ~1e-12, so a
    // line search near the optimum judged rounding noise and the fit stalled as "did not settle";
    // near the optimum the Newton step is now taken whole. Data: a logistic law with slope 1.25 per
    // bar (100 kPa per 80 kPa of the simulated law), seeded.
    let state = 7;
    const rnd = () => (state = (state * 16807) % 2147483647) / 2147483647;
    const rows: PooledRow[] = Array.from({ length: 8300 }, (_, i) => {
      const kpa = 450 + rnd() * 350;
      return { group: i % 100, x: (kpa - 620.5) / 100, y: rnd() < 1 / (1 + Math.exp(-(kpa - 600) / 80)) ? 1 : 0 };
    });
    const fit = pooledLogisticFit(rows);
    expect(fit.converged).toBe(true);
    expect(fit.iterations).toBeLessThanOrEqual(12);
    near(fit.slope, 1.25, 4 * fit.slopeSE);
    const reversed = pooledLogisticFit([...rows].reverse());
    expect(reversed.converged).toBe(true);
    near(reversed.slope, fit.slope, 1e-7);
    for (const g of fit.groups) near(reversed.groups.find((r) => r.group === g.group)!.intercept, g.intercept, 1e-7);
  });

  it("predicts with the Wald interval on the logit scale (recomputed by hand from the covariance)", () => {
    const fit = pooledLogisticFit(challenger, { firth: false });
    const at70 = pooledPredict(fit, "flights", 70);
    const [[v00, v01], [, v11]] = fit.covariance as [[number, number], [number, number]];
    const eta = fit.groups[0]!.intercept + fit.slope * 70;
    const se = Math.sqrt(v00 + 140 * v01 + 4900 * v11);
    near(at70.lower, 1 / (1 + Math.exp(-(eta - 1.959964 * se))), 1e-6);
    expect(() => pooledPredict(fit, "no such model", 70)).toThrow(RangeError);
  });

  it("handles hundreds of groups, and does not depend on their order (property)", () => {
    const rows: PooledRow[] = [];
    let state = 7;
    const rand = () => (state = (state * 48271) % 2147483647) / 2147483647;
    for (let g = 0; g < 300; g++) {
      const base = rand() * 3 - 1.5;
      for (let i = 0; i < 8; i++) {
        const x = rand() * 2 - 1;
        rows.push({ group: `m${g}`, x, y: rand() < 1 / (1 + Math.exp(-(base + 0.9 * x))) ? 1 : 0 });
      }
    }
    const fit = pooledLogisticFit(rows);
    expect(fit.converged).toBe(true);
    expect(fit.groups).toHaveLength(300);
    const reversed = pooledLogisticFit([...rows].reverse());
    near(reversed.slope, fit.slope, 1e-8);
    near(reversed.groups.find((r) => r.group === "m17")!.intercept, fit.groups[17]!.intercept, 1e-8);
  });

  it("gives intervals that contain their estimate on any small data set, separated or not (property)", () => {
    const row = fc.record({
      group: fc.integer({ min: 0, max: 3 }),
      x: fc.integer({ min: -3, max: 3 }),
      y: fc.constantFrom(0, 1),
    });
    fc.assert(
      fc.property(fc.array(row, { minLength: 2, maxLength: 40 }), (rows) => {
        rows.push({ group: 0, x: -2, y: 0 }, { group: 0, x: 2, y: 1 }); // x varies within a group
        const fit = pooledLogisticFit(rows);
        if (!fit.converged) return false;
        return fit.groups.every((r) => {
          const p = pooledPredict(fit, r.group, 0.5);
          return Number.isFinite(r.intercept) && p.lower <= p.estimate && p.estimate <= p.upper;
        });
      }),
      { seed, numRuns: 200 },
    );
  });
});

describe("clusteredWilson", () => {
  it("with one report per reporter equals wilsonInterval, design effect 1 (recomputed: the two variances coincide)", () => {
    for (const [s, n] of [
      [81, 263],
      [15, 148],
      [0, 20],
      [7, 7],
    ] as const) {
      const clusters = Array.from({ length: n }, (_, i) => ({ successes: i < s ? 1 : 0, trials: 1 }));
      const c = clusteredWilson(clusters);
      const w = wilsonInterval(s, n);
      expect(c.designEffect).toBe(1);
      near(c.lower, w.lower, 1e-12);
      near(c.upper, w.upper, 1e-12);
      expect(c.clusters).toBe(n);
    }
  });

  it("works a hand example with clustering (hand-worked; Wilson limits recomputed, numpy/scipy)", () => {
    // Four reporters, five reports each: 4/5, 1/5, 5/5, 2/5. n = 20, p = 12/20 = 0.6.
    // Residuals yᵢ − p·mᵢ = 1, −2, 2, −1; Σ² = 10. Cluster variance 4/3 · 10/20² = 1/30.
    // Binomial variance with the same factor 20/19 · 0.24/20 = 0.24/19.
    // deff = (1/30) / (0.24/19) = 19/7.2 = 2.638889; effective n = 20/deff = 144/19 = 7.578947.
    // Wilson at p = 0.6, n = 7.578947: 0.280252 to 0.852475 (vs 0.386582 to 0.781193 unclustered).
    const c = clusteredWilson([
      { successes: 4, trials: 5 },
      { successes: 1, trials: 5 },
      { successes: 5, trials: 5 },
      { successes: 2, trials: 5 },
    ]);
    near(c.designEffect, 19 / 7.2, 1e-12);
    near(c.effectiveN, 144 / 19, 1e-12);
    near(c.lower, 0.28025178025, 1e-9);
    near(c.upper, 0.8524746262, 1e-9);
    expect(c.estimate).toBe(0.6);
  });

  it("takes deff = 1 at p = 0 or 1 and with a single reporter", () => {
    expect(
      clusteredWilson([
        { successes: 0, trials: 4 },
        { successes: 0, trials: 9 },
      ]).designEffect,
    ).toBe(1);
    expect(
      clusteredWilson([
        { successes: 4, trials: 4 },
        { successes: 9, trials: 9 },
      ]),
    ).toMatchObject({ designEffect: 1, upper: 1 });
    expect(clusteredWilson([{ successes: 3, trials: 8 }]).designEffect).toBe(1);
  });

  it("contains its estimate with deff ≥ 1 (property)", () => {
    const cluster = fc
      .integer({ min: 1, max: 12 })
      .chain((m) => fc.record({ successes: fc.integer({ min: 0, max: m }), trials: fc.constant(m) }));
    fc.assert(
      fc.property(fc.array(cluster, { minLength: 1, maxLength: 30 }), (cs) => {
        const c = clusteredWilson(cs);
        return c.designEffect >= 1 && c.lower <= c.estimate && c.estimate <= c.upper && c.lower >= 0 && c.upper <= 1;
      }),
      { seed, numRuns: 300 },
    );
  });
});

describe("distinguishable", () => {
  it("tells apart 60/100 and 45/100 though their 95 % intervals overlap (recomputed, numpy/scipy)", () => {
    // Wilson: 0.5020–0.6906 and 0.3561–0.5476 overlap; Newcombe difference 0.15, 0.0117 to 0.2804.
    const a = wilsonInterval(60, 100),
      b = wilsonInterval(45, 100);
    expect(a.lower).toBeLessThan(b.upper);
    const r = distinguishable(60, 100, 45, 100);
    expect(r.distinguishable).toBe(true);
    near(r.difference.lower, 0.0117239353, 1e-9);
    near(r.difference.upper, 0.280448521, 1e-9);
    expect(distinguishable(45, 100, 60, 100).distinguishable).toBe(true);
    expect(distinguishable(55, 100, 45, 100).distinguishable).toBe(false);
  });

  it("uses the hybrid score difference: 56/70 vs 48/80 (Newcombe 1998 example, from memory; recomputed)", () => {
    // 56/70 = 0.8 and 48/80 = 0.6, so the difference is 0.2 (not 0.1833 as once recalled);
    // method 10: 0.0524 to 0.3339 (from memory; numpy/scipy: 0.052431 to 0.333873).
    const r = distinguishable(56, 70, 48, 80);
    expect(r.difference).toEqual(differenceInterval(56, 70, 48, 80));
    near(r.difference.lower, 0.0524, 5e-5);
    near(r.difference.upper, 0.3339, 5e-5);
    expect(r.distinguishable).toBe(true);
  });

  it("with design effects, works each side at its effective n (recomputed from the hand example above)", () => {
    // 12/20 with deff 2.638889 is Wilson 0.280252–0.852475 (above); against 2/20 (plain Wilson
    // 0.027866–0.301034) the difference is 0.5 − √(0.319748² + 0.201034²) = 0.122305.
    const r = distinguishable(12, 20, 2, 20, 0.95, { designEffect1: 19 / 7.2 });
    const w = wilsonInterval(2, 20);
    near(r.difference.lower, 0.5 - Math.hypot(0.6 - 0.28025178025, w.upper - 0.1), 1e-9);
    expect(r.distinguishable).toBe(true);
    expect(distinguishable(12, 20, 5, 20, 0.95, { designEffect1: 19 / 7.2 }).distinguishable).toBe(false);
    expect(distinguishable(12, 20, 5, 20).distinguishable).toBe(true);
  });

  it("gives a difference interval that contains its estimate (property)", () => {
    const counts = fc
      .integer({ min: 1, max: 300 })
      .chain((n) => fc.tuple(fc.integer({ min: 0, max: n }), fc.constant(n)));
    fc.assert(
      fc.property(counts, counts, fc.double({ min: 1, max: 5, noNaN: true }), ([s1, n1], [s2, n2], deff) => {
        const { difference: d } = distinguishable(s1, n1, s2, n2, 0.95, { designEffect1: deff });
        return d.lower <= d.estimate && d.estimate <= d.upper && d.lower >= -1 && d.upper <= 1;
      }),
      { seed, numRuns: 300 },
    );
  });
});
