// How a model's bench force changes with inlet pressure, from runs at several pressures: a straight
// line with its interval, the force at the rating point, and a band for drawing. Pure.
import { RATED_INLET_KPA } from "~/domain";
import { checkConfidence, tCritical } from "~/stats/distributions";

/** One run's (or trial's) inlet pressure at the tool and its force. */
export interface PressurePoint {
  pressureKpa: number;
  force: number;
}

export interface BandPoint {
  pressureKpa: number;
  fit: number;
  lower: number;
  upper: number;
}

export interface PressureSlope {
  /** Force per kPa, with its t interval. */
  slope: number;
  slopeSE: number;
  slopeLower: number;
  slopeUpper: number;
  /** Force at 0 kPa gauge (an extrapolation; kept for the line, not for display). */
  intercept: number;
  interceptSE: number;
  /** Mean force at `atKpa` with its t interval for the mean. */
  atKpa: number;
  predicted: number;
  predictedLower: number;
  predictedUpper: number;
  /** √(residual sum of squares / (n − 2)). */
  residualSD: number;
  n: number;
  /** Pointwise confidence band for the mean line, evenly spaced over the measured pressures. */
  band: BandPoint[];
}

/**
 * Ordinary least squares of force on inlet pressure, force = a + b·p (the textbook formulas, e.g. Draper &
 * Smith, Applied Regression Analysis, ch. 1 — cited from memory): b = Sxy/Sxx, a = ȳ − b·p̄, s² = RSS/(n − 2), SE(b) = s/√Sxx,
 * SE(a) = s·√(1/n + p̄²/Sxx), and the mean at p: a + b·p ± t(n − 2)·s·√(1/n + (p − p̄)²/Sxx).
 * Sums are taken about the means, which keeps them exact enough at pressures near 600 kPa.
 *
 * The band is pointwise (each point covers with the stated confidence on its own, not the whole line at
 * once — that would be the wider Working–Hotelling band), at `steps` + 1 pressures from the lowest to
 * the highest measured. Default prediction point: the trade's rating point, 90 psi at the inlet.
 * Null with fewer than 3 points or fewer than 2 distinct pressures (no slope or no residual spread).
 */
export function pressureSlope(
  points: readonly PressurePoint[],
  atKpa: number = RATED_INLET_KPA,
  confidence = 0.95,
  { steps = 20 } = {},
): PressureSlope | null {
  checkConfidence(confidence);
  if (!Number.isFinite(atKpa)) throw new RangeError("atKpa must be finite");
  if (!(Number.isInteger(steps) && steps >= 1)) throw new RangeError("steps must be a whole number ≥ 1");
  for (const pt of points) {
    if (!Number.isFinite(pt.pressureKpa) || !Number.isFinite(pt.force)) {
      throw new RangeError("each point needs a finite pressure and force");
    }
  }
  const n = points.length;
  if (n < 3 || new Set(points.map((pt) => pt.pressureKpa)).size < 2) return null;

  const xBar = points.reduce((a, pt) => a + pt.pressureKpa, 0) / n;
  const yBar = points.reduce((a, pt) => a + pt.force, 0) / n;
  let sxx = 0;
  let sxy = 0;
  for (const pt of points) {
    sxx += (pt.pressureKpa - xBar) ** 2;
    sxy += (pt.pressureKpa - xBar) * (pt.force - yBar);
  }
  const slope = sxy / sxx;
  const intercept = yBar - slope * xBar;
  let rss = 0;
  for (const pt of points) rss += (pt.force - intercept - slope * pt.pressureKpa) ** 2;
  const residualSD = Math.sqrt(rss / (n - 2));
  const t = tCritical(confidence, n - 2);

  const slopeSE = residualSD / Math.sqrt(sxx);
  const interceptSE = residualSD * Math.sqrt(1 / n + (xBar * xBar) / sxx);
  const meanAt = (p: number) => {
    const fit = intercept + slope * p;
    const half = t * residualSD * Math.sqrt(1 / n + (p - xBar) ** 2 / sxx);
    return { fit, lower: fit - half, upper: fit + half };
  };

  const at = meanAt(atKpa);
  const lo = Math.min(...points.map((pt) => pt.pressureKpa));
  const hi = Math.max(...points.map((pt) => pt.pressureKpa));
  const band = Array.from({ length: steps + 1 }, (_, i) => {
    const pressureKpa = lo + ((hi - lo) * i) / steps;
    return { pressureKpa, ...meanAt(pressureKpa) };
  });

  return {
    slope,
    slopeSE,
    slopeLower: slope - t * slopeSE,
    slopeUpper: slope + t * slopeSE,
    intercept,
    interceptSE,
    atKpa,
    predicted: at.fit,
    predictedLower: at.lower,
    predictedUpper: at.upper,
    residualSD,
    n,
    band,
  };
}
