// Trace analysis against synthetic traces whose blows are known (made by synthesizeTrace, seeded):
// count, times, peaks and rate, with noise, baseline drift, a clipped blow and a double strike;
// and the properties that scaling a trace scales its peaks and shifting it changes nothing.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { analyseTrace, decimateForDrawing, synthesizeTrace } from "~/bench";

const RATE = 10_000;
const base = { rateHz: RATE, blowsPerMinute: 3000, peak: 5000, peakSD: 300, noiseSD: 20, driftPerS: 3, seed: 7 };

/** Each found blow matched to the nearest known one. */
function matchBlows<K extends { timeS: number }>(found: { timeS: number }[], known: K[]): K[] {
  return found.map((f) =>
    known.reduce((best, k) => (Math.abs(k.timeS - f.timeS) < Math.abs(best.timeS - f.timeS) ? k : best)),
  );
}

describe("analyseTrace on synthetic traces with known blows", () => {
  it("finds every blow, its time and peak, and the rate, through noise and drift", () => {
    const { samples, blows } = synthesizeTrace({ ...base, seconds: 20 });
    const result = analyseTrace(samples, RATE);
    expect(blows.length).toBeGreaterThan(900);
    expect(result.blows).toHaveLength(blows.length);
    result.blows.forEach((b, i) => {
      expect(Math.abs(b.timeS - blows[i]!.timeS)).toBeLessThan(0.0002); // two samples
      // Sampled peaks carry the noise (SD 20 N) at the top sample: within 1 % + 5 SD.
      expect(Math.abs(b.peak - blows[i]!.peak)).toBeLessThan(0.01 * blows[i]!.peak + 100);
      expect(b.clipped).toBe(false);
    });
    expect(result.blowsPerMinute! / 3000).toBeCloseTo(1, 2);
    // The drift is 3 N/s from 0 over 20 s: the windows' median quiet level is near 30 N.
    expect(Math.abs(result.baseline - 30)).toBeLessThan(5);
    const peaks = blows.map((b) => b.peak).sort((a, b) => a - b);
    expect(Math.abs(result.summary.median - peaks[peaks.length >> 1]!)).toBeLessThan(60);
    expect(result.summary.n).toBe(blows.length);
  });

  it("light blows at a slower rate and a lower sample rate", () => {
    const opts = { ...base, rateHz: 5000, blowsPerMinute: 1200, peak: 400, peakSD: 30, noiseSD: 8, seconds: 15 };
    const { samples, blows } = synthesizeTrace(opts);
    const result = analyseTrace(samples, 5000);
    expect(result.blows).toHaveLength(blows.length);
    matchBlows(result.blows, blows).forEach((k, i) => {
      expect(Math.abs(result.blows[i]!.peak - k.peak)).toBeLessThan(0.03 * k.peak + 40);
    });
    expect(result.blowsPerMinute! / 1200).toBeCloseTo(1, 2);
  });

  it("marks a blow clipped at the sensor's capacity", () => {
    const opts = { ...base, driftPerS: 0, seconds: 5 };
    const [first, second] = synthesizeTrace(opts)
      .blows.map((b) => b.peak)
      .sort((a, b) => b - a);
    expect(first! - second!).toBeGreaterThan(150); // the seed gives one clearly largest blow
    const capacity = (first! + second!) / 2;
    const { samples, blows } = synthesizeTrace({ ...opts, capacity });
    const result = analyseTrace(samples, RATE, { capacity });
    expect(result.blows).toHaveLength(blows.length);
    const clipped = result.blows.filter((b) => b.clipped);
    expect(clipped).toHaveLength(1);
    expect(Math.abs(clipped[0]!.timeS - blows.find((b) => b.peak === first)!.timeS)).toBeLessThan(0.0005);
    // Its peak is the clipped reading above the local baseline (a lower bound), not extrapolated.
    expect(Math.abs(clipped[0]!.peak - (capacity - result.baseline))).toBeLessThan(5);
  });

  it("of two blows closer than the minimum spacing, keeps one — the larger", () => {
    const plain = synthesizeTrace({ ...base, seconds: 4 });
    const at = plain.blows[50]!.timeS + 0.004;
    const { samples, blows } = synthesizeTrace({ ...base, seconds: 4, extraBlowsAtS: [at] });
    expect(blows).toHaveLength(plain.blows.length + 1);
    const result = analyseTrace(samples, RATE);
    expect(result.blows).toHaveLength(plain.blows.length);
    const pair = blows.filter((b) => Math.abs(b.timeS - at) < 0.0045);
    expect(pair).toHaveLength(2);
    const larger = pair[0]!.peak > pair[1]!.peak ? pair[0]! : pair[1]!;
    const kept = result.blows.find((b) => Math.abs(b.timeS - at) < 0.0045)!;
    expect(Math.abs(kept.timeS - larger.timeS)).toBeLessThan(0.0002);
    // With a spacing shorter than the gap, both are blows.
    expect(analyseTrace(samples, RATE, { minSpacingS: 0.003 }).blows).toHaveLength(plain.blows.length + 1);
  });

  it("takes the rate from the spacing between blows, not the count over the trace's length", () => {
    const { samples, blows } = synthesizeTrace({ ...base, seconds: 10 });
    const quiet = synthesizeTrace({ ...base, seconds: 5, blowsPerMinute: 1e-6, seed: 8 }).samples;
    const trace = new Float64Array(samples.length + quiet.length);
    trace.set(samples);
    trace.set(
      quiet.map((v) => v + 30),
      samples.length,
    );
    const result = analyseTrace(trace, RATE);
    expect(result.blows).toHaveLength(blows.length);
    expect(result.blowsPerMinute! / 3000).toBeCloseTo(1, 2); // the count over 15 s would say 2,000
  });

  it("leaves the first blows out of the summary when asked", () => {
    const { samples, blows } = synthesizeTrace({ ...base, seconds: 3 });
    const result = analyseTrace(samples, RATE, { discardBlows: 10 });
    expect(result.blows).toHaveLength(blows.length);
    expect(result.summary.n).toBe(blows.length - 10);
  });

  it("a trace of noise alone has no blows and no rate", () => {
    const { samples } = synthesizeTrace({ ...base, seconds: 2, blowsPerMinute: 1e-6 });
    const result = analyseTrace(samples, RATE);
    expect(result.blows).toEqual([]);
    expect(result.blowsPerMinute).toBeNull();
    expect(result.summary.n).toBe(0);
  });

  it("a noiseless trace: every blow, nothing from rounding residue", () => {
    const { samples, blows } = synthesizeTrace({ ...base, seconds: 5, peakSD: 0, noiseSD: 0 });
    const result = analyseTrace(samples, RATE);
    expect(result.blows).toHaveLength(blows.length);
    expect(result.summary.p10 / 5000).toBeCloseTo(1, 2);
  });

  it("refuses a bad rate or an empty trace", () => {
    expect(() => analyseTrace([1, 2], 0)).toThrow(RangeError);
    expect(() => analyseTrace([], RATE)).toThrow(RangeError);
    expect(() => analyseTrace([0, 1, NaN, 1, 0], RATE)).toThrow(/sample 2 is not a finite number/);
  });
});

describe("analyseTrace properties (fast-check, fixed seed)", () => {
  const traces = fc.record({ seed: fc.integer({ min: 1, max: 1e6 }), bpm: fc.integer({ min: 900, max: 5000 }) });

  it("scaling the trace by c scales every peak by c and moves no blow", () => {
    fc.assert(
      fc.property(traces, fc.double({ min: 0.05, max: 20, noNaN: true }), ({ seed, bpm }, c) => {
        const { samples } = synthesizeTrace({ ...base, seed, blowsPerMinute: bpm, seconds: 1.5 });
        const a = analyseTrace(samples, RATE);
        const b = analyseTrace(
          samples.map((v) => v * c),
          RATE,
        );
        expect(b.blows).toHaveLength(a.blows.length);
        a.blows.forEach((blow, i) => {
          expect(b.blows[i]!.peak / (c * blow.peak)).toBeCloseTo(1, 9);
          expect(b.blows[i]!.timeS).toBeCloseTo(blow.timeS, 9);
        });
      }),
      { seed: 19, numRuns: 25 },
    );
  });

  it("adding a constant offset leaves every peak unchanged", () => {
    fc.assert(
      fc.property(traces, fc.double({ min: -20_000, max: 20_000, noNaN: true }), ({ seed, bpm }, k) => {
        const { samples } = synthesizeTrace({ ...base, seed, blowsPerMinute: bpm, seconds: 1.5 });
        const a = analyseTrace(samples, RATE);
        const b = analyseTrace(
          samples.map((v) => v + k),
          RATE,
        );
        expect(b.blows).toHaveLength(a.blows.length);
        expect(b.baseline - a.baseline).toBeCloseTo(k, 6);
        a.blows.forEach((blow, i) => {
          expect(b.blows[i]!.peak).toBeCloseTo(blow.peak, 6);
          expect(b.blows[i]!.timeS).toBeCloseTo(blow.timeS, 9);
        });
      }),
      { seed: 19, numRuns: 25 },
    );
  });
});

describe("decimateForDrawing", () => {
  it("keeps every extreme in an 800-bucket envelope", () => {
    const { samples } = synthesizeTrace({ ...base, seconds: 6 });
    const env = decimateForDrawing(samples, RATE);
    expect(env).toHaveLength(800);
    expect(Math.max(...env.map((b) => b.max))).toBe(Math.max(...samples));
    expect(Math.min(...env.map((b) => b.min))).toBe(Math.min(...samples));
    expect(env[1]!.timeS).toBeCloseTo(60_000 / 800 / RATE, 12);
    expect(env.every((b) => b.min <= b.max)).toBe(true);
  });

  it("a trace shorter than the buckets gives one bucket a sample", () => {
    expect(decimateForDrawing([3, 1, 2], 100, 800)).toEqual([
      { timeS: 0, min: 3, max: 3 },
      { timeS: 0.01, min: 1, max: 1 },
      { timeS: 0.02, min: 2, max: 2 },
    ]);
  });
});

describe("synthesizeTrace", () => {
  it("is the same for the same seed and different for another", () => {
    const a = synthesizeTrace({ ...base, seconds: 1 });
    expect(synthesizeTrace({ ...base, seconds: 1 }).samples).toEqual(a.samples);
    expect(synthesizeTrace({ ...base, seconds: 1, seed: 8 }).samples).not.toEqual(a.samples);
    expect(a.samples).toHaveLength(RATE);
  });
});
