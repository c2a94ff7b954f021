// Force against inlet pressure (app/bench/pressure-slope.ts) and the force a job takes
// (app/bench/force-for-job.ts) against published worked examples; each check names its source.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { chanceAtForce, forceCurve, forceForJob, forceForJobGrouped, pressureSlope, type ForceRow } from "~/bench";
import { RATED_INLET_KPA } from "~/domain";
import { zCritical } from "~/stats";
import bliss from "./fixtures/bliss-beetles.json";

const near = (actual: number | null, expected: number, tol: number) => {
  expect(actual).not.toBeNull();
  expect(Math.abs(actual! - expected)).toBeLessThanOrEqual(tol);
};

describe("pressureSlope", () => {
  // NIST Statistical Reference Datasets, linear regression, Norris (36 observations), certified values,
  // read in GSL's fit/test.c (which carries the NIST data and certified digits): B0 −0.262323073774029
  // (sd 0.232818234301152), B1 1.00211681802045 (sd 0.429796848199937E-03), residual sum of squares
  // 26.6173985294224. The residual SD √(RSS/34) is recomputed from that (0.884796396144373).
  // prettier-ignore
  const x = [0.2, 337.4, 118.2, 884.6, 10.1, 226.5, 666.3, 996.3, 448.6, 777.0, 558.2, 0.4, 0.6, 775.5, 666.9, 338.0,
    447.5, 11.6, 556.0, 228.1, 995.8, 887.6, 120.2, 0.3, 0.3, 556.8, 339.1, 887.2, 999.0, 779.0, 11.1, 118.3, 229.2,
    669.1, 448.9, 0.5];
  // prettier-ignore
  const y = [0.1, 338.8, 118.1, 888.0, 9.2, 228.1, 668.5, 998.5, 449.1, 778.9, 559.2, 0.3, 0.1, 778.1, 668.8, 339.3,
    448.9, 10.8, 557.7, 228.3, 998.0, 888.8, 119.6, 0.3, 0.6, 557.6, 339.3, 888.0, 998.5, 778.9, 10.2, 117.6, 228.9,
    668.4, 449.2, 0.2];
  const norris = x.map((pressureKpa, i) => ({ pressureKpa, force: y[i]! }));

  it("reproduces the NIST StRD Norris certified values (published)", () => {
    const fit = pressureSlope(norris, 500)!;
    near(fit.slope, 1.00211681802045, 1e-12);
    near(fit.intercept, -0.262323073774029, 1e-10);
    near(fit.slopeSE, 0.429796848199937e-3, 1e-14);
    near(fit.interceptSE, 0.232818234301152, 1e-11);
    near(fit.residualSD, Math.sqrt(26.6173985294224 / 34), 1e-11);
    expect(fit.n).toBe(36);
    // The mean at 500 with t(0.975, 34) = 2.032245 (t tables, from memory): recomputed from the formula.
    const sxx = x.reduce((a, v) => a + (v - x.reduce((s, w) => s + w, 0) / 36) ** 2, 0);
    const xBar = x.reduce((s, w) => s + w, 0) / 36;
    const half = 2.032245 * fit.residualSD * Math.sqrt(1 / 36 + (500 - xBar) ** 2 / sxx);
    near(fit.predicted, fit.intercept + fit.slope * 500, 1e-9);
    near(fit.predictedUpper - fit.predicted, half, 1e-6);
  });

  it("predicts at 90 psi by default and spans the measured pressures with its band", () => {
    const fit = pressureSlope([
      { pressureKpa: 550, force: 900 },
      { pressureKpa: 620, force: 1010 },
      { pressureKpa: 690, force: 1090 },
      { pressureKpa: 620, force: 990 },
    ])!;
    expect(fit.atKpa).toBe(RATED_INLET_KPA);
    expect(fit.band).toHaveLength(21);
    expect(fit.band[0]!.pressureKpa).toBe(550);
    expect(fit.band[20]!.pressureKpa).toBe(690);
    expect(fit.band.every((b) => b.lower <= b.fit && b.fit <= b.upper)).toBe(true);
  });

  it("is null with fewer than 3 points or one pressure only", () => {
    expect(
      pressureSlope([
        { pressureKpa: 600, force: 1 },
        { pressureKpa: 650, force: 2 },
      ]),
    ).toBeNull();
    expect(pressureSlope([600, 600, 600].map((pressureKpa, i) => ({ pressureKpa, force: i })))).toBeNull();
  });

  it("puts every estimate inside its interval (property)", () => {
    const point = fc.record({
      pressureKpa: fc.integer({ min: 300, max: 900 }),
      force: fc.double({ min: 0, max: 5000, noNaN: true }),
    });
    fc.assert(
      fc.property(fc.array(point, { minLength: 3, maxLength: 30 }), (points) => {
        const fit = pressureSlope(points);
        if (fit === null) return new Set(points.map((p) => p.pressureKpa)).size < 2;
        return (
          fit.slopeLower <= fit.slope &&
          fit.slope <= fit.slopeUpper &&
          fit.predictedLower <= fit.predicted &&
          fit.predicted <= fit.predictedUpper
        );
      }),
    );
  });
});

describe("forceForJob on the beetle mortality data (Bliss 1935)", () => {
  const groups = (bliss.groups as [number, number, number][]).map(([force, trials, successes]) => ({
    force,
    trials,
    successes,
  }));
  const fit = forceForJobGrouped(groups);

  it("matches the published logit fit", () => {
    // glmlab manual, binomial example (Dunn, USQ), agreeing with Dobson's book (from memory: −60.72, 34.27):
    // constant −60.717455 (SE 5.180701), dose 34.270326 (SE 2.912134), logit link.
    expect(fit.converged).toBe(true);
    near(fit.intercept, -60.717455, 5e-6);
    near(fit.slope, 34.270326, 5e-6);
    near(fit.interceptSE, 5.180701, 2e-5);
    near(fit.slopeSE, 2.912134, 2e-5);
  });

  it("gives the ED50 and its Fieller and delta intervals (recomputed)", () => {
    // ED50 = 60.717455 / 34.270326 from the published coefficients. The intervals are recomputed here
    // from the defining formulas with the covariance rebuilt from the information matrix Σ nᵢpᵢ(1 − pᵢ)·xxᵀ.
    near(fit.ed50, 60.717455 / 34.270326, 1e-6);
    let [h00, h01, h11] = [0, 0, 0];
    for (const g of groups) {
      const p = 1 / (1 + Math.exp(-(fit.intercept + fit.slope * g.force)));
      const w = g.trials * p * (1 - p);
      [h00, h01, h11] = [h00 + w, h01 + w * g.force, h11 + w * g.force * g.force];
    }
    const det = h00 * h11 - h01 * h01;
    const [vaa, vab, vbb] = [h11 / det, -h01 / det, h00 / det];
    const z = 1.959964; // REFERENCES.md
    const [a, b] = [fit.intercept, fit.slope];
    // Fieller: roots of (b² − z²Vbb)x² + 2(ab − z²Vab)x + (a² − z²Vaa) = 0.
    const A = b * b - z * z * vbb;
    const B = a * b - z * z * vab;
    const C = a * a - z * z * vaa;
    near(fit.fiellerLower, (-B - Math.sqrt(B * B - A * C)) / A, 1e-5);
    near(fit.fiellerUpper, (-B + Math.sqrt(B * B - A * C)) / A, 1e-5);
    const m = -a / b;
    const se = Math.sqrt(vaa + 2 * m * vab + m * m * vbb) / Math.abs(b);
    near(fit.deltaLower, m - z * se, 1e-5);
    near(fit.deltaUpper, m + z * se, 1e-5);
    expect(fit.method).toBe("Fieller");
    expect([fit.ed50Lower, fit.ed50Upper]).toEqual([fit.fiellerLower, fit.fiellerUpper]);
    expect(fit.g).toBeLessThan(0.05); // a steep, well-determined slope: Fieller ≈ delta
  });

  it("gives the same fit from binary rows as from grouped counts", () => {
    const rows: ForceRow[] = groups.flatMap((g) =>
      Array.from({ length: g.trials }, (_, i) => ({ force: g.force, y: i < g.successes ? 1 : 0 })),
    );
    const binary = forceForJob(rows);
    near(binary.intercept, fit.intercept, 1e-8);
    near(binary.ed50, fit.ed50, 1e-10);
  });

  it("gives the chance of success at a force on the fitted curve, and ½ at the ED50", () => {
    const at = chanceAtForce(fit, fit.ed50);
    near(at.estimate, 0.5, 1e-12);
    // Wald interval on the logit scale: at the ED50 η = 0, so the limits are expit(±z·SE(η)).
    const [[v00, v01], [, v11]] = fit.covariance;
    const seEta = Math.sqrt(v00 + 2 * fit.ed50 * v01 + fit.ed50 ** 2 * v11);
    near(at.upper, 1 / (1 + Math.exp(-zCritical(0.95) * seEta)), 1e-9);
    const curve = forceCurve(fit, 1.65, 1.9, 25);
    expect(curve).toHaveLength(26);
    expect(curve.every((pt, i) => i === 0 || pt.estimate > curve[i - 1]!.estimate)).toBe(true);
  });
});

describe("forceForJob, edge cases and properties", () => {
  it("gives null Fieller bounds when the slope is not clearly non-zero (g ≥ 1)", () => {
    const flat = forceForJob(
      [800, 900, 1000, 1100, 1200, 800, 900, 1000, 1100, 1200].map((force, i) => ({
        force,
        y: ([1, 0, 1, 0, 1, 0, 1, 0, 0, 1] as const)[i]!,
      })),
    );
    expect(flat.g).toBeGreaterThanOrEqual(1);
    expect([flat.ed50Lower, flat.ed50Upper]).toEqual([null, null]);
    const delta = forceForJob(
      [
        { force: 1, y: 0 },
        { force: 2, y: 1 },
        { force: 3, y: 0 },
        { force: 4, y: 1 },
      ],
      0.95,
      {
        interval: "delta",
      },
    );
    expect(delta.method).toBe("delta");
    expect(delta.ed50Lower).toBe(delta.deltaLower);
  });

  it("stays finite under separation with Firth's penalty (Firth 1993; Heinze & Schemper 2002)", () => {
    const separated: ForceRow[] = [700, 800, 900, 1000, 1100, 1200].map((force) => ({ force, y: force > 950 ? 1 : 0 }));
    const firth = forceForJob(separated, 0.95, { firth: true });
    expect(firth.converged).toBe(true);
    expect(Number.isFinite(firth.slope) && firth.slope > 0).toBe(true);
    near(firth.ed50, 950, 1e-6); // symmetric data: the penalised fit is symmetric about 950
    expect(forceForJob(separated).converged).toBe(false);
  });

  it("refuses too few rows and a force that does not vary", () => {
    expect(() =>
      forceForJob([
        { force: 1, y: 1 },
        { force: 2, y: 0 },
      ]),
    ).toThrow(RangeError);
    expect(() => forceForJob([1, 1, 1].map((force, i) => ({ force, y: (i % 2) as 0 | 1 })))).toThrow(RangeError);
  });

  it("puts the ED50 inside both its intervals and each chance inside its own (property)", () => {
    const group = fc.record({
      force: fc.integer({ min: 200, max: 3000 }),
      trials: fc.integer({ min: 1, max: 12 }),
      share: fc.double({ min: 0, max: 1, noNaN: true }),
    });
    fc.assert(
      fc.property(fc.array(group, { minLength: 3, maxLength: 8 }), (list) => {
        const groups = list.map((g) => ({
          force: g.force,
          trials: g.trials,
          successes: Math.round(g.share * g.trials),
        }));
        fc.pre(new Set(groups.map((g) => g.force)).size > 1);
        const fit = forceForJobGrouped(groups, 0.95, { firth: true });
        const okFieller = fit.fiellerLower === null || (fit.fiellerLower <= fit.ed50 && fit.ed50 <= fit.fiellerUpper!);
        const at = chanceAtForce(fit, groups[0]!.force);
        return (
          okFieller &&
          fit.deltaLower <= fit.ed50 &&
          fit.ed50 <= fit.deltaUpper &&
          at.lower <= at.estimate &&
          at.estimate <= at.upper
        );
      }),
      { numRuns: 60 },
    );
  });
});
