import { scaleLinear as d3Linear } from "d3-scale";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { scaleLinear } from "~/components/linear-scale";

// The charts' own linear scale must draw what d3-scale's scaleLinear draws (recomputed against the
// d3-scale package itself): the same mapped positions, the same nice domain and the same ticks.
describe("linear scale", () => {
  it("maps, rounds the domain and places ticks as d3-scale does", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        fc.integer({ min: 2, max: 12 }),
        (a, b, count) => {
          fc.pre(Math.abs(a - b) > 1e-6);
          const ours = scaleLinear().domain([a, b]).range([0, 300]).nice(count);
          const theirs = d3Linear().domain([a, b]).range([0, 300]).nice(count);
          expect(ours.domain()).toEqual(theirs.domain());
          expect(ours.ticks(count)).toEqual(theirs.ticks(count));
          for (const x of [a, b, (a + b) / 2]) expect(ours(x)).toBeCloseTo(theirs(x), 6);
        },
      ),
      { seed: 7, numRuns: 300 },
    );
  });

  it("copies a scale so a change to the copy leaves the original", () => {
    const a = scaleLinear().domain([0, 10]).range([0, 100]);
    const b = a.copy().range([0, 50]);
    expect(a(5)).toBe(50);
    expect(b(5)).toBe(25);
  });

  it("handles a domain of one point without dividing by zero", () => {
    expect(scaleLinear().domain([3, 3]).range([0, 10])(3)).toBe(5);
  });
});
