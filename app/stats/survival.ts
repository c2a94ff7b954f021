// Time to free a part, counting the jobs where the tool gave up: the product-limit estimate.
import { checkConfidence, zCritical } from "./distributions";

export interface SurvivalStep {
  /** A time at which at least one job was freed. */
  time: number;
  /** Estimated share of jobs still not freed just after `time`. */
  survival: number;
  /** Jobs still under way just before `time` (not yet freed, not yet given up). */
  atRisk: number;
  /** Jobs freed at `time`. */
  events: number;
}

export interface KaplanMeier {
  steps: SurvivalStep[];
  /** Median time to free; null where the curve does not reach 0.5. */
  median: number | null;
  /** Brookmeyer–Crowley limits for the median; null where the bound set does not close. */
  lower: number | null;
  upper: number | null;
}

/**
 * Kaplan–Meier product-limit estimate (Kaplan & Meier 1958, JASA 53:457–481) of the share of jobs
 * not yet freed, S(t) = Π_{tᵢ ≤ t} (1 − dᵢ/nᵢ). `events[i]` true: freed at `times[i]`; false:
 * right-censored there ("not freed" or "freed with help": the technician stopped using this tool
 * then). At a tie, a censored job counts as still at risk at that time (the usual convention).
 *
 * The median is the first time with S(t) ≤ 0.5 (where S stays exactly 0.5 up to the next step,
 * the midpoint of the two times, as R's survival package prints it). Its interval is Brookmeyer &
 * Crowley's (1982, Biometrics 38:29–41): the times whose pointwise interval for S(t) contains 0.5,
 * here with the log-log transform — S^exp(±z·se), se = √(Σ dᵢ/(nᵢ(nᵢ−dᵢ))) / |log S| (Greenwood's
 * variance, Kalbfleisch & Prentice 1980). Lower limit: first time the lower band is ≤ 0.5; upper
 * limit: first time the upper band is ≤ 0.5; null where a band never gets there.
 * O(n log n).
 */
export function kaplanMeier(times: readonly number[], events: readonly boolean[], confidence = 0.95): KaplanMeier {
  if (times.length !== events.length) throw new RangeError("times and events must have the same length");
  if (times.some((t) => !(Number.isFinite(t) && t >= 0))) throw new RangeError("times must be finite and ≥ 0");
  checkConfidence(confidence);
  const tallied = tallySurvival(
    times.map((_, i) => i),
    (i) => times[i]!,
    (i) => events[i]!,
  );
  return kaplanMeierOfTally(tallied, confidence);
}

/** Jobs by distinct time, ascending: how many were freed (events) and given up (censored) at each. */
export interface SurvivalTally {
  times: number[];
  events: number[];
  censored: number[];
}

/** Items (reports, or indices into lists) as a survival tally: by distinct time, ascending. */
export function tallySurvival<T>(
  items: readonly T[],
  time: (item: T) => number,
  event: (item: T) => boolean,
): SurvivalTally {
  const out: SurvivalTally = { times: [], events: [], censored: [] };
  for (const item of [...items].sort((a, b) => time(a) - time(b))) {
    const last = out.times.length - 1;
    if (last < 0 || out.times[last] !== time(item)) {
      out.times.push(time(item));
      out.events.push(0);
      out.censored.push(0);
    }
    if (event(item)) out.events[out.events.length - 1]!++;
    else out.censored[out.censored.length - 1]!++;
  }
  return out;
}

/**
 * kaplanMeier from the times already tallied (the full refresh reads each cell this way, one entry
 * per distinct time rather than one per report): the same product, step for step.
 */
export function kaplanMeierOfTally(tallied: SurvivalTally, confidence = 0.95): KaplanMeier {
  checkConfidence(confidence);
  const z = zCritical(confidence);
  const steps: SurvivalStep[] = [];
  const lowerBand: number[] = [];
  const upperBand: number[] = [];
  let atRisk = 0;
  for (let j = 0; j < tallied.times.length; j++) atRisk += tallied.events[j]! + tallied.censored[j]!;
  let survival = 1;
  let greenwood = 0; // Σ d/(n(n−d))
  for (let j = 0; j < tallied.times.length; j++) {
    const t = tallied.times[j]!;
    const d = tallied.events[j]!;
    const c = tallied.censored[j]!;
    if (d > 0) {
      survival *= 1 - d / atRisk;
      greenwood = atRisk > d ? greenwood + d / (atRisk * (atRisk - d)) : Infinity;
      steps.push({ time: t, survival, atRisk, events: d });
      if (survival > 0 && Number.isFinite(greenwood)) {
        const se = Math.sqrt(greenwood) / Math.abs(Math.log(survival));
        lowerBand.push(survival ** Math.exp(z * se));
        upperBand.push(survival ** Math.exp(-z * se));
      } else {
        lowerBand.push(0);
        upperBand.push(0);
      }
    }
    atRisk -= d + c;
  }
  const stepTimes = steps.map((s) => s.time);
  return {
    steps,
    median: crossing(
      stepTimes,
      steps.map((s) => s.survival),
    ),
    lower: crossing(stepTimes, lowerBand),
    upper: crossing(stepTimes, upperBand),
  };
}

/** First step time where the curve is ≤ 0.5; where it sits at exactly 0.5, the midpoint to the next step. */
function crossing(times: number[], curve: number[]): number | null {
  const eps = 1e-12;
  for (let j = 0; j < curve.length; j++) {
    if (curve[j]! <= 0.5 + eps) {
      if (Math.abs(curve[j]! - 0.5) <= eps && j + 1 < curve.length) return (times[j]! + times[j + 1]!) / 2;
      return times[j]!;
    }
  }
  return null;
}
