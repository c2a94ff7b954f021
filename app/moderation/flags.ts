// Automatic plausibility flags raised on a report for the moderator, each with a plain
// explanation. Pure; shared by the seeds, the filing form and the review queue. The checks that
// need other reports (time outlier, shared evidence, first report) are fed by
// app/moderation/submit-flags.server.ts.
import { median, medianAbsoluteDeviation } from "simple-statistics";

/** Allowance for gauge error between regulator and inlet readings (common practice: ±2 psi class gauges). */
export const GAUGE_ERROR_KPA = 15;
/** Above this a shop air reading is almost surely a typo or a unit mix-up (about 200 psi). */
export const PRESSURE_LIMIT_KPA = 1400;
/** Robust z beyond which a time counts as far outside the usual range (Iglewicz & Hoaglin, 1993). */
export const ROBUST_Z_LIMIT = 3.5;

export type FlagCode =
  | "above_rated_inlet"
  | "inlet_above_regulator"
  | "pressure_above_limit"
  | "time_outlier"
  | "duplicate_evidence"
  | "first_report"
  | "no_evidence";

export const FLAG_EXPLANATIONS: Record<FlagCode, string> = {
  above_rated_inlet:
    "The inlet pressure is above the tool's rated maximum. Running a tool over its rating is a safety hazard, and the result does not compare with others.",
  inlet_above_regulator: "The pressure at the tool is higher than the regulator reading by more than gauge error.",
  pressure_above_limit: "A pressure above 1,400 kPa (about 200 psi) is beyond shop air; check the unit.",
  time_outlier: "The time to result is far outside the usual range for this job on accepted reports.",
  duplicate_evidence: "A file of this report is byte-for-byte the same as one on another report.",
  first_report: "The reporter's first report: it needs a second look.",
  no_evidence: "No video or photo is attached.",
};

export interface FlagInput {
  inletKpa: number;
  regulatorKpa: number;
  maxInletKpa: number;
}

/** The safety rule: an inlet pressure above the tool's rating, beyond gauge error (the form warns, the report is flagged). */
export function aboveRatedInlet(inletKpa: number, maxInletKpa: number): boolean {
  return inletKpa > maxInletKpa + GAUGE_ERROR_KPA;
}

/** The flags that follow from the report's own numbers. */
export function plausibilityFlags(r: FlagInput): FlagCode[] {
  const flags: FlagCode[] = [];
  if (aboveRatedInlet(r.inletKpa, r.maxInletKpa)) flags.push("above_rated_inlet");
  if (r.inletKpa > r.regulatorKpa + GAUGE_ERROR_KPA) flags.push("inlet_above_regulator");
  if (Math.max(r.inletKpa, r.regulatorKpa) > PRESSURE_LIMIT_KPA) flags.push("pressure_above_limit");
  return flags;
}

/**
 * Modified z-score of Iglewicz & Hoaglin: 0.6745 · (x − median) / MAD, computed on log time
 * because times to result are long-tailed. Null when the sample is too small (< 10) or has no
 * spread.
 */
export function robustZ(value: number, sample: number[]): number | null {
  if (sample.length < 10 || !(value > 0)) return null;
  const logs = sample.filter((t) => t > 0).map(Math.log);
  const mad = medianAbsoluteDeviation(logs);
  if (mad === 0) return null;
  return (0.6745 * (Math.log(value) - median(logs))) / mad;
}
