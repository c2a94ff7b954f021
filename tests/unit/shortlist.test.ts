// The shortlist's filtering, front, best pick and day from a hand-made job: each constraint excludes
// the tool it should, with its reason, and the address is read field by field.
import { describe, expect, it } from "vitest";
import { US_UNITS } from "~/domain";
import { buildShortlist, type ShortlistTool } from "~/exposure/shortlist";
import { readShortlist } from "~/exposure/shortlist-form";

const tool = (slug: string, over: Partial<ShortlistTool> = {}): ShortlistTool => ({
  slug,
  label: slug.toUpperCase(),
  fitting: "shank-0.401",
  weightKg: 1.5,
  lengthMm: 250,
  priceCents: 20000,
  air: { ratedLps: 2, runningLps: null, runningSource: null, runningFactor: null },
  fit: null,
  adjReason: "no fit",
  n: 20,
  successes: 14,
  designEffect: 1.2,
  rate: { estimate: 0.7, lower: 0.5, upper: 0.85 },
  km: { median: 120, lower: 80, upper: 200 },
  ahv: 8,
  ahvK: 1.5,
  lpa: 98,
  lpaK: 3,
  ...over,
});

const tools = [
  tool("small"),
  tool("big", { fitting: "shank-0.498", weightKg: 2.6, lengthMm: 330, priceCents: 38000, successes: 18 }),
  tool("buzzy", { ahv: 20, km: { median: 600, lower: 400, upper: 900 } }),
  tool("slow", { km: { median: null, lower: null, upper: null } }),
];

describe("buildShortlist", () => {
  it("filters on bits, weight, price, air and the day's vibration, saying why", () => {
    const { ask, errors } = readShortlist(
      { bits: "shank-0.498", maxw: "5", maxp: "300", comp: "30", jobs: "6", maxv: "150" },
      "us",
    );
    expect(errors).toEqual({});
    expect(ask).toMatchObject({ jobsPerDay: 6, bits: "shank-0.498", maxPriceCents: 30000, maxVibrationShare: 1.5 });
    const s = buildShortlist(tools, ask, null, US_UNITS);
    expect(s.passing.map((c) => c.slug)).toEqual([]);
    const why = Object.fromEntries(s.excluded.map((x) => [x.slug, x.reasons.join("; ")]));
    expect(why.small).toMatch(/takes 0\.401 in shank bits/);
    expect(why.big).toMatch(/weighs 5\.7 lb/);
    expect(why.big).toMatch(/costs \$380/);
    expect(why.slow).toMatch(/no median time/);
  });

  it("without constraints every tool passes; the front and the best pick cover them", () => {
    const { ask } = readShortlist({ jobs: "6" }, "metric");
    const s = buildShortlist(tools, ask, null, US_UNITS);
    expect(s.passing).toHaveLength(4);
    expect(s.front.length).toBeGreaterThan(0);
    // "slow" has no time, which is weighed, so it sits out of the draw and says so.
    expect(s.best?.leftOut).toEqual(["SLOW"]);
    expect(s.best?.chances.reduce((a, c) => a + c.chance, 0)).toBeCloseTo(1, 9);
    // A day of six 2-minute jobs at 8 m/s²: A(8)² / 2.5² = 64 · 0.2 h / 8 h / 6.25 = 0.256 (recomputed).
    expect(s.passing.find((c) => c.slug === "small")?.day?.shareOfActionValue.estimate).toBeCloseTo(0.256, 6);
  });

  it("reads each field on its own: a bad one has its message and costs only itself", () => {
    const { ask, errors } = readShortlist({ maxw: "heavy", jobs: "0", minc: "120", w_price: "9", seed: "7" }, "us");
    expect(errors.maxw).toMatch(/Maximum weight/);
    expect(errors.jobs).toMatch(/Jobs a day: 1–100/);
    expect(errors.minc).toMatch(/Least chance/);
    expect(errors.w_price).toMatch(/pick one/);
    expect(ask).toMatchObject({ maxWeightKg: null, jobsPerDay: 1, minChance: null, seed: 7 });
    expect(ask.weights.price).toBe(1);
  });
});
