import { describe, expect, it } from "vitest";
import {
  formatDate,
  formatDateTime,
  formatFlow,
  formatForce,
  formatHoseId,
  formatHoseLength,
  formatInchFraction,
  formatLength,
  formatPressure,
  formatTime,
  formatTorque,
  formatVolume,
  formatWeight,
  METRIC_UNITS,
  systemForLocale,
  unitsOf,
  US_UNITS,
} from "~/domain";

// One unit system per viewer (issue 18). Conversion factors are NIST SP 811 (2008), Appendix B
// ("published"): 1 in = 2.54 E-02 m exactly; 1 ft = 3.048 E-01 m exactly; 1 gal (US) = 3.785 412 E-03 m³
// (231 in³ exactly); 1 psi = 6.894 757 E+00 kPa; 1 lbf = 4.448 222 E+00 N; 1 lb = 4.535 924 E-01 kg
// (0.45359237 exactly); 1 ft·lbf = 1.355 818 E+00 N·m; 1 ft³/min = 4.719 474 E-04 m³/s.
describe("hose bores in the trade's fractions", () => {
  it("reads exact inch sizes as fractions (1 in = 25.4 mm exactly, NIST SP 811)", () => {
    expect(formatHoseId(6.35, US_UNITS)).toBe("1/4 in");
    expect(formatHoseId(9.525, US_UNITS)).toBe("3/8 in");
    expect(formatHoseId(12.7, US_UNITS)).toBe("1/2 in");
    expect(formatHoseId(19.05, US_UNITS)).toBe("3/4 in");
    expect(formatHoseId(25.4, US_UNITS)).toBe("1 in");
  });
  it("reads values stored to 0.01 mm as the same fractions (9.53 mm is 3/8 in as entered)", () => {
    expect(formatHoseId(9.53, US_UNITS)).toBe("3/8 in");
    expect(formatHoseId(7.94, US_UNITS)).toBe("5/16 in");
  });
  it("writes whole and mixed inches the trade's way, and decimals off the sixty-fourths", () => {
    expect(formatInchFraction(1.5)).toBe("1 1/2");
    expect(formatInchFraction(0.3)).toBe("0.30");
  });
  it("reads metric bores in millimetres", () => {
    expect(formatHoseId(9.525, METRIC_UNITS)).toBe("9.5 mm");
    expect(formatHoseId(null, METRIC_UNITS)).toBe("—");
  });
});

describe("every quantity in one system", () => {
  it("pressure: psi, kPa, or bar kept for a metric reader who asks (1 psi = 6.894757 kPa, NIST SP 811)", () => {
    expect(formatPressure(6.894757 * 90, US_UNITS)).toBe("90 psi");
    expect(formatPressure(620.5, METRIC_UNITS)).toBe("621 kPa");
    expect(formatPressure(620.5, unitsOf("metric", "bar"))).toBe("6.2 bar");
    expect(unitsOf("us", "bar").pressure).toBe("psi");
  });
  it("hose length: feet or metres (1 ft = 0.3048 m exactly, NIST SP 811)", () => {
    expect(formatHoseLength(7.62, US_UNITS)).toBe("25 ft");
    expect(formatHoseLength(15.24, US_UNITS)).toBe("50 ft");
    expect(formatHoseLength(8, METRIC_UNITS)).toBe("8 m");
  });
  it("flow: SCFM or l/s (1 ft³/min = 0.4719474 l/s, NIST SP 811)", () => {
    expect(formatFlow(0.4719474 * 4, US_UNITS)).toBe("4.0 SCFM");
    expect(formatFlow(1.89, METRIC_UNITS)).toBe("1.89 l/s");
  });
  it("volume: gallons or litres (1 US gal = 3.785411784 l exactly, NIST SP 811)", () => {
    expect(formatVolume(3.785411784 * 20, US_UNITS)).toBe("20 gal");
    expect(formatVolume(75.7, METRIC_UNITS)).toBe("76 l");
  });
  it("force, torque and weight (1 lbf = 4.448222 N; 1 ft·lbf = 1.355818 N·m; 1 lb = 0.45359237 kg; NIST SP 811)", () => {
    expect(formatForce(4.448222 * 500, US_UNITS)).toBe("500 lbf");
    expect(formatForce(2224, METRIC_UNITS)).toBe("2224 N");
    expect(formatTorque(1.355818 * 600, US_UNITS)).toBe("600 ft·lbf");
    expect(formatTorque(813, METRIC_UNITS)).toBe("813 N·m");
    expect(formatWeight(0.45359237 * 3, US_UNITS)).toBe("3 lb");
    expect(formatWeight(1.36, METRIC_UNITS)).toBe("1.4 kg");
  });
  it("lengths of bits and tools: inches or millimetres", () => {
    expect(formatLength(177.8, US_UNITS)).toBe("7.0 in");
    expect(formatLength(19.05, US_UNITS)).toBe("0.75 in");
    expect(formatLength(178, METRIC_UNITS)).toBe("178 mm");
  });
});

describe("one date and time format, in UTC and saying so", () => {
  it("writes a day and a moment", () => {
    expect(formatDate("2026-12-02T14:05:09Z")).toBe("2 Dec 2026");
    expect(formatDateTime(new Date(Date.UTC(2026, 11, 2, 14, 5, 9)))).toBe("2 Dec 2026, 14:05 UTC");
    expect(formatTime("2026-12-02T07:12:12Z")).toBe("07:12 UTC");
    expect(formatDate(null)).toBe("—");
    expect(formatDateTime("not a date")).toBe("—");
  });
});

describe("a visitor's default system from Accept-Language", () => {
  it("reads US customary for the United States, metric for most others (common practice)", () => {
    expect(systemForLocale("en-US,en;q=0.9")).toBe("us");
    expect(systemForLocale("de-DE,de;q=0.9,en;q=0.8")).toBe("metric");
    expect(systemForLocale("en-GB")).toBe("metric");
    expect(systemForLocale("fr-CA")).toBe("metric");
    expect(systemForLocale("es-US")).toBe("us");
    expect(systemForLocale("fr")).toBe("metric");
    expect(systemForLocale("en")).toBe("us");
    expect(systemForLocale("zh-Hans-CN")).toBe("metric");
    expect(systemForLocale("de-DE;q=0, en-US")).toBe("us");
    expect(systemForLocale(null)).toBe("us");
    expect(systemForLocale("*")).toBe("us");
  });
});
