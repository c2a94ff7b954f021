import { describe, expect, it } from "vitest";
import { plausibilityFlags } from "~/moderation/flags";

const base = {
  inletKpa: 600, regulatorKpa: 650, inletSource: "measured_at_inlet" as const, hoseIdMm: 9.5,
  hoseLengthM: 10, timeToResultS: 40, seizedJob: true, maxInletKpa: 620.5,
};

describe("plausibility flags", () => {
  it("raises none on an ordinary report", () => {
    expect(plausibilityFlags(base)).toEqual([]);
  });
  it("flags running above the tool's rated inlet pressure", () => {
    expect(plausibilityFlags({ ...base, inletKpa: 760, regulatorKpa: 780 })).toContain("above_rated_inlet");
  });
  it("flags an inlet reading above the regulator beyond gauge error", () => {
    expect(plausibilityFlags({ ...base, inletKpa: 610, regulatorKpa: 560 })).toContain("inlet_above_regulator");
  });
  it("flags a seized job done in under three seconds", () => {
    expect(plausibilityFlags({ ...base, timeToResultS: 2 })).toContain("implausibly_fast");
    expect(plausibilityFlags({ ...base, timeToResultS: 2, seizedJob: false })).not.toContain("implausibly_fast");
  });
});
