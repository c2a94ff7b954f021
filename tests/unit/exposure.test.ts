// The exposure module (app/exposure) against published tables and worked examples; the source of each
// check value is named beside it (../shared/REFERENCES.md, "Vibration and noise exposure").
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  IN_USE_FACTOR,
  VIBRATION_ACTION_VALUE,
  VIBRATION_LIMIT_VALUE,
  dayExposure,
  inUseValue,
  nioshPermissibleHours,
  noiseDose,
  oshaPermissibleHours,
  vibrationA8,
} from "~/exposure";

const SEED = { seed: 210021, numRuns: 200 };
const near = (actual: number | null, expected: number, tol: number) => {
  expect(actual).not.toBeNull();
  expect(Math.abs(actual! - expected)).toBeLessThanOrEqual(tol);
};

describe("hand-arm vibration A(8)", () => {
  it("action value 2.5 m/s² and limit value 5 m/s² A(8) (Directive 2002/44/EC, Article 3 — published)", () => {
    expect(VIBRATION_ACTION_VALUE).toBe(2.5);
    expect(VIBRATION_LIMIT_VALUE).toBe(5);
  });

  it("one tool: 5 m/s² for 2 h gives A(8) = 5·√(2/8) = 2.5 m/s² (ISO 5349-1:2001 formula — published; worked by hand)", () => {
    const day = vibrationA8([{ ahv: 5, hours: 2 }]);
    near(day.a8, 2.5, 1e-12);
    near(day.hoursToAction, 2, 1e-12); // the action value is reached at exactly 2 h
    near(day.hoursToLimit, 8, 1e-12); // 5 m/s² for 8 h is A(8) = 5
    near(day.points, 100, 1e-9); // 100 points at the action value (HSE ready reckoner — published)
  });

  it("5 m/s² for 3 h is 150 exposure points; 400 points at the limit value (HSE ready reckoner, hse.gov.uk/vibration/hav/readyreckoner.htm — published)", () => {
    near(vibrationA8([{ ahv: 5, hours: 3 }]).points, 150, 1e-9);
    near(vibrationA8([{ ahv: 5, hours: 8 }]).points, 400, 1e-9);
  });

  it("two tools combine as partial exposures (ISO 5349-1:2001 — published formula; worked by hand)", () => {
    // 10 m/s² for 0.5 h: A1(8)² = 100·0.5/8 = 6.25 (A1 = 2.5); 4 m/s² for 2 h: A2(8)² = 16·2/8 = 4 (A2 = 2).
    // A(8) = √(6.25 + 4) = √10.25 = 3.20156…; points = 2·(50 + 32) = 164.
    // Same mix (2.5 h in all) to the action value: 2.5 · 6.25/10.25 = 1.52439 h; to the limit: 2.5 · 25/10.25 = 6.09756 h.
    const day = vibrationA8([
      { ahv: 10, hours: 0.5 },
      { ahv: 4, hours: 2 },
    ]);
    near(day.a8, Math.sqrt(10.25), 1e-12);
    near(day.a8, 3.20156, 1e-5);
    near(day.points, 164, 1e-9);
    near(day.hoursToAction, 1.52439, 1e-5);
    near(day.hoursToLimit, 6.09756, 1e-5);
  });

  it("no vibration: A(8) = 0 and no time to either value", () => {
    expect(vibrationA8([])).toEqual({ a8: 0, hoursToAction: null, hoursToLimit: null, points: 0 });
    expect(vibrationA8([{ ahv: 8, hours: 0 }]).hoursToAction).toBeNull();
  });

  it("refuses negative or non-finite input (programmer error)", () => {
    expect(() => vibrationA8([{ ahv: -1, hours: 1 }])).toThrow(RangeError);
    expect(() => vibrationA8([{ ahv: 3, hours: Number.NaN }])).toThrow(RangeError);
  });

  const tools = fc.array(
    fc.record({ ahv: fc.double({ min: 0, max: 40, noNaN: true }), hours: fc.double({ min: 0, max: 10, noNaN: true }) }),
    { minLength: 1, maxLength: 6 },
  );

  it("more hours never lower the dose (property)", () => {
    fc.assert(
      fc.property(tools, fc.nat({ max: 5 }), fc.double({ min: 0, max: 5, noNaN: true }), (list, i, extra) => {
        const k = i % list.length;
        const more = list.map((t, j) => (j === k ? { ...t, hours: t.hours + extra } : t));
        expect(vibrationA8(more).a8).toBeGreaterThanOrEqual(vibrationA8(list).a8 - 1e-12);
      }),
      SEED,
    );
  });

  it("the order of the tools does not matter (property)", () => {
    fc.assert(
      fc.property(tools, (list) => {
        const a = vibrationA8(list);
        const b = vibrationA8([...list].reverse());
        expect(Math.abs(a.a8 - b.a8)).toBeLessThanOrEqual(1e-9 * Math.max(1, a.a8));
        expect(Math.abs(a.points - b.points)).toBeLessThanOrEqual(1e-9 * Math.max(1, a.points));
      }),
      SEED,
    );
  });
});

describe("noise dose", () => {
  // OSHA 29 CFR 1910.95 Table G-16 (published; the same table in 41 CFR 50-204.10 Table I).
  it.each([
    [90, 8],
    [95, 4],
    [100, 2],
    [105, 1],
    [110, 0.5],
    [115, 0.25],
  ])("OSHA: %i dBA → %f h (29 CFR 1910.95 Table G-16 — published)", (level, hours) => {
    near(oshaPermissibleHours(level), hours, 1e-12);
    near(noiseDose([{ lpa: level, hours }]).oshaDosePercent, 100, 1e-9);
  });

  it("OSHA Table G-16a reference durations between the steps: 92 dBA → 6.1 h, 85 → 16 h, 80 → 32 h (1910.95 Appendix A — published, one decimal)", () => {
    near(oshaPermissibleHours(92), 6.1, 0.05);
    near(oshaPermissibleHours(85), 16, 1e-12);
    near(oshaPermissibleHours(80), 32, 1e-12);
  });

  it("OSHA Appendix A dose for a mixed day, worked by hand (D = 100·ΣC/T — published formula)", () => {
    // 2 h at 95 dBA (T = 4 h) + 4 h at 90 dBA (T = 8 h) + 2 h at 85 dBA (T = 16 h) + 1 h at 75 dBA (below 80: not counted):
    // D = 100·(2/4 + 4/8 + 2/16) = 112.5 %.
    const day = noiseDose([
      { lpa: 95, hours: 2 },
      { lpa: 90, hours: 4 },
      { lpa: 85, hours: 2 },
      { lpa: 75, hours: 1 },
    ]);
    near(day.oshaDosePercent, 112.5, 1e-9);
  });

  it("OSHA: 8 h at 92 dBA is a dose of about 131 % and a TWA of 92 dBA by TWA = 16.61·log10(D/100) + 90 (1910.95 Appendix A — published)", () => {
    const dose = noiseDose([{ lpa: 92, hours: 8 }]).oshaDosePercent;
    near(dose, 131, 1.5);
    near(16.61 * Math.log10(dose / 100) + 90, 92, 0.01);
  });

  // NIOSH 98-126: REL 85 dBA as an 8-h TWA, 3 dB exchange rate (published; CDC's noise page gives the same times).
  it.each([
    [85, 8],
    [88, 4],
    [91, 2],
    [94, 1],
    [97, 0.5],
    [100, 0.25],
  ])("NIOSH: %i dBA → %f h (DHHS/NIOSH 98-126 — published)", (level, hours) => {
    near(nioshPermissibleHours(level), hours, 1e-12);
    near(noiseDose([{ lpa: level, hours }]).nioshDosePercent, 100, 1e-9);
  });

  it("NIOSH: 80 dBA → 25 h 24 min (NIOSH 98-126 Table 1-1, as quoted by CDC — published; to the minute)", () => {
    near(nioshPermissibleHours(80) * 60, 25 * 60 + 24, 1);
  });

  it("L_EX,8h: 8 h at 90 dB is 90 dB; 1 h at 99 dB is 99 − 10·log10 8 = 89.97 dB (ISO 9612:2009 formula — published; worked by hand)", () => {
    near(noiseDose([{ lpa: 90, hours: 8 }]).lex8h, 90, 1e-9);
    near(noiseDose([{ lpa: 99, hours: 1 }]).lex8h, 89.969, 1e-3);
  });

  it("L_EX,8h for a mixed day, worked by hand (ISO 9612:2009 formula — published)", () => {
    // 2 h at 100 dB + 6 h at 80 dB: 0.25·10^10 + 0.75·10^8 = 2.575·10^9 → 10·log10 = 94.108 dB.
    near(
      noiseDose([
        { lpa: 100, hours: 2 },
        { lpa: 80, hours: 6 },
      ]).lex8h,
      94.108,
      1e-3,
    );
  });

  it("no time at all: no exposure level and no dose", () => {
    expect(noiseDose([])).toEqual({ lex8h: Number.NEGATIVE_INFINITY, oshaDosePercent: 0, nioshDosePercent: 0 });
  });

  const sources = fc.array(
    fc.record({
      lpa: fc.double({ min: 60, max: 125, noNaN: true }),
      hours: fc.double({ min: 0, max: 10, noNaN: true }),
    }),
    { minLength: 1, maxLength: 6 },
  );

  it("more hours never lower L_EX,8h or either dose (property)", () => {
    fc.assert(
      fc.property(sources, fc.nat({ max: 5 }), fc.double({ min: 0, max: 5, noNaN: true }), (list, i, extra) => {
        const k = i % list.length;
        const a = noiseDose(list);
        const b = noiseDose(list.map((s, j) => (j === k ? { ...s, hours: s.hours + extra } : s)));
        expect(b.lex8h).toBeGreaterThanOrEqual(a.lex8h - 1e-9);
        expect(b.oshaDosePercent).toBeGreaterThanOrEqual(a.oshaDosePercent - 1e-9);
        expect(b.nioshDosePercent).toBeGreaterThanOrEqual(a.nioshDosePercent - 1e-9);
      }),
      SEED,
    );
  });

  it("the order of the sources does not matter (property)", () => {
    fc.assert(
      fc.property(sources, (list) => {
        const a = noiseDose(list);
        const b = noiseDose([...list].reverse());
        if (Number.isFinite(a.lex8h)) expect(Math.abs(a.lex8h - b.lex8h)).toBeLessThanOrEqual(1e-9);
        expect(Math.abs(a.oshaDosePercent - b.oshaDosePercent)).toBeLessThanOrEqual(
          1e-9 * Math.max(1, a.oshaDosePercent),
        );
        expect(Math.abs(a.nioshDosePercent - b.nioshDosePercent)).toBeLessThanOrEqual(
          1e-9 * Math.max(1, a.nioshDosePercent),
        );
      }),
      SEED,
    );
  });
});

describe("declared or in-use vibration", () => {
  it("declared passes through; in-use multiplies by the stated factor and names its source (CEN/TR 15350 — factor from memory)", () => {
    expect(inUseValue(8, "declared")).toMatchObject({ value: 8, factor: 1 });
    const inUse = inUseValue(8, "in-use");
    expect(inUse.factor).toBe(IN_USE_FACTOR);
    expect(inUse.value).toBe(8 * IN_USE_FACTOR);
    expect(inUse.source).toMatch(/CEN\/TR 15350/);
  });
});

describe("a day on the tools", () => {
  it("carries the time interval to every figure (worked by hand)", () => {
    // 6 jobs of 20 min (10–40) at 5 m/s² and 100 dB: 2 h (1–4 h) → A(8) = 2.5 (1.768–3.536) m/s², share 1 (0.5–2).
    const day = dayExposure([
      { ahv: 5, lpa: 100, minutesPerJob: { estimate: 20, lower: 10, upper: 40 }, jobsPerDay: 6 },
    ]);
    near(day.triggerHours.estimate, 2, 1e-12);
    near(day.triggerHours.lower, 1, 1e-12);
    near(day.triggerHours.upper, 4, 1e-12);
    near(day.a8.estimate, 2.5, 1e-12);
    near(day.a8.lower, Math.sqrt(5 * 5 * (1 / 8)), 1e-12);
    near(day.a8.upper, Math.sqrt(5 * 5 * (4 / 8)), 1e-12);
    near(day.shareOfActionValue.estimate, 1, 1e-12);
    near(day.shareOfActionValue.lower, 0.5, 1e-12);
    near(day.shareOfActionValue.upper, 2, 1e-12);
    near(day.oshaDosePercent.estimate, 100, 1e-9); // 2 h at 100 dBA is Table G-16's 2 h
    near(day.lex8h.estimate, 100 + 10 * Math.log10(2 / 8), 1e-9);
  });

  it("a bound is null when any time lacks it", () => {
    const day = dayExposure([
      { ahv: 5, lpa: 100, minutesPerJob: { estimate: 20, lower: 10, upper: null }, jobsPerDay: 6 },
      { ahv: 3, lpa: 92, minutesPerJob: { estimate: 5, lower: 4, upper: 7 }, jobsPerDay: 2 },
    ]);
    expect(day.a8.upper).toBeNull();
    expect(day.a8.lower).not.toBeNull();
  });

  it("lower ≤ estimate ≤ upper for every figure (property)", () => {
    const item = fc
      .record({
        ahv: fc.double({ min: 0, max: 30, noNaN: true }),
        lpa: fc.double({ min: 70, max: 120, noNaN: true }),
        lo: fc.double({ min: 0, max: 30, noNaN: true }),
        mid: fc.double({ min: 0, max: 30, noNaN: true }),
        hi: fc.double({ min: 0, max: 30, noNaN: true }),
        jobsPerDay: fc.integer({ min: 0, max: 20 }),
      })
      .map(({ ahv, lpa, lo, mid, hi, jobsPerDay }) => ({
        ahv,
        lpa,
        jobsPerDay,
        minutesPerJob: { lower: lo, estimate: lo + mid, upper: lo + mid + hi },
      }));
    fc.assert(
      fc.property(fc.array(item, { minLength: 1, maxLength: 4 }), (items) => {
        const day = dayExposure(items);
        for (const figure of Object.values(day)) {
          expect(figure.lower).toBeLessThanOrEqual(figure.estimate + 1e-9);
          expect(figure.upper).toBeGreaterThanOrEqual(figure.estimate - 1e-9);
        }
      }),
      SEED,
    );
  });

  it("refuses a time interval that does not hold its estimate", () => {
    expect(() =>
      dayExposure([{ ahv: 5, lpa: 100, minutesPerJob: { estimate: 5, lower: 10, upper: 12 }, jobsPerDay: 1 }]),
    ).toThrow(RangeError);
  });
});
