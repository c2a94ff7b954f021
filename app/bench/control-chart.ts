// The check standard's chart: each session's reading of the rig's reference tool, one value per
// session, on a Shewhart individuals chart.

/** d2 for moving ranges of two observations (NIST/SEMATECH e-Handbook §6.3.2.2). */
export const D2_PAIRS = 1.128;

export interface IndividualsChart {
  centre: number;
  meanMovingRange: number;
  lower: number;
  upper: number;
  points: { index: number; value: number; movingRange: number | null; outOfControl: boolean }[];
}

/**
 * Shewhart individuals chart (NIST/SEMATECH e-Handbook of Statistical Methods, §6.3.2.2
 * "Individuals Control Charts"): centre = mean of the values, MR̄ = mean of |xᵢ − xᵢ₋₁|, limits
 * centre ± 3·MR̄/1.128 (≈ 2.66·MR̄; the exact ratio is used, as the handbook's example does). A point
 * outside the limits is out of control. The limits come from all the values given (a phase-I chart).
 * Throws RangeError on fewer than two values or a non-finite one.
 */
export function individualsChart(values: number[]): IndividualsChart {
  if (values.length < 2) throw new RangeError("an individuals chart needs at least two values");
  if (!values.every(Number.isFinite)) throw new RangeError("every value must be a finite number");
  const centre = values.reduce((s, v) => s + v, 0) / values.length;
  let rangeSum = 0;
  for (let i = 1; i < values.length; i++) rangeSum += Math.abs(values[i]! - values[i - 1]!);
  const meanMovingRange = rangeSum / (values.length - 1);
  const half = (3 * meanMovingRange) / D2_PAIRS;
  const lower = centre - half;
  const upper = centre + half;
  const points = values.map((value, index) => ({
    index,
    value,
    movingRange: index === 0 ? null : Math.abs(value - values[index - 1]!),
    outOfControl: value > upper || value < lower,
  }));
  return { centre, meanMovingRange, lower, upper, points };
}
