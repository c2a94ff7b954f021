// Bench figures across rigs (app/bench/across-rigs.ts) against published worked examples; the source
// of each check value is named beside it (see ../shared/REFERENCES.md, "Calibration and rigs").
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { hksjInterval, randomEffects, type Study } from "~/bench";
import { tCritical } from "~/stats";
import bcg from "./fixtures/bcg-trials.json";

const near = (actual: number | null, expected: number, tol: number) => {
  expect(actual).not.toBeNull();
  expect(Math.abs(actual! - expected)).toBeLessThanOrEqual(tol);
};

// Log risk ratio and its variance from each trial's 2×2 table, as metafor's escalc(measure = "RR")
// computes them: log((a/(a+b)) / (c/(c+d))), 1/a − 1/(a+b) + 1/c − 1/(c+d).
const trials = bcg.trials as [string, number, number, number, number, number][];
const studies: Study[] = trials.map(([, , a, b, c, d]) => ({
  mean: Math.log(a / (a + b) / (c / (c + d))),
  variance: 1 / a - 1 / (a + b) + 1 / c - 1 / (c + d),
}));

describe("randomEffects on the 13 BCG vaccine trials (Colditz et al. 1994)", () => {
  it("starts from the log risk ratios and variances metafor prints (published, 4 decimals)", () => {
    // metafor README.md, example section: escalc() output for dat.bcg (github.com/wviechtb/metafor).
    studies.forEach((s, i) => {
      near(s.mean, bcg.printedLogRiskRatio[i]!, 5e-5);
      near(s.variance, bcg.printedVariance[i]!, 5e-5);
    });
  });

  const fit = randomEffects(studies);
  it("matches the DerSimonian–Laird fit (published)", () => {
    // metafor tests/testthat/test_misc_metan_vs_rma.uni_with_dat.bcg.r, "RE model w/ DL estimator,
    // measure='RR'" (rma(method = "DL"), checked there against Stata's metan): estimate −0.7141,
    // CI −1.0644 to −0.3638, z −3.9952, τ² 0.3088, I² 92.1173 %; Q 152.2330 from the FE block of the
    // same file. REFERENCES.md's from-memory figures (τ² ≈ 0.309, −0.714, SE ≈ 0.179) agree.
    near(fit.estimate, -0.7141, 5e-5);
    near(fit.waldLower, -1.0644, 5e-5);
    near(fit.waldUpper, -0.3638, 5e-5);
    near(fit.estimate / fit.standardError, -3.9952, 5e-4);
    near(fit.standardError, 0.179, 5e-4);
    near(fit.tau2, 0.3088, 5e-5);
    near(fit.i2, 0.921173, 5e-7);
    near(fit.q, 152.233, 5e-4);
    expect(fit.k).toBe(13);
  });

  it("headlines the DerSimonian–Laird interval from 10 rigs on", () => {
    expect(fit.method).toBe("DerSimonian-Laird");
    expect([fit.lower, fit.upper]).toEqual([fit.waldLower, fit.waldUpper]);
  });

  it("computes the Hartung–Knapp interval as metafor does at a given τ² (published)", () => {
    // metafor README.md, example: rma(yi, vi, data = dat, test = "knha") with the REML τ² = 0.3132:
    // estimate −0.7145, se 0.1808, CI −1.1084 to −0.3206 (t with 12 df). τ² is printed to 4 decimals,
    // so the tolerance allows for its rounding.
    const knha = hksjInterval(studies, 0.3132)!;
    near(knha.estimate, -0.7145, 2e-4);
    near(knha.standardError, 0.1808, 2e-4);
    near(knha.lower, -1.1084, 3e-4);
    near(knha.upper, -0.3206, 3e-4);
  });

  it("gives the DL + HKSJ interval and the prediction interval of their formulas (recomputed)", () => {
    // Recomputed by hand here from the defining formulas with the DL τ²: Hartung & Knapp (2001),
    // Sidik & Jonkman (2002); Higgins, Thompson & Spiegelhalter (2009) for the prediction interval.
    const w = studies.map((s) => 1 / (s.variance + fit.tau2));
    const sw = w.reduce((a, v) => a + v, 0);
    const mu = studies.reduce((a, s, i) => a + w[i]! * s.mean, 0) / sw;
    const scale = studies.reduce((a, s, i) => a + w[i]! * (s.mean - mu) ** 2, 0) / (studies.length - 1);
    expect(scale).toBeGreaterThan(1); // so the floored variant equals the plain one here
    const se = Math.sqrt(scale / sw);
    near(tCritical(0.95, 12), 2.178813, 1e-6); // t(0.975, 12), printed t tables (from memory)
    near(fit.hksjLower, mu - 2.178813 * se, 1e-6);
    near(fit.hksjUpper, mu + 2.178813 * se, 1e-6);
    const half = 2.200985 * Math.sqrt(fit.tau2 + 1 / sw); // t(0.975, 11), printed t tables (from memory)
    near(fit.predictionLower, mu - half, 1e-5);
    near(fit.predictionUpper, mu + half, 1e-5);
  });

  it("headlines the HKSJ interval with fewer than 10 rigs", () => {
    const few = randomEffects(studies.slice(0, 5));
    expect(few.method).toBe("DerSimonian-Laird with Hartung-Knapp-Sidik-Jonkman");
    expect([few.lower, few.upper]).toEqual([few.hksjLower, few.hksjUpper]);
  });
});

describe("randomEffects, edge cases and properties", () => {
  it("returns one study's own mean and z interval, τ² = 0 (definition)", () => {
    const one = randomEffects([{ mean: 5, variance: 4 }]);
    expect(one.estimate).toBe(5);
    expect(one.tau2).toBe(0);
    expect(one.i2).toBe(0);
    near(one.lower, 5 - 1.959964 * 2, 1e-5); // z = 1.959964 (REFERENCES.md)
    near(one.upper, 5 + 1.959964 * 2, 1e-5);
    expect([one.predictionLower, one.predictionUpper, one.hksjLower]).toEqual([null, null, null]);
  });

  it("has no prediction interval for two rigs, one for three (Higgins et al. 2009: t with k − 2 df)", () => {
    const two = randomEffects([
      { mean: 1, variance: 1 },
      { mean: 2, variance: 1 },
    ]);
    expect(two.predictionLower).toBeNull();
    const three = randomEffects([...studies.slice(0, 3)]);
    expect(three.predictionLower).not.toBeNull();
  });

  it("refuses empty input and non-positive variances", () => {
    expect(() => randomEffects([])).toThrow(RangeError);
    expect(() => randomEffects([{ mean: 1, variance: 0 }])).toThrow(RangeError);
  });

  const study = fc.record({
    mean: fc.double({ min: -1000, max: 1000, noNaN: true }),
    variance: fc.double({ min: 1e-3, max: 100, noNaN: true }),
  });

  it("gives I² = 0 for a single study, whatever Q's rounding residue (a case the property once found)", () => {
    const fit = randomEffects([{ mean: 1.991547284835001e-131, variance: 2.3479831706207275 }]);
    expect(fit.i2).toBe(0);
    expect(fit.tau2).toBe(0);
  });

  it("gives τ² = 0 and I² = 0 for identical studies (property)", () => {
    fc.assert(
      fc.property(study, fc.integer({ min: 1, max: 30 }), (s, k) => {
        const fit = randomEffects(Array.from({ length: k }, () => s));
        return fit.tau2 === 0 && fit.i2 === 0 && Math.abs(fit.estimate - s.mean) <= 1e-9 * (1 + Math.abs(s.mean));
      }),
    );
  });

  it("puts the estimate inside every interval it returns (property)", () => {
    fc.assert(
      fc.property(fc.array(study, { minLength: 1, maxLength: 25 }), (list) => {
        const fit = randomEffects(list);
        const inside = (lo: number | null, hi: number | null) =>
          lo === null || hi === null || (lo <= fit.estimate && fit.estimate <= hi);
        return (
          inside(fit.lower, fit.upper) &&
          inside(fit.waldLower, fit.waldUpper) &&
          inside(fit.hksjLower, fit.hksjUpper) &&
          inside(fit.predictionLower, fit.predictionUpper) &&
          fit.tau2 >= 0 &&
          fit.i2 >= 0 &&
          fit.i2 <= 1
        );
      }),
    );
  });
});
