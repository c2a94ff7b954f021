// Declared vibration values against what a real task does: the one stated factor and where it comes from.

/**
 * The in-use factor applied to a declared vibration total value. Declared values come from a type test
 * on a standard task (ISO 28927); real work — a seized joint, a worn bit, a tool held at an angle —
 * often vibrates more. CEN/TR 15350 (Mechanical vibration — assessment of exposure to hand-transmitted
 * vibration using available information including that provided by manufacturers) gives multiplication
 * factors for estimating workplace values from declared ones; Rimell, Notini, Mansfield & Edwards (2008,
 * published abstract) found declared values generally underestimate workplace emission. The value 2
 * (the upper end of the factors for pneumatic percussive and impact tools, 1.5–2) is from memory.
 */
export const IN_USE_FACTOR = 2;
export const IN_USE_SOURCE =
  "CEN/TR 15350 multiplication factors for estimating in-use vibration from declared values (1.5–2 for pneumatic percussive and impact tools; the factor 2 from memory)";
export const DECLARED_SOURCE = "the maker's declared value under the ISO 28927 test code";

export const VIBRATION_BASES = ["declared", "in-use"] as const;
export type VibrationBasis = (typeof VIBRATION_BASES)[number];

export interface InUseValue {
  value: number;
  factor: number;
  source: string;
}

/** The vibration value to use: the declared one, or declared × IN_USE_FACTOR, with the factor and its source. */
export function inUseValue(declared: number, choice: VibrationBasis): InUseValue {
  if (!Number.isFinite(declared) || declared < 0) throw new RangeError("declared must be a finite number ≥ 0");
  const factor = choice === "in-use" ? IN_USE_FACTOR : 1;
  return { value: declared * factor, factor, source: choice === "in-use" ? IN_USE_SOURCE : DECLARED_SOURCE };
}
