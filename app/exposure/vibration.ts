// Hand-arm vibration: the daily exposure A(8) from each tool's vibration total value and trigger time.
// Pure functions; no framework, no database.

/**
 * Daily exposure action value, 2.5 m/s² A(8): above it the employer must act to reduce exposure
 * (Directive 2002/44/EC, Article 3(1)(b) — published).
 */
export const VIBRATION_ACTION_VALUE = 2.5;
/** Daily exposure limit value, 5 m/s² A(8): not to be exceeded (Directive 2002/44/EC, Article 3(1)(a) — published). */
export const VIBRATION_LIMIT_VALUE = 5;
/** The reference day of A(8), in hours (ISO 5349-1:2001). */
export const REFERENCE_DAY_HOURS = 8;

export interface VibrationExposure {
  /** Vibration total value a_hv of the tool in m/s² (declared under ISO 28927, or an in-use estimate). */
  ahv: number;
  /** Time with the hands on the running tool (trigger time), in hours per day. */
  hours: number;
}

export interface VibrationDay {
  /** Daily vibration exposure A(8) in m/s². */
  a8: number;
  /** Hours of the same mix of tools (same shares of time) that reach the action value; null without any vibration. */
  hoursToAction: number | null;
  /** Hours of the same mix of tools that reach the limit value; null without any vibration. */
  hoursToLimit: number | null;
  /** Exposure points, 100 at the action value and 400 at the limit value. */
  points: number;
}

function check(exposures: readonly VibrationExposure[]) {
  for (const { ahv, hours } of exposures) {
    if (!Number.isFinite(ahv) || ahv < 0) throw new RangeError("ahv must be a finite number ≥ 0 (m/s²)");
    if (!Number.isFinite(hours) || hours < 0) throw new RangeError("hours must be a finite number ≥ 0");
  }
}

/**
 * A(8) = √(Σ a_hv,i² · T_i / T₀), T₀ = 8 h (ISO 5349-1:2001, the partial exposures combined as an
 * energy sum — published formula, REFERENCES.md). The time to reach a value V with the same mix of
 * tools scales every T_i by (V / A(8))², since A(8)² is proportional to time: T_V = ΣT · (V / A(8))².
 * Exposure points = 2 · Σ a² · T (T in hours): the UK HSE's convention (INDG175 and its ready
 * reckoner, hse.gov.uk/vibration/hav/readyreckoner.htm — published: 100 points at the action value,
 * 400 at the limit, 5 m/s² for 3 h = 150 points), i.e. 100 · (A(8) / 2.5)².
 */
export function vibrationA8(exposures: readonly VibrationExposure[]): VibrationDay {
  check(exposures);
  let energy = 0; // Σ a² · T, in (m/s²)² · h
  let hours = 0;
  for (const { ahv, hours: t } of exposures) {
    energy += ahv * ahv * t;
    hours += t;
  }
  const a8 = Math.sqrt(energy / REFERENCE_DAY_HOURS);
  const hoursTo = (value: number) => (energy > 0 ? (hours * value * value) / (a8 * a8) : null);
  return {
    a8,
    hoursToAction: hoursTo(VIBRATION_ACTION_VALUE),
    hoursToLimit: hoursTo(VIBRATION_LIMIT_VALUE),
    points: 2 * energy,
  };
}

/**
 * The share of the daily action dose a day uses: A(8)² / 2.5² (1 = the action value reached). Energy,
 * not magnitude: it adds across tools and doubles with time, as exposure points do (points / 100).
 */
export function shareOfActionValue(a8: number): number {
  if (!Number.isFinite(a8) || a8 < 0) throw new RangeError("a8 must be a finite number ≥ 0");
  return (a8 * a8) / (VIBRATION_ACTION_VALUE * VIBRATION_ACTION_VALUE);
}
