import { describe, expect, it } from "vitest";
import { type CellReport, cellFigures, predictAt, REFERENCE_INLET_KPA } from "~/stats/cells";
import seedrandom from "seedrandom";

const rng = seedrandom("cells");
/** Invented reports where success rises with inlet pressure. */
function reports(n: number, fromKpa: number, toKpa: number): CellReport[] {
  return Array.from({ length: n }, (_, i) => {
    const inletKpa = fromKpa + ((toKpa - fromKpa) * i) / Math.max(1, n - 1);
    const p = 1 / (1 + Math.exp(-(inletKpa - 600) / 60));
    return { freed: rng() < p, timeS: 20 + rng() * 60, inletKpa, inletSource: i % 3 === 0 ? "measured_at_inlet" : "estimated" };
  });
}

describe("a cell's figures", () => {
  it("gives the Wilson interval, a bootstrap median time and the shares of how pressure was got", () => {
    const f = cellFigures(reports(40, 450, 800), "seed");
    expect(f.n).toBe(40);
    expect(f.lower).toBeLessThanOrEqual(f.estimate);
    expect(f.upper).toBeGreaterThanOrEqual(f.estimate);
    expect(f.time!.lower).toBeLessThanOrEqual(f.time!.median);
    expect(f.measuredShare + f.estimatedShare).toBeCloseTo(1, 10);
  });

  it("adjusts for pressure only with 20 reports spanning 1 bar, and says why not otherwise", () => {
    expect(cellFigures(reports(12, 450, 800), "s").adjustedReason).toMatch(/Only 12 reports/);
    expect(cellFigures(reports(30, 600, 650), "s").adjustedReason).toMatch(/span only 0.50 bar/);
    const f = cellFigures(reports(60, 450, 800), "s");
    expect(f.adjusted).not.toBeNull();
    expect(f.adjustedReason).toBeNull();
    expect(f.fit!.slope).toBeGreaterThan(0);
  });

  it("is reproducible for the same seed", () => {
    const r = reports(30, 450, 800);
    expect(cellFigures(r, "x")).toEqual(cellFigures(r, "x"));
  });

  it("predicts at the rating point as stored, and says when it extrapolates", () => {
    const f = cellFigures(reports(60, 450, 800), "s");
    const at = predictAt(f.fit!, REFERENCE_INLET_KPA);
    expect(at.estimate).toBeCloseTo(f.adjusted!.estimate, 10);
    expect(at.extrapolating).toBe(false);
    expect(predictAt(f.fit!, 1000).extrapolating).toBe(true);
  });
});

describe("which tool at my air", () => {
  it("predicts at the pressure the line delivers and lists what else the tool needs", async () => {
    const { atSupply } = await import("~/stats/which-tool");
    const f = cellFigures(reports(60, 450, 800), "s");
    const line = { hoseIdMm: 6.35, hoseLengthM: 30, couplerProfile: "automotive_t" as const, couplerCount: 3 };
    const weak = atSupply({ slug: "x", fitting: "shank-0.498", ratedLps: 4.7, fit: f.fit }, { regulatorKpa: 620, line, bits: "shank-0.401" });
    expect(weak.inletKpa).toBeLessThan(620);
    expect(weak.needs.join(" ")).toMatch(/0.498 in shank bits/);
    expect(weak.needs.join(" ")).toMatch(/bigger air supply/);
    const strong = atSupply({ slug: "x", fitting: "shank-0.401", ratedLps: 1.9, fit: f.fit }, { regulatorKpa: 760, line: { ...line, hoseIdMm: 12.7, hoseLengthM: 8 }, bits: "shank-0.401" });
    expect(strong.needs).toEqual([]);
    expect(strong.predicted!.estimate).toBeGreaterThan(weak.predicted!.estimate);
  });
});
