// The bench's words and units, shared by the pages, the filing form and the feed. Our own names,
// describing what each thing does.
import { formatForce, formatTorque, N_PER_LBF, NM_PER_FT_LBF, type Units } from "../domain";

export type BenchQuantity = "peak_force_n" | "peak_torque_nm";
export type RigKind = "percussive_force" | "impact_torque";

export const RIG_KIND_LABELS: Record<RigKind, string> = {
  percussive_force: "Percussive force rig (load cell)",
  impact_torque: "Impact torque fixture (torque transducer)",
};
export const QUANTITY_LABELS: Record<BenchQuantity, string> = {
  peak_force_n: "Peak force of each blow",
  peak_torque_nm: "Peak torque of each impact",
};
export const TRIGGER_LABELS = { full: "Full trigger", lightest_steady: "Lightest steady trigger" } as const;
export const INLET_LABELS = {
  regulated_at_tool: "Inlet regulated at the tool",
  open_line: "Open line from a regulator",
} as const;
export const RIG_STATUS_LABELS = {
  current: "Calibration verified and current",
  unverified: "Calibration awaiting a moderator",
  expired: "Calibration expired",
  uncalibrated: "No calibration on record",
} as const;
export type RigStatusName = keyof typeof RIG_STATUS_LABELS;

/** The unit a bench value is shown in for this reader, and the factor from the stored SI value. */
export function benchUnit(quantity: BenchQuantity, units: Units): { label: string; perSi: number } {
  const metric = units.system === "metric";
  if (quantity === "peak_force_n") return metric ? { label: "N", perSi: 1 } : { label: "lbf", perSi: 1 / N_PER_LBF };
  return metric ? { label: "N·m", perSi: 1 } : { label: "ft·lbf", perSi: 1 / NM_PER_FT_LBF };
}

/** A stored bench value (N or N·m) in the reader's unit, whole. */
export const formatBench = (quantity: BenchQuantity, si: number | null | undefined, units: Units) =>
  quantity === "peak_force_n" ? formatForce(si, units) : formatTorque(si, units);

/**
 * A figure derived from a pooled one (per kg, per 100 mm, per $100) and both ends of its interval, in the
 * reader's unit to three significant figures: a ratio of a pooled force warrants no more.
 */
export function formatDerived(v: { estimate: number; lower: number; upper: number }, q: BenchQuantity, units: Units) {
  const { label, perSi } = benchUnit(q, units);
  const round = (x: number) => String(Number((x * perSi).toPrecision(3)));
  return { unit: label, estimate: round(v.estimate), lower: round(v.lower), upper: round(v.upper) };
}

/** A rig's sensor capacity, in the quantity its kind measures. */
export const formatCapacity = (kind: RigKind, si: number, units: Units) =>
  formatBench(kind === "percussive_force" ? "peak_force_n" : "peak_torque_nm", si, units);
