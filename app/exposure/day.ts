// A day on the tools: several tools and jobs, each with its time per job and that time's interval,
// carried through to the day's vibration and noise figures.
import { noiseDose } from "./noise";
import { shareOfActionValue, vibrationA8 } from "./vibration";

/** A figure with the interval carried from the times' intervals; a bound is null when a time lacks it. */
export interface CarriedInterval {
  estimate: number;
  lower: number | null;
  upper: number | null;
}

export interface DayItem {
  /** Vibration total value a_hv in m/s² (declared, or an in-use estimate: see inUseValue). */
  ahv: number;
  /** A-weighted sound pressure level L_pA in dB. */
  lpa: number;
  /** Trigger time per job in minutes, e.g. the job's median time to free it, with its interval. */
  minutesPerJob: CarriedInterval;
  jobsPerDay: number;
}

export interface DayExposure {
  /** A(8), m/s². */
  a8: CarriedInterval;
  /** A(8)² / 2.5²: the share of the daily action dose (energy, like exposure points / 100), not of the magnitude. */
  shareOfActionValue: CarriedInterval;
  /** L_EX,8h, dB(A). */
  lex8h: CarriedInterval;
  oshaDosePercent: CarriedInterval;
  nioshDosePercent: CarriedInterval;
  /** Total trigger time, hours per day. */
  triggerHours: CarriedInterval;
}

function check(items: readonly DayItem[]) {
  for (const { minutesPerJob: m, jobsPerDay } of items) {
    if (!Number.isFinite(jobsPerDay) || jobsPerDay < 0) throw new RangeError("jobsPerDay must be a finite number ≥ 0");
    for (const v of [m.estimate, m.lower ?? 0, m.upper ?? 0]) {
      if (!Number.isFinite(v) || v < 0) throw new RangeError("minutesPerJob must be finite numbers ≥ 0");
    }
    if ((m.lower !== null && m.lower > m.estimate) || (m.upper !== null && m.upper < m.estimate)) {
      throw new RangeError("minutesPerJob needs lower ≤ estimate ≤ upper");
    }
  }
}

/**
 * The day's figures from each item's hours = minutes per job × jobs per day / 60. Every figure here rises
 * with each item's time and with nothing else that varies (A(8), L_EX,8h and both doses are monotone
 * in time), so its interval is the figure at all items' lower times and at all upper times; a bound is
 * null when any item lacks that bound. The interval carries only the time's uncertainty: the declared
 * values' own uncertainty K is shown beside them, not folded in.
 */
export function dayExposure(items: readonly DayItem[]): DayExposure {
  check(items);
  const at = (pick: (m: CarriedInterval) => number | null) => {
    const hours: number[] = [];
    for (const item of items) {
      const minutes = pick(item.minutesPerJob);
      if (minutes === null) return null;
      hours.push((minutes * item.jobsPerDay) / 60);
    }
    const vibration = vibrationA8(items.map((item, i) => ({ ahv: item.ahv, hours: hours[i]! })));
    const noise = noiseDose(items.map((item, i) => ({ lpa: item.lpa, hours: hours[i]! })));
    return {
      a8: vibration.a8,
      shareOfActionValue: shareOfActionValue(vibration.a8),
      lex8h: noise.lex8h,
      oshaDosePercent: noise.oshaDosePercent,
      nioshDosePercent: noise.nioshDosePercent,
      triggerHours: hours.reduce((sum, h) => sum + h, 0),
    };
  };
  const estimate = at((m) => m.estimate)!;
  const lower = at((m) => m.lower);
  const upper = at((m) => m.upper);
  const carried = (key: keyof typeof estimate): CarriedInterval => ({
    estimate: estimate[key],
    lower: lower ? lower[key] : null,
    upper: upper ? upper[key] : null,
  });
  return {
    a8: carried("a8"),
    shareOfActionValue: carried("shareOfActionValue"),
    lex8h: carried("lex8h"),
    oshaDosePercent: carried("oshaDosePercent"),
    nioshDosePercent: carried("nioshDosePercent"),
    triggerHours: carried("triggerHours"),
  };
}
