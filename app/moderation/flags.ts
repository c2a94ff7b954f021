// Automatic plausibility flags raised on a report for the moderator. Pure; shared by the seeds,
// the filing form and the review queue.

/** Allowance for gauge error between regulator and inlet readings (common practice: ±2 psi class gauges). */
export const GAUGE_ERROR_KPA = 15;

export type FlagCode = "above_rated_inlet" | "inlet_above_regulator" | "implausibly_fast" | "no_hose_loss";

export const FLAG_EXPLANATIONS: Record<FlagCode, string> = {
  above_rated_inlet:
    "Inlet pressure is above the tool's rated maximum. Running a tool over its rating is a safety hazard and the result is not comparable.",
  inlet_above_regulator:
    "The pressure at the tool is higher than the regulator setting by more than gauge error.",
  implausibly_fast: "Time to result is shorter than a few seconds for a seized job; check the video.",
  no_hose_loss:
    "Inlet pressure was 'measured' under load but equals the regulator on a long or narrow hose; check the gauge shot.",
};

export interface FlagInput {
  inletKpa: number;
  regulatorKpa: number;
  inletSource: "measured_at_inlet" | "read_at_regulator" | "estimated";
  hoseIdMm: number;
  hoseLengthM: number;
  timeToResultS: number;
  seizedJob: boolean;
  maxInletKpa: number;
}

export function plausibilityFlags(r: FlagInput): FlagCode[] {
  const flags: FlagCode[] = [];
  if (r.inletKpa > r.maxInletKpa + GAUGE_ERROR_KPA) flags.push("above_rated_inlet");
  if (r.inletKpa > r.regulatorKpa + GAUGE_ERROR_KPA) flags.push("inlet_above_regulator");
  if (r.seizedJob && r.timeToResultS < 3) flags.push("implausibly_fast");
  if (
    r.inletSource === "measured_at_inlet" &&
    Math.abs(r.inletKpa - r.regulatorKpa) < 3 &&
    (r.hoseIdMm < 8 || r.hoseLengthM > 15)
  ) {
    flags.push("no_hose_loss");
  }
  return flags;
}
