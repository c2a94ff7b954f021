import { describe, expect, it } from "vitest";
import { airDemandLps } from "~/air/demand";
import { hosePressureDropBar } from "~/air/hose";
import {
  absoluteToGaugeKpa,
  barToKpa,
  galToL,
  gaugeToAbsoluteKpa,
  inToMm,
  kpaToPsi,
  lbfToN,
  lpsToScfm,
  psiToKpa,
  RATED_INLET_KPA,
  scfmToLps,
} from "~/domain";

describe("unit conversions", () => {
  it("matches the published constants", () => {
    // REFERENCES.md, compressed air: 1 psi = 6.894757 kPa (NIST SP 811, Appendix B)
    expect(psiToKpa(1)).toBeCloseTo(6.894757, 6);
    // 1 in = 25.4 mm exactly (international inch)
    expect(inToMm(1)).toBe(25.4);
    // 1 ft³/min = 0.4719474 l/s, from the exact foot (0.3048 m)
    expect(scfmToLps(1)).toBeCloseTo(0.4719474, 7);
    // 1 lbf = 4.448222 N (NIST SP 811, Appendix B)
    expect(lbfToN(1)).toBeCloseTo(4.448222, 6);
    // 1 US gallon = 231 in³ exactly = 3.785411784 l (from the exact inch)
    expect(galToL(1)).toBeCloseTo((231 * 25.4 ** 3) / 1e6, 12);
    // gauge ↔ absolute with the standard atmosphere, 101.325 kPa (exact by definition)
    expect(gaugeToAbsoluteKpa(0)).toBe(101.325);
    expect(absoluteToGaugeKpa(gaugeToAbsoluteKpa(620))).toBeCloseTo(620, 10);
  });

  it("round-trips", () => {
    expect(kpaToPsi(psiToKpa(90))).toBeCloseTo(90, 10);
    expect(lpsToScfm(scfmToLps(4))).toBeCloseTo(4, 10);
  });

  it("rates tools at 90 psi, about 6.2 bar (common practice)", () => {
    expect(RATED_INLET_KPA / 100).toBeCloseTo(6.2, 1);
    expect(barToKpa(6.2)).toBeCloseTo(620, 6);
  });
});

describe("hose pressure drop", () => {
  it("reproduces the recomputed check value", () => {
    // Atlas Copco, Compressed Air Manual, Δp = 450·qc^1.85·l/(d^5·p) (memory of the formula);
    // REFERENCES.md recomputed value: 10 l/s, 10 m, 10 mm, 7 bar(a) → 0.4551 bar
    expect(hosePressureDropBar({ flowLps: 10, lengthM: 10, insideDiameterMm: 10, inletAbsBar: 7 })).toBeCloseTo(
      0.4551,
      4,
    );
  });

  it("refuses values outside its range", () => {
    expect(() => hosePressureDropBar({ flowLps: 1, lengthM: -1, insideDiameterMm: 10, inletAbsBar: 7 })).toThrow(
      /length/,
    );
    expect(() => hosePressureDropBar({ flowLps: 1, lengthM: 1, insideDiameterMm: 0, inletAbsBar: 7 })).toThrow(
      /diameter/,
    );
    expect(() => hosePressureDropBar({ flowLps: 1, lengthM: 1, insideDiameterMm: 10, inletAbsBar: 0 })).toThrow(
      /absolute/,
    );
  });
});

describe("air demand", () => {
  it("equals the rating at the rating point and scales with absolute pressure (common practice)", () => {
    expect(airDemandLps(2, RATED_INLET_KPA)).toBeCloseTo(2, 10);
    expect(airDemandLps(2, 0)).toBeLessThan(airDemandLps(2, 400));
  });
});
