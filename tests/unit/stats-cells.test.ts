import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { type CellReport, cellFigures, predictAt, REFERENCE_INLET_KPA } from "~/stats/cells";
import { jobPressureFit, type FitReport } from "~/stats/pressure";
import { clusteredWilson, kaplanMeier, medianInterval } from "~/stats";

const rng = seedrandom("cells");
/** Invented reports where success rises with inlet pressure, from `reporters` reporters. */
function reports(n: number, fromKpa: number, toKpa: number, reporters = n): CellReport[] {
  return Array.from({ length: n }, (_, i) => {
    const inletKpa = fromKpa + ((toKpa - fromKpa) * i) / Math.max(1, n - 1);
    const p = 1 / (1 + Math.exp(-(inletKpa - 600) / 60));
    const u = rng();
    return {
      outcome: u < p ? "freed" : u < p + (1 - p) / 2 ? "freed_with_help" : "not_freed",
      timeS: 20 + rng() * 60,
      inletKpa,
      reporterId: i % reporters,
      aboveRated: false,
      inletSource: i % 3 === 0 ? "measured_at_inlet" : "estimated",
    };
  });
}

describe("a cell's figures", () => {
  it("gives the clustered Wilson rate, the order-statistic median time and the Kaplan–Meier median", () => {
    const r = reports(40, 450, 800, 6);
    const f = cellFigures(r)!;
    expect(f.n).toBe(40);
    expect(f.reporters).toBe(6);
    const byReporter = [0, 1, 2, 3, 4, 5].map((k) => ({
      successes: r.filter((x) => x.reporterId === k && x.outcome === "freed").length,
      trials: r.filter((x) => x.reporterId === k).length,
    }));
    expect(f.lower).toBeCloseTo(clusteredWilson(byReporter).lower, 12); // recomputed by the pure function
    const times = r.filter((x) => x.outcome === "freed").map((x) => x.timeS);
    const m = medianInterval(times)!;
    expect(f.time).toMatchObject({
      n: times.length,
      median: m.estimate,
      lower: m.lower,
      upper: m.upper,
      coverage: m.coverage,
    });
    expect(f.time!.coverage).toBeGreaterThanOrEqual(0.95);
    const km = kaplanMeier(
      r.map((x) => x.timeS),
      r.map((x) => x.outcome === "freed"),
    );
    expect(f.km!.median).toBe(km.median);
    // Give-ups counted: the KM median is no shorter than the median of the successes alone.
    expect(f.km!.median ?? Infinity).toBeGreaterThanOrEqual(f.time!.median);
    expect(f.measuredShare + f.estimatedShare).toBeCloseTo(1, 10);
  });

  it("gives no time interval with five times or fewer, and says so with nulls", () => {
    const r = reports(8, 600, 700).map((x, i) => ({
      ...x,
      outcome: i < 5 ? ("freed" as const) : ("not_freed" as const),
    }));
    const f = cellFigures(r)!;
    expect(f.time!.n).toBe(5);
    expect(f.time!.lower).toBeNull();
    expect(f.time!.coverage).toBeNull();
  });

  it("sets reports above the rated inlet aside: counted, kept out of every figure", () => {
    const r = reports(30, 450, 800);
    const flagged = r.map((x, i) => (i < 7 ? { ...x, aboveRated: true } : x));
    const f = cellFigures(flagged)!;
    expect(f.setAside).toBe(7);
    expect(f.n).toBe(23);
    expect(f).toEqual({ ...cellFigures(r.slice(7))!, setAside: 7 });
    expect(cellFigures(r.map((x) => ({ ...x, aboveRated: true })))).toBeNull();
  });

  it("is reproducible", () => {
    const r = reports(30, 450, 800);
    expect(cellFigures(r)).toEqual(cellFigures(r));
  });
});

/** A job's inlet-measured reports: three models, success rising with pressure. */
function jobReports(): FitReport[] {
  const out: FitReport[] = [];
  for (const [model, from, to, shift] of [
    [1, 480, 760, 0],
    [2, 520, 700, -40],
    [3, 700, 820, 0],
  ] as const) {
    for (let i = 0; i < 40; i++) {
      const inletKpa = from + ((to - from) * i) / 39;
      out.push({ model, inletKpa, freed: rng() < 1 / (1 + Math.exp(-(inletKpa - 600 - shift) / 60)) });
    }
  }
  return out;
}

describe("a job's pooled pressure fit", () => {
  it("gives a figure at 90 psi only where 620.5 kPa lies within a model's 10th–90th percentile, and says why not", () => {
    const fit = jobPressureFit(jobReports(), [1, 2, 3, 4]);
    expect(fit.slope).toBeGreaterThan(0);
    expect(fit.perModel.get(1)!.adjusted).not.toBeNull();
    expect(fit.perModel.get(2)!.adjusted).not.toBeNull();
    expect(fit.perModel.get(3)!.adjusted).toBeNull(); // 700–820 kPa: 620.5 is below its 10th percentile
    expect(fit.perModel.get(3)!.reason).toMatch(/90 psi is outside/);
    expect(fit.perModel.get(4)!.reason).toMatch(/None of its reports on this job has a known inlet pressure/);
    const one = fit.perModel.get(1)!;
    const at = predictAt(one.fit!, REFERENCE_INLET_KPA);
    expect(at.estimate).toBeCloseTo(one.adjusted!.estimate, 10);
    expect(at.lower).toBeCloseTo(one.adjusted!.lower, 10);
    expect(at.extrapolating).toBe(false);
    expect(predictAt(one.fit!, 1000).extrapolating).toBe(true);
  });

  it("refits one model at the job's slope to the joint fit's own figures (recomputed: same Firth score equations)", async () => {
    const { modelAtJobSlope } = await import("~/stats/pressure");
    const rows = jobReports();
    const joint = jobPressureFit(rows, [1, 2, 3]);
    const one = joint.perModel.get(1)!.fit!;
    const alone = modelAtJobSlope(
      rows.filter((r) => r.model === 1),
      { slope: one.slope, sigma: one.sigma },
    );
    expect(alone.fit!.intercept).toBeCloseTo(one.intercept, 6);
    expect(alone.fit!.d).toBeCloseTo(one.d, 6);
    expect(alone.adjusted!.lower).toBeCloseTo(joint.perModel.get(1)!.adjusted!.lower, 6);
  });

  it("needs 20 inlet-measured reports, and says so", () => {
    const fit = jobPressureFit(jobReports().slice(0, 12), [1]);
    expect(fit.slope).toBeNull();
    expect(fit.perModel.get(1)!.reason).toMatch(/Only 12 reports on this job have a known inlet pressure/);
  });
});

describe("which tool at my air", () => {
  it("predicts at the pressure the line delivers and lists what else the tool needs", async () => {
    const { atSupply } = await import("~/stats/which-tool");
    const fit = jobPressureFit(jobReports(), [1]).perModel.get(1)!.fit;
    const line = { hoseIdMm: 6.35, hoseLengthM: 30, couplerProfile: "automotive_t" as const, couplerCount: 3 };
    const weak = atSupply(
      { slug: "x", fitting: "shank-0.498", ratedLps: 4.7, fit },
      { regulatorKpa: 620, line, bits: "shank-0.401" },
    );
    expect(weak.inletKpa).toBeLessThan(620);
    expect(weak.needs.join(" ")).toMatch(/0.498 in shank bits/);
    expect(weak.needs.join(" ")).toMatch(/bigger air supply/);
    const strong = atSupply(
      { slug: "x", fitting: "shank-0.401", ratedLps: 1.9, fit },
      { regulatorKpa: 760, line: { ...line, hoseIdMm: 12.7, hoseLengthM: 8 }, bits: "shank-0.401" },
    );
    expect(strong.needs).toEqual([]);
    expect(strong.predicted!.estimate).toBeGreaterThan(weak.predicted!.estimate);
  });
});
