import { describe, expect, it } from "vitest";
import { plausibilityFlags, robustZ } from "~/moderation/flags";

const base = { inletKpa: 600, regulatorKpa: 650, maxInletKpa: 620.5 };

describe("plausibility flags", () => {
  it("raises none on an ordinary report", () => {
    expect(plausibilityFlags(base)).toEqual([]);
  });
  it("flags running above the tool's rated inlet pressure", () => {
    expect(plausibilityFlags({ ...base, inletKpa: 760, regulatorKpa: 780 })).toContain("above_rated_inlet");
  });
  it("flags an inlet reading above the regulator beyond gauge error", () => {
    expect(plausibilityFlags({ ...base, inletKpa: 610, regulatorKpa: 560 })).toContain("inlet_above_regulator");
    expect(plausibilityFlags({ ...base, inletKpa: 610, regulatorKpa: 600 })).not.toContain("inlet_above_regulator");
  });
  it("flags pressures beyond shop air", () => {
    expect(plausibilityFlags({ ...base, inletKpa: 600, regulatorKpa: 1500 })).toContain("pressure_above_limit");
  });
});

describe("robust z-score", () => {
  const sample = [10, 12, 14, 15, 16, 18, 20, 22, 25, 30, 35];
  it("is near zero at the median and large far out (Iglewicz & Hoaglin modified z, on log time)", () => {
    expect(Math.abs(robustZ(18, sample)!)).toBeLessThan(0.1);
    expect(robustZ(2000, sample)!).toBeGreaterThan(3.5);
    expect(robustZ(0.5, sample)!).toBeLessThan(-3.5);
  });
  it("says nothing on a small or flat sample", () => {
    expect(robustZ(20, [10, 20, 30])).toBeNull();
    expect(robustZ(20, Array(12).fill(15))).toBeNull();
  });
});
