// Rig calibration fits against the NIST Statistical Reference Datasets (certified values, published;
// see ../shared/REFERENCES.md "Calibration and rigs"), the check-standard chart against the
// NIST/SEMATECH e-Handbook, and the calibration's age and verification rule.
import { describe, expect, it } from "vitest";
import { calibrationStatus, fitCalibration, individualsChart, readingToReference } from "~/bench";
import { NORRIS_CERTIFIED, NORRIS_ROWS } from "./fixtures/nist-norris";
import { PONTIUS_CERTIFIED, PONTIUS_ROWS } from "./fixtures/nist-pontius";

/** Agreement to at least `digits` significant digits. */
const digits = (actual: number, expected: number, d: number) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(Math.abs(expected) * 10 ** -d);

const points = (rows: readonly (readonly [number, number])[]) => rows.map(([y, x]) => ({ reference: x, reading: y }));

describe("fitCalibration against NIST StRD certified values", () => {
  // NIST StRD "Norris" (Norris.dat): certified B0, B1, their standard deviations, residual SD and
  // R², 15 digits published; asserted to 10 significant digits.
  it("Norris: straight line, 36 observations", () => {
    const fit = fitCalibration(points(NORRIS_ROWS), 1);
    expect(fit.degree).toBe(1);
    expect(fit.n).toBe(36);
    NORRIS_CERTIFIED.coefficients.forEach((c, i) => digits(fit.coefficients[i]!, c, 10));
    NORRIS_CERTIFIED.standardDeviations.forEach((s, i) => digits(fit.standardErrors[i]!, s, 10));
    digits(fit.residualSD, NORRIS_CERTIFIED.residualSD, 10);
    digits(fit.rSquared, NORRIS_CERTIFIED.rSquared, 12);
  });

  it("Norris: 'auto' keeps the straight line (no curvature in the residuals)", () => {
    expect(fitCalibration(points(NORRIS_ROWS)).degree).toBe(1);
  });

  // NIST StRD "Pontius" (Pontius.dat), a load-cell calibration: certified B0, B1, B2, their standard
  // deviations, residual SD and R², 15 digits published; asserted to 10 significant digits.
  it("Pontius: quadratic, 40 observations, loads up to 3 million", () => {
    const fit = fitCalibration(points(PONTIUS_ROWS), 2);
    expect(fit.degree).toBe(2);
    expect(fit.n).toBe(40);
    PONTIUS_CERTIFIED.coefficients.forEach((c, i) => digits(fit.coefficients[i]!, c, 10));
    PONTIUS_CERTIFIED.standardDeviations.forEach((s, i) => digits(fit.standardErrors[i]!, s, 10));
    digits(fit.residualSD, PONTIUS_CERTIFIED.residualSD, 10);
    digits(fit.rSquared, PONTIUS_CERTIFIED.rSquared, 12);
  });

  it("Pontius: 'auto' picks the quadratic (certified B2 is 65 standard deviations from zero)", () => {
    const fit = fitCalibration(points(PONTIUS_ROWS));
    expect(fit.degree).toBe(2);
    digits(fit.coefficients[2]!, PONTIUS_CERTIFIED.coefficients[2], 10);
  });

  it("residuals are reading − fitted, one per point, in the input order", () => {
    const fit = fitCalibration(points(PONTIUS_ROWS), 2);
    expect(fit.residuals).toHaveLength(40);
    fit.residuals.forEach((r, i) => {
      expect(r.reference).toBe(PONTIUS_ROWS[i]![1]);
      expect(r.residual).toBeCloseTo(r.reading - r.fitted, 15);
    });
    const rss = fit.residuals.reduce((s, r) => s + r.residual ** 2, 0);
    digits(Math.sqrt(rss / 37), PONTIUS_CERTIFIED.residualSD, 10);
  });
});

describe("fitCalibration refuses what it cannot fit", () => {
  const line = [0, 1, 2, 3].map((x) => ({ reference: x, reading: 2 * x + 1 }));
  it.each([
    ["two points for a line", line.slice(0, 2), 1 as const, /at least 3 points/],
    ["three points for a quadratic", line.slice(0, 3), 2 as const, /at least 4 points/],
    ["a non-finite reading", [...line, { reference: 5, reading: NaN }], 1 as const, /finite/],
    ["an infinite reference", [...line, { reference: Infinity, reading: 1 }], "auto" as const, /finite/],
    ["all references equal", line.map((p) => ({ ...p, reference: 7 })), 1 as const, /all reference loads are equal/],
    [
      "two distinct references for a quadratic",
      [0, 0, 1, 1].map((x, i) => ({ reference: x, reading: x + i / 10 })),
      2 as const,
      /three distinct/,
    ],
  ])("%s", (_name, pts, degree, message) => {
    expect(() => fitCalibration(pts, degree)).toThrow(message);
  });
});

describe("readingToReference inverts the fit", () => {
  it("straight line: the reference whose fitted reading is the reading (recomputed)", () => {
    const fit = fitCalibration(points(NORRIS_ROWS), 1);
    const [c0, c1] = fit.coefficients as [number, number];
    expect(readingToReference(fit, 500)).toBeCloseTo((500 - c0) / c1, 10);
  });

  it("quadratic: the root inside the calibrated range, round-tripping every fitted reading", () => {
    const fit = fitCalibration(points(PONTIUS_ROWS), 2);
    for (const r of fit.residuals) {
      expect(readingToReference(fit, r.fitted) / r.reference).toBeCloseTo(1, 9);
    }
    // The other root of the certified curve lies far outside (about 2.3e8): never returned here.
    expect(readingToReference(fit, 1.5)).toBeGreaterThan(150000);
    expect(readingToReference(fit, 1.5)).toBeLessThan(3000000);
  });

  it("a reading beyond a quadratic's vertex has no reference", () => {
    const fit = fitCalibration(
      [0, 1, 2, 3, 4].map((x) => ({ reference: x, reading: -(x * x) + 4 * x + (x % 2) * 1e-3 })),
      2,
    );
    expect(() => readingToReference(fit, 10)).toThrow(RangeError);
  });
});

describe("individualsChart", () => {
  // NIST/SEMATECH e-Handbook of Statistical Methods, §6.3.2.2 "Individuals Control Charts"
  // (itl.nist.gov/div898/handbook/pmc/section3/pmc322.htm, read through the search tool): flow rate
  // of the first 10 batches of a new process; published x̄ = 50.81, MR̄ = 1.8778,
  // UCL = 55.8041, LCL = 45.8159, every point in control.
  it("the e-Handbook's flow-rate example", () => {
    const chart = individualsChart([49.6, 47.6, 49.9, 51.3, 47.8, 51.2, 52.6, 52.4, 53.6, 52.1]);
    expect(chart.centre).toBeCloseTo(50.81, 10);
    expect(chart.meanMovingRange).toBeCloseTo(1.8778, 4);
    expect(chart.upper).toBeCloseTo(55.8041, 4);
    expect(chart.lower).toBeCloseTo(45.8159, 4);
    expect(chart.points.map((p) => p.movingRange)).toEqual(
      [null, 2, 2.3, 1.4, 3.5, 3.4, 1.4, 0.2, 1.2, 1.5].map((m) => (m === null ? null : expect.closeTo(m, 10))),
    );
    expect(chart.points.some((p) => p.outOfControl)).toBe(false);
  });

  // A second, textbook example: §16-6 "Control charts for individual measurements", Table 16-3
  // "Chemical Process Concentration Measurements" (20 observations), read as a page image found with
  // the search tool (issuhub.com); the page does not show the book's title (it cites Montgomery 2001;
  // from memory, Montgomery & Runger, Applied Statistics and Probability for Engineers). Published
  // x̄ = 99.1, mr̄ = 2.59, UCL = 105.99, LCL = 92.21 (two decimals), no point out of control.
  it("a textbook example: chemical process concentration", () => {
    const chart = individualsChart([
      102.0, 94.8, 98.3, 98.4, 102.0, 98.5, 99.0, 97.7, 100.0, 98.1, 101.3, 98.7, 101.1, 98.4, 97.0, 96.7, 100.3, 101.4,
      97.2, 101.0,
    ]);
    expect(chart.centre).toBeCloseTo(99.1, 2);
    expect(chart.meanMovingRange).toBeCloseTo(2.59, 2);
    expect(chart.upper).toBeCloseTo(105.99, 1);
    expect(chart.lower).toBeCloseTo(92.21, 1);
    expect(chart.points.some((p) => p.outOfControl)).toBe(false);
  });

  it("a check reading that drifts out is marked", () => {
    const chart = individualsChart([100, 101, 99, 100, 102, 98, 100, 101, 99, 130]);
    expect(chart.points.filter((p) => p.outOfControl).map((p) => p.index)).toEqual([9]);
  });

  it("refuses fewer than two values or a non-finite one", () => {
    expect(() => individualsChart([1])).toThrow(RangeError);
    expect(() => individualsChart([1, NaN])).toThrow(RangeError);
  });
});

describe("calibrationStatus", () => {
  const calibratedOn = new Date("2026-01-31T00:00:00Z");
  it("unverified until a moderator verifies it, current after", () => {
    const now = new Date("2026-06-01T00:00:00Z");
    expect(calibrationStatus({ verifiedAt: null, calibratedOn, now }).status).toBe("unverified");
    expect(calibrationStatus({ verifiedAt: new Date("2026-02-02T00:00:00Z"), calibratedOn, now }).status).toBe(
      "current",
    );
  });

  it("expires 12 calendar months after the calibration, verified or not", () => {
    const verifiedAt = new Date("2026-02-02T00:00:00Z");
    const { expiresOn } = calibrationStatus({ verifiedAt, calibratedOn, now: calibratedOn });
    expect(expiresOn.toISOString()).toBe("2027-01-31T00:00:00.000Z");
    const justBefore = new Date(expiresOn.getTime() - 1);
    expect(calibrationStatus({ verifiedAt, calibratedOn, now: justBefore }).status).toBe("current");
    expect(calibrationStatus({ verifiedAt, calibratedOn, now: expiresOn }).status).toBe("expired");
    expect(calibrationStatus({ verifiedAt: null, calibratedOn, now: expiresOn }).status).toBe("expired");
  });

  it("a shorter age limit; the 31st rolls back to a shorter month's last day", () => {
    const { expiresOn } = calibrationStatus({ verifiedAt: null, calibratedOn, now: calibratedOn, maxAgeMonths: 1 });
    expect(expiresOn.toISOString()).toBe("2026-02-28T00:00:00.000Z");
    expect(() => calibrationStatus({ verifiedAt: null, calibratedOn, now: calibratedOn, maxAgeMonths: 0 })).toThrow();
  });
});
