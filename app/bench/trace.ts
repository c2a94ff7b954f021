// A raw bench trace: the force (or torque) a load cell saw, sampled at a fixed rate. The same
// analysis runs in the browser (a preview before submitting) and on the server (the stored figures),
// so it uses nothing but the language: no Node APIs, no DOM.
import { peakSummary, type PeakSummary } from "./peaks";
import { medianOf } from "./quickselect";

export { parseTraceCsv, TraceError, type ParseTraceOptions } from "./trace-csv";
export { synthesizeTrace, type SynthesizeTraceOptions } from "./trace-synthetic";

/** Fastest blow rate we accept as one blow per peak, per minute (our rule, above the rates air hammers are sold at). */
export const MAX_PLAUSIBLE_BPM = 7200;
/** Length of the windows in which the quiet level is measured, so a slow drift is removed with it. */
export const BASELINE_WINDOW_S = 0.5;
/** Default blow threshold: this many robust noise SDs above the baseline… */
export const NOISE_MULTIPLE = 8;
/** …and at least this fraction of the median candidate peak, so ring-down and bounces are not blows. */
export const PEAK_FRACTION = 0.25;
/** Samples per window from which the quiet level is measured. */
const WINDOW_SUBSAMPLE = 1024;

export interface TraceBlow {
  timeS: number;
  peak: number;
  clipped: boolean;
}

export interface TraceAnalysis {
  baseline: number;
  blows: TraceBlow[];
  blowsPerMinute: number | null;
  summary: PeakSummary;
}

export interface AnalyseTraceOptions {
  /** Blow threshold above the baseline, in the trace's unit; default described on analyseTrace. */
  threshold?: number;
  /** Shortest time between two blows; of two peaks closer than this the larger is kept. */
  minSpacingS?: number;
  /** Sensor capacity: a blow whose raw reading reaches it is marked clipped. */
  capacity?: number;
  /** Blows left out of the summary at the start of the trace (warm-up). */
  discardBlows?: number;
}

/**
 * Finds the blows in a trace.
 *
 * Baseline: the trace is cut into 0.5 s windows; in each, the quiet samples are those within 3 robust
 * SDs (1.4826·MAD) of the window's median, and the window's level is their median (each window
 * measured on an evenly strided subsample of about 1,024 of its samples). The level is
 * interpolated linearly between window centres and subtracted, which removes a slow drift too.
 * `baseline` reports the median of the window levels. Noise σ: the median over windows of 1.4826·MAD
 * of the quiet samples. Each step is a quickselect, so the whole analysis is linear in the samples.
 *
 * Blows: local maxima of the baseline-removed trace above the threshold, at least minSpacingS apart
 * (default 60/7200 s; within the spacing the larger peak is kept). Default threshold: above 8σ, and
 * then at least 25 % of the median of those candidate peaks (our rules). Peak height and time are
 * refined by a parabola through the top sample and its neighbours; a flat top (a clipped blow) keeps
 * its level and its middle. clipped: the raw reading reached the capacity; such a peak is the
 * clipped reading above the baseline, a lower bound, never extrapolated.
 *
 * blowsPerMinute: 60 / the median interval between consecutive blows (after discardBlows when two
 * or more remain), robust to a missed or an extra blow, unlike a count over the trace's length.
 * summary: median, p10 and p90 of the peaks after discardBlows. Times are from the first sample.
 * Throws RangeError on a bad rate, an empty trace or a non-finite sample (programmer errors: a parsed
 * trace has none).
 */
export function analyseTrace(
  samples: ArrayLike<number>,
  rateHz: number,
  options: AnalyseTraceOptions = {},
): TraceAnalysis {
  const n = samples.length;
  if (!(rateHz > 0) || !Number.isFinite(rateHz)) throw new RangeError("rateHz must be a positive number");
  if (n === 0) throw new RangeError("the trace is empty");
  const spacing = (options.minSpacingS ?? 60 / MAX_PLAUSIBLE_BPM) * rateHz;
  const discard = options.discardBlows ?? 0;

  // One typed array from here on: every loop below then reads the same kind of array.
  const raw = samples instanceof Float64Array ? samples : Float64Array.from(samples);
  for (let i = 0; i < n; i++) {
    if (raw[i]! - raw[i]! !== 0) throw new RangeError(`sample ${i} is not a finite number`);
  }
  const { detrended, baseline, noise, lowest } = removeBaseline(raw, rateHz);
  let found: Peak[];
  if (options.threshold !== undefined) {
    found = findPeaks(raw, detrended, options.threshold + lowest, options.threshold, spacing);
  } else {
    // A noiseless trace (σ = 0) still needs a floor above rounding residue: a millionth of its range.
    let top = -Infinity;
    for (let i = 0; i < n; i++) if (raw[i]! > top) top = raw[i]!;
    const floor = Math.max(NOISE_MULTIPLE * noise, 1e-6 * (top - lowest));
    const candidates = findPeaks(raw, detrended, floor + lowest, floor, spacing);
    const typical = candidates.length ? peakSummary(candidates.map((c) => c.height)).median : 0;
    const threshold = Math.max(floor, PEAK_FRACTION * typical);
    found = candidates.filter((c) => c.height >= threshold);
  }

  const capacity = options.capacity;
  // A clipped blow's true peak is unknown (at least the capacity): report the clipped reading, not a
  // parabola through it.
  const blows = found.map((p) => {
    const clipped = capacity !== undefined && raw[p.top]! >= capacity;
    return { timeS: p.position / rateHz, peak: clipped ? detrended(p.top) : p.height, clipped };
  });
  const kept = blows.length - discard >= 2 ? blows.slice(discard) : blows;
  const intervals: number[] = [];
  for (let i = 1; i < kept.length; i++) intervals.push(kept[i]!.timeS - kept[i - 1]!.timeS);
  const blowsPerMinute = intervals.length ? 60 / peakSummary(intervals).median : null;
  const summary = peakSummary(blows.slice(discard).map((b) => b.peak));
  return { baseline, blows, blowsPerMinute, summary };
}

function removeBaseline(samples: Float64Array, rateHz: number) {
  const n = samples.length;
  const win = Math.max(2, Math.round(BASELINE_WINDOW_S * rateHz));
  const windows = Math.max(1, Math.floor(n / win));
  const centres = new Float64Array(windows);
  const levels = new Float64Array(windows);
  const noises = new Float64Array(windows);
  // A window's statistics come from an evenly strided subsample of at most ~WINDOW_SUBSAMPLE values:
  // plenty for a median, and it keeps the baseline's cost well below one pass over the trace.
  const scratch = new Float64Array(2 * WINDOW_SUBSAMPLE + 2);
  const picked = new Float64Array(2 * WINDOW_SUBSAMPLE + 2);
  const deviations = new Float64Array(2 * WINDOW_SUBSAMPLE + 2);
  for (let w = 0; w < windows; w++) {
    const start = w * win;
    const end = w === windows - 1 ? n : start + win;
    const stride = Math.max(1, Math.floor((end - start) / WINDOW_SUBSAMPLE));
    let len = 0;
    for (let i = start; i < end; i += stride) picked[len++] = samples[i]!;
    scratch.set(picked.subarray(0, len));
    const m = medianOf(scratch, len);
    for (let i = 0; i < len; i++) deviations[i] = Math.abs(picked[i]! - m);
    const limit = 3 * 1.4826 * medianOf(deviations, len);
    let q = 0;
    for (let i = 0; i < len; i++) if (Math.abs(picked[i]! - m) <= limit) scratch[q++] = picked[i]!;
    const level = medianOf(scratch, q);
    for (let i = 0; i < q; i++) deviations[i] = Math.abs(scratch[i]! - level);
    levels[w] = level;
    noises[w] = 1.4826 * medianOf(deviations, q);
    centres[w] = (start + end - 1) / 2;
  }

  return {
    detrended: detrender(samples, centres, levels),
    lowest: levels.reduce((m, v) => Math.min(m, v), Infinity),
    baseline: medianOf(Float64Array.from(levels), windows),
    noise: medianOf(noises, windows),
  };
}

/**
 * d(i) = sample i − the window levels interpolated linearly between window centres (flat beyond
 * them). Computed on demand rather than into a second 600,000-sample array: writing a fresh array
 * that size costs more than the whole analysis. Calls run nearly in order, so the window is tracked.
 */
function detrender(samples: Float64Array, centres: Float64Array, levels: Float64Array) {
  const last = levels.length - 1;
  let w = 0;
  return (i: number): number => {
    if (last === 0 || i <= centres[0]!) return samples[i]! - levels[0]!;
    if (i >= centres[last]!) return samples[i]! - levels[last]!;
    while (i > centres[w + 1]!) w++;
    while (i < centres[w]!) w--;
    const from = centres[w]!;
    return samples[i]! - (levels[w]! + ((i - from) * (levels[w + 1]! - levels[w]!)) / (centres[w + 1]! - from));
  };
}

interface Peak {
  position: number;
  height: number;
  top: number;
}

/**
 * Local maxima of d above the threshold, at least `spacing` samples apart (the larger kept). d(i) is
 * never above raw[i] − the lowest window level, so a sample at or below `gate` (threshold + that
 * level) is passed over by one comparison: the scan reads the raw samples, and d is computed only
 * near the blows.
 */
function findPeaks(raw: Float64Array, d: (i: number) => number, gate: number, threshold: number, spacing: number) {
  const peaks: Peak[] = [];
  const n = raw.length;
  for (let i = 1; i < n - 1; i++) {
    if (!(raw[i]! > gate)) continue;
    const v = d(i);
    if (!(v > threshold)) continue;
    const before = d(i - 1);
    if (!(v > before)) continue;
    let after = d(i + 1);
    if (after > v) continue;
    // A flat top: walk to its end; a peak only if the trace falls after it.
    let j = i;
    while (after === v && j + 1 < n - 1) after = d(++j + 1);
    if (!(after < v)) {
      i = j;
      continue;
    }
    let position = (i + j) / 2;
    let height = v;
    if (i === j) {
      const curvature = before - 2 * v + after;
      if (curvature < 0) {
        const offset = Math.max(-0.5, Math.min(0.5, (0.5 * (before - after)) / curvature));
        position = i + offset;
        height = v - 0.25 * (before - after) * offset;
      }
    }
    const last = peaks[peaks.length - 1];
    if (last && position - last.position < spacing) {
      if (height > last.height) peaks[peaks.length - 1] = { position, height, top: i };
    } else {
      peaks.push({ position, height, top: i });
    }
    i = j;
  }
  return peaks;
}

/**
 * Min/max envelope for drawing: the trace cut into `buckets` equal runs of samples, each with its
 * start time, lowest and highest value — an SVG path through them shows every peak at any zoom.
 */
export function decimateForDrawing(
  samples: ArrayLike<number>,
  rateHz: number,
  buckets = 800,
): { timeS: number; min: number; max: number }[] {
  if (!(rateHz > 0)) throw new RangeError("rateHz must be a positive number");
  const n = samples.length;
  const count = Math.min(Math.max(1, Math.floor(buckets)), n);
  const out: { timeS: number; min: number; max: number }[] = [];
  for (let k = 0; k < count; k++) {
    const start = Math.floor((k * n) / count);
    const end = Math.floor(((k + 1) * n) / count);
    let min = Infinity;
    let max = -Infinity;
    for (let i = start; i < end; i++) {
      const v = samples[i]!;
      if (v < min) min = v;
      if (v > max) max = v;
    }
    out.push({ timeS: start / rateHz, min, max });
  }
  return out;
}
