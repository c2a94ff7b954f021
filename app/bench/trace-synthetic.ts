// Synthetic traces with known blows, for the tests and the demo. Seeded, so the same options give
// the same samples everywhere.
import { mulberry32, normalSource } from "~/utils/random";

export interface SynthesizeTraceOptions {
  rateHz: number;
  seconds: number;
  blowsPerMinute: number;
  /** Mean blow peak above the baseline, in the trace's unit. */
  peak: number;
  /** Blow-to-blow SD of the peak. */
  peakSD: number;
  /** SD of the white noise added to every sample. */
  noiseSD: number;
  /** Slope of a linear baseline drift, unit per second (the baseline starts at 0). */
  driftPerS: number;
  seed: number;
  /** When given, samples are clipped to ±capacity as a saturated sensor would report them. */
  capacity?: number;
  /** Extra blows at these times (s), drawn like the others: a double strike, a bounce. */
  extraBlowsAtS?: number[];
}

/**
 * The shape of one blow, peak 1 at u = 0 (u in seconds from the peak): the impact as a half-sine
 * pulse 0.8 ms long (a rise of 0.4 ms), then the rig ringing down — a damped sine at 1.2 kHz, 35 %
 * of the peak, decaying with a 1.5 ms time constant, so the blow has died out within about 8 ms.
 * Invented to look like a hammer blow on a stiff load cell; not a model of any particular rig.
 */
export const BLOW_SHAPE = { pulseS: 0.0008, ringHz: 1200, ringShare: 0.35, ringDecayS: 0.0015 } as const;

export function blowShape(u: number): number {
  const { pulseS, ringHz, ringShare, ringDecayS } = BLOW_SHAPE;
  const half = pulseS / 2;
  if (u < -half) return 0;
  if (u <= half) return Math.cos((Math.PI * u) / pulseS);
  const v = u - half;
  if (v > 6 * ringDecayS) return 0;
  return -ringShare * Math.exp(-v / ringDecayS) * Math.sin(2 * Math.PI * ringHz * v);
}

const SUPPORT_BEFORE_S = BLOW_SHAPE.pulseS / 2;
const SUPPORT_AFTER_S = BLOW_SHAPE.pulseS / 2 + 6 * BLOW_SHAPE.ringDecayS;

/**
 * A trace of blows at the given rate: blow k near (k + ½)·60/blowsPerMinute s, with a timing jitter
 * of SD 1 % of the interval; each peak drawn from N(peak, peakSD) (at least 10 % of peak); white
 * noise N(0, noiseSD) and a linear drift added; clipped at ±capacity when one is given. Only blows
 * whose whole shape fits in the trace are made. Returns the samples and the blows as drawn (time of
 * each peak and its height above the baseline, before any clipping), in time order.
 */
export function synthesizeTrace(options: SynthesizeTraceOptions): {
  samples: Float64Array;
  blows: { timeS: number; peak: number }[];
} {
  const { rateHz, seconds, blowsPerMinute, peak, peakSD, noiseSD, driftPerS, seed, capacity } = options;
  if (!(rateHz > 0) || !(seconds > 0) || !(blowsPerMinute > 0)) {
    throw new RangeError("rateHz, seconds and blowsPerMinute must be positive");
  }
  const uniform = mulberry32(seed);
  const normal = normalSource(uniform);
  const interval = 60 / blowsPerMinute;
  const drawPeak = () => Math.max(0.1 * peak, peak + peakSD * normal());

  const blows: { timeS: number; peak: number }[] = [];
  for (let k = 0; ; k++) {
    const t = (k + 0.5) * interval + 0.01 * interval * normal();
    if (t + SUPPORT_AFTER_S > seconds) break;
    const p = drawPeak();
    if (t - SUPPORT_BEFORE_S >= 0) blows.push({ timeS: t, peak: p });
  }
  for (const t of options.extraBlowsAtS ?? []) {
    const p = drawPeak();
    if (t - SUPPORT_BEFORE_S >= 0 && t + SUPPORT_AFTER_S <= seconds) blows.push({ timeS: t, peak: p });
  }
  blows.sort((a, b) => a.timeS - b.timeS);

  const n = Math.round(seconds * rateHz);
  const samples = new Float64Array(n);
  for (let i = 0; i < n; i++) samples[i] = noiseSD * normal() + (driftPerS * i) / rateHz;
  for (const blow of blows) {
    const from = Math.max(0, Math.ceil((blow.timeS - SUPPORT_BEFORE_S) * rateHz));
    const to = Math.min(n - 1, Math.floor((blow.timeS + SUPPORT_AFTER_S) * rateHz));
    for (let i = from; i <= to; i++) samples[i] = samples[i]! + blow.peak * blowShape(i / rateHz - blow.timeS);
  }
  if (capacity !== undefined) {
    for (let i = 0; i < n; i++) samples[i] = Math.max(-capacity, Math.min(capacity, samples[i]!));
  }
  return { samples, blows };
}
