// Rig agreement (app/bench/agreement.ts) against published one-way variance-component examples and a
// hand computation from the defining sums of squares; the source of each check is named beside it.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { rigAgreement, type RigReading } from "~/bench";

const near = (actual: number, expected: number, tol: number) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol);

const readings = (groups: Record<string, number[]>): RigReading[] =>
  Object.entries(groups).flatMap(([rig, values]) => values.map((value) => ({ rig, value })));

describe("rigAgreement on balanced published examples", () => {
  it("NIST/SEMATECH e-Handbook §7.4.4, components of variance: 5 batches × 3 determinations", () => {
    // Published data and ANOVA table (Treatment SS 147.74, MS 36.935; Error SS 17.99, MS 1.799), read at
    // itl.nist.gov/div898/handbook/prc/section4/prc44.htm. The table's last digits are rounded (the data
    // give SS 147.733 and 18.000), hence the tolerance. s_r² = MS_error; s_L² = (36.935 − 1.799)/3 = 11.712
    // is recomputed from the published mean squares with the ISO 5725-2 definitions.
    const fit = rigAgreement(
      readings({
        b1: [74, 76, 75],
        b2: [68, 71, 72],
        b3: [75, 77, 77],
        b4: [72, 74, 73],
        b5: [79, 81, 79],
      }),
    );
    near(fit.repeatabilitySD ** 2, 1.799, 2e-3);
    near(fit.betweenRigSD ** 2, 11.712, 2e-3);
    near(fit.reproducibilitySD ** 2, 1.799 + 11.712, 3e-3);
    expect(fit.nBar).toBeCloseTo(3, 12); // balanced: n̄ = n
    expect(fit.p).toBe(5);
  });

  it("looms example (Montgomery, Design and Analysis of Experiments — from memory): 4 looms × 4 samples", () => {
    // Data and figures as printed in the course script sites.ualberta.ca/~dwiens/stat368/rem.R
    // (F0 = 15.681, MS_E = 1.896) and the Coursera lecture "Example of random factor experiment" of the
    // same book (σ² = 1.90, σ_τ² = 6.96, σ_y² = 8.86) — published there.
    const fit = rigAgreement(
      readings({
        loom1: [98, 97, 99, 96],
        loom2: [91, 90, 93, 92],
        loom3: [96, 95, 97, 95],
        loom4: [95, 96, 99, 98],
      }),
    );
    near(fit.repeatabilitySD ** 2, 1.896, 5e-4);
    near(fit.betweenRigSD ** 2, 6.96, 5e-3);
    near(fit.reproducibilitySD ** 2, 8.86, 1e-2); // printed as the sum of the rounded parts, 1.90 + 6.96
    const msBetween = fit.betweenRigSD ** 2 * fit.nBar + fit.repeatabilitySD ** 2;
    near(msBetween / fit.repeatabilitySD ** 2, 15.681, 5e-4);
  });
});

describe("rigAgreement, unbalanced (recomputed by hand from the defining sums of squares)", () => {
  // Rigs A: 10, 12; B: 15, 14, 16; C: 11. N = 6, p = 3, ȳ = (22 + 45 + 11)/6 = 13.
  // Within SS = 2 + 2 + 0 = 4 → s_r² = 4/3. s_d² = (2·4 + 3·4 + 1·4)/2 = 12.
  // n̄ = (6 − (4 + 9 + 1)/6)/2 = 11/6 (ISO 5725-2's unbalanced n̄). s_L² = (12 − 4/3)/(11/6) = 64/11.
  const fit = rigAgreement(readings({ A: [10, 12], B: [15, 14, 16], C: [11] }));
  it("gives s_r, s_L, s_R and n̄", () => {
    near(fit.grandMean, 13, 1e-12);
    near(fit.repeatabilitySD ** 2, 4 / 3, 1e-12);
    near(fit.nBar, 11 / 6, 1e-12);
    near(fit.betweenRigSD ** 2, 64 / 11, 1e-12);
    near(fit.reproducibilitySD ** 2, 4 / 3 + 64 / 11, 1e-12);
  });

  it("gives each rig's bias against the consensus, with the stated variance and t(p − 1)", () => {
    // Rig A (n = 2, w = 1/3): Var = (2/3)²·(4/3)/2 + (1/2)²·(64/11 + (4/3)/3) + (1/6)²·(64/11 + 4/3).
    const sr2 = 4 / 3;
    const sL2 = 64 / 11;
    const varA = (2 / 3) ** 2 * (sr2 / 2) + (1 / 2) ** 2 * (sL2 + sr2 / 3) + (1 / 6) ** 2 * (sL2 + sr2);
    const a = fit.rigs.find((r) => r.rig === "A")!;
    near(a.bias, -2, 1e-12);
    near(a.upper - a.bias, 4.302653 * Math.sqrt(varA), 1e-5); // t(0.975, 2) = 4.302653, t tables (from memory)
    expect(fit.rigs.map((r) => [r.rig, r.n])).toEqual([
      ["A", 2],
      ["B", 3],
      ["C", 1],
    ]);
  });

  it("floors s_L² at 0 when rigs agree better than repeat readings do (ISO 5725-2)", () => {
    const tight = rigAgreement(readings({ A: [1, 3], B: [1.9, 2.1], C: [1, 3] }));
    expect(tight.betweenRigSD).toBe(0);
    near(tight.reproducibilitySD, tight.repeatabilitySD, 1e-12);
  });

  it("throws on fewer than 2 rigs, or with no repeat reading on any rig", () => {
    expect(() => rigAgreement(readings({ A: [1, 2, 3] }))).toThrow(RangeError);
    expect(() => rigAgreement(readings({ A: [1], B: [2] }))).toThrow(RangeError);
  });
});

describe("rigAgreement, properties", () => {
  const design = fc.array(fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 1, maxLength: 6 }), {
    minLength: 2,
    maxLength: 8,
  });
  const asReadings = (groups: number[][]) =>
    groups.flatMap((values, i) => values.map((value) => ({ rig: `rig${i}`, value })));

  it("puts each bias inside its interval, and the weighted biases sum to zero (property)", () => {
    fc.assert(
      fc.property(design, (groups) => {
        fc.pre(groups.some((g) => g.length > 1));
        const fit = rigAgreement(asReadings(groups));
        const weighted = fit.rigs.reduce((a, r) => a + r.n * r.bias, 0);
        return (
          fit.rigs.every((r) => r.lower <= r.bias && r.bias <= r.upper) &&
          Math.abs(weighted) <= 1e-7 * fit.total * 1e3 &&
          fit.reproducibilitySD >= fit.repeatabilitySD
        );
      }),
    );
  });
});
