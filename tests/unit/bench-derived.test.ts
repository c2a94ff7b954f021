// The derived bench figures (app/bench/derived-figures.ts) that the model page and /compare share. The
// check values are worked by hand from the invented figures below: plain division, no published source.
import { describe, expect, it } from "vitest";
import { derivedFigures, headlineForce, type PooledSeriesFigure } from "~/bench/derived-figures";

const figure = (over: Partial<PooledSeriesFigure>): PooledSeriesFigure => ({
  figure: "force",
  protocol_id: 2,
  label: "Full trigger, regulated",
  trigger: "full",
  inlet: "regulated_at_tool",
  quantity: "peak_force_n",
  estimate: 9000,
  lower: 8500,
  upper: 9600,
  runs: 3,
  rigs: 2,
  ...over,
});

const model = { weight_kg: 2.5, length_mm: 250, street_price_cents: 45_000 };

describe("derivedFigures", () => {
  it("divides the headline force and both ends of its interval by weight, length and price", () => {
    const d = derivedFigures([figure({})], model)!;
    // 9000 / 2.5 kg, 8500 / 2.5, 9600 / 2.5.
    expect(d.perKg).toEqual({ estimate: 3600, lower: 3400, upper: 3840 });
    // 250 mm is 2.5 lots of 100 mm.
    expect(d.per100mm).toEqual({ estimate: 3600, lower: 3400, upper: 3840 });
    // $450 is 4.5 lots of $100: 9000 / 4.5, 8500 / 4.5, 9600 / 4.5.
    expect(d.perHundredDollars!.estimate).toBeCloseTo(2000, 9);
    expect(d.perHundredDollars!.lower).toBeCloseTo(1888.888889, 5);
    expect(d.perHundredDollars!.upper).toBeCloseTo(2133.333333, 5);
    expect(d.pooled).toMatchObject({ estimate: 9000, series: "Full trigger, regulated", runs: 3, rigs: 2 });
    expect(d.triggerRange).toBeNull();
  });

  it("has no price figure without a street price, and nothing without a model or a headline series", () => {
    expect(derivedFigures([figure({})], { ...model, street_price_cents: null })!.perHundredDollars).toBeNull();
    expect(derivedFigures([figure({})], null)).toBeNull();
    expect(derivedFigures([figure({ inlet: "open_line" }), figure({ trigger: "lightest_steady" })], model)).toBeNull();
  });

  it("takes the regulated full-trigger series with the most runs, the first on a tie", () => {
    const a = figure({ label: "a", runs: 4 });
    const b = figure({ label: "b", runs: 6, inlet: "open_line" });
    const c = figure({ label: "c", runs: 4 });
    expect(headlineForce([a, b, c])?.label).toBe("a");
    expect(headlineForce([a, c, figure({ label: "d", runs: 5 })])?.label).toBe("d");
  });

  it("takes the trigger control range of the headline's protocol before a busier one of another", () => {
    const range = (protocol_id: number, runs: number, label: string) =>
      figure({ figure: "trigger_range", trigger: "lightest_steady", protocol_id, runs, label, estimate: 4000 });
    const d = derivedFigures([figure({}), range(1, 9, "older"), range(2, 2, "own")], model)!;
    expect(d.triggerRange).toMatchObject({ series: "own", runs: 2, estimate: 4000 });
    expect(derivedFigures([figure({}), range(1, 9, "older")], model)!.triggerRange?.series).toBe("older");
  });
});
