// A series' figures: t intervals on trial means, the trigger's control range, the blow rate against
// the stated rate. Sources beside each check (see ../shared/REFERENCES.md "Student t intervals").
import jStatModule from "jstat";
import { describe, expect, it } from "vitest";
import { blowRateAgreement, meanInterval, mulberry32, peakSummary, seriesFigures, triggerControlRange } from "~/bench";

const jStat = jStatModule.jStat ?? jStatModule;

/** n values with exactly the given mean and SD (a seeded draw, standardised and rescaled). */
function withSummary(n: number, mean: number, sd: number): number[] {
  const u = mulberry32(42);
  const raw = Array.from({ length: n }, () => u());
  const m = raw.reduce((s, v) => s + v, 0) / n;
  const s = Math.sqrt(raw.reduce((acc, v) => acc + (v - m) ** 2, 0) / (n - 1));
  return raw.map((v) => mean + ((v - m) / s) * sd);
}

describe("meanInterval", () => {
  // NIST/SEMATECH e-Handbook §1.3.5.2 "Confidence Limits for the Mean", heat-flow meter data ZARR13:
  // n = 195, mean 9.261460, s 0.02278881 (published summary), 95 % interval 9.258241 – 9.264679
  // (recomputed, REFERENCES.md). Tolerance 1e-6.
  it("the e-Handbook's heat-flow meter example, from its summary statistics", () => {
    const r = meanInterval(withSummary(195, 9.26146, 0.02278881))!;
    expect(r.n).toBe(195);
    expect(r.mean).toBeCloseTo(9.26146, 9);
    expect(r.sd).toBeCloseTo(0.02278881, 9);
    expect(Math.abs(r.lower - 9.258241)).toBeLessThanOrEqual(1e-6);
    expect(Math.abs(r.upper - 9.264679)).toBeLessThanOrEqual(1e-6);
  });

  it("three trials: x̄ ± t(0.975, 2)·s/√3 with t = 4.302653 (t table, from memory; jStat agrees)", () => {
    const m = 14900 / 3;
    const sd = Math.sqrt(((4800 - m) ** 2 + (5000 - m) ** 2 + (5100 - m) ** 2) / 2);
    const r = meanInterval([4800, 5000, 5100])!;
    expect(r.mean).toBeCloseTo(m, 9);
    expect(r.upper - r.mean).toBeCloseTo((4.302653 * sd) / Math.sqrt(3), 3);
    expect(r.mean - r.lower).toBeCloseTo((4.302653 * sd) / Math.sqrt(3), 3);
  });

  it("no interval from fewer than two trials", () => {
    expect(meanInterval([5000])).toBeNull();
    expect(meanInterval([])).toBeNull();
  });
});

describe("seriesFigures: the trial is the unit of replication", () => {
  const trials = [[5000, 5100, 4900, 5050], [4700, 4800, 4750], [5200, 5300, 5250, 5150, 5350], []];

  it("trial means, their mean and t interval, and the pooled blow distribution", () => {
    const f = seriesFigures(trials);
    expect(f.trialMeans).toEqual([5012.5, 4750, 5250]);
    expect(f.n).toBe(3);
    const byTrial = meanInterval(f.trialMeans)!;
    expect(f.mean).toBeCloseTo(byTrial.mean, 9);
    expect(f.lower).toBeCloseTo(byTrial.lower, 9);
    expect(f.upper).toBeCloseTo(byTrial.upper, 9);
    // Not the blows' interval: twelve blows would give a much narrower one.
    const byBlow = meanInterval(trials.flat())!;
    expect(f.upper! - f.lower!).toBeGreaterThan(3 * (byBlow.upper - byBlow.lower));
    expect(f.blows).toEqual(peakSummary(trials.flat()));
    expect(f.blows.n).toBe(12);
  });

  it("one trial: a mean but no interval; none: nothing", () => {
    const one = seriesFigures([[5000, 5200]]);
    expect(one.mean).toBe(5100);
    expect(one.lower).toBeNull();
    expect(one.upper).toBeNull();
    const none = seriesFigures([]);
    expect(none.mean).toBeNull();
    expect(none.blows.n).toBe(0);
  });
});

describe("peakSummary", () => {
  it("type 7 quantiles: 1..11 gives median 6, p10 2, p90 10 (recomputed by hand)", () => {
    expect(peakSummary([11, 1, 10, 2, 9, 3, 8, 4, 7, 5, 6])).toEqual({ median: 6, p10: 2, p90: 10, n: 11 });
    expect(peakSummary([1, 2])).toEqual({ median: 1.5, p10: 1.1, p90: 1.9, n: 2 });
  });
});

describe("triggerControlRange", () => {
  const full = [5012, 4750, 5250, 5100];
  const lightest = [1200, 1900, 1500];

  it("full minus lightest with a Welch interval (recomputed from the formula with jStat's t quantile)", () => {
    const r = triggerControlRange(full, lightest)!;
    const stats = (xs: number[]) => {
      const m = xs.reduce((s, v) => s + v, 0) / xs.length;
      const v = xs.reduce((s, x) => s + (x - m) ** 2, 0) / (xs.length - 1);
      return { m, q: v / xs.length, n: xs.length };
    };
    const a = stats(full);
    const b = stats(lightest);
    const df = (a.q + b.q) ** 2 / (a.q ** 2 / (a.n - 1) + b.q ** 2 / (b.n - 1));
    const half = jStat.studentt.inv(0.975, df) * Math.sqrt(a.q + b.q);
    expect(r.estimate).toBeCloseTo(a.m - b.m, 9);
    expect(r.df).toBeCloseTo(df, 9);
    expect(r.lower).toBeCloseTo(a.m - b.m - half, 6);
    expect(r.upper).toBeCloseTo(a.m - b.m + half, 6);
  });

  it("equal sizes and spreads: Welch's df is n₁ + n₂ − 2 and the interval the pooled one (recomputed)", () => {
    const r = triggerControlRange([10, 12, 14], [1, 3, 5])!;
    expect(r.estimate).toBe(9);
    expect(r.df).toBeCloseTo(4, 12);
    const half = jStat.studentt.inv(0.975, 4) * Math.sqrt(4 / 3 + 4 / 3);
    expect(r.upper).toBeCloseTo(9 + half, 9);
  });

  it("needs two trials on each side", () => {
    expect(triggerControlRange([5000], lightest)).toBeNull();
    expect(triggerControlRange(full, [1500])).toBeNull();
  });
});

describe("blowRateAgreement (our plausibility rule: within ±15 % of the maker's stated rate)", () => {
  it.each([
    [3000, 3000, 1, true],
    [3450, 3000, 1.15, true],
    [2550, 3000, 0.85, true],
    [3460, 3000, 3460 / 3000, false],
    [2000, 3000, 2000 / 3000, false],
  ])("%d measured against %d stated", (measured, stated, ratio, within) => {
    const r = blowRateAgreement(measured, stated);
    expect(r.ratio).toBeCloseTo(ratio, 12);
    expect(r.withinTolerance).toBe(within);
  });

  it("no stated rate: no ratio, and nothing agrees", () => {
    expect(blowRateAgreement(3000, null)).toEqual({ ratio: null, withinTolerance: false });
    expect(blowRateAgreement(null, 3000)).toEqual({ ratio: null, withinTolerance: false });
  });
});
