// A rig's calibration: the reference loads and the rig's readings, fitted by least squares, and
// whether the calibration still counts. Pure functions; they run in the browser and on the server.
import { tCritical } from "~/stats";

export interface CalibrationPoint {
  reference: number;
  reading: number;
}

export interface CalibrationFit {
  degree: 1 | 2;
  /** reading = c0 + c1·reference (+ c2·reference²) */
  coefficients: number[];
  standardErrors: number[];
  residualSD: number;
  rSquared: number;
  n: number;
  residuals: { reference: number; reading: number; fitted: number; residual: number }[];
}

/** A quadratic term is kept by "auto" when its t statistic is significant at this level (two-sided). */
export const QUADRATIC_SIGNIFICANCE = 0.01;

/**
 * Ordinary least squares of reading on reference: reading = c0 + c1·ref (+ c2·ref²).
 *
 * Method: the reference is centred and scaled (z = (ref − mean)/sd) and the design [1, z, z²] is
 * factored by Householder QR (Golub & Van Loan, Matrix Computations, §5.3), so a load cell's
 * readings in the millions do not square the condition number as the normal equations would. The
 * coefficients and their covariance σ²(RᵀR)⁻¹ are then mapped back to the reference's own scale.
 * Checked against the NIST StRD linear regression datasets Norris and Pontius.
 *
 * degree "auto": the straight line, unless a quadratic fit's c2 has |t| above t(1 − 0.01/2, n − 3),
 * i.e. the residuals of the line carry curvature significant at 1 % (our rule; the t test of one
 * coefficient is the textbook one). Needs four points or more to consider the quadratic.
 *
 * Throws Error on fewer than degree + 2 points, a non-finite value, all references equal, or (for a
 * quadratic) fewer than three distinct references.
 */
export function fitCalibration(points: CalibrationPoint[], degree: 1 | 2 | "auto" = "auto"): CalibrationFit {
  for (const p of points) {
    if (!Number.isFinite(p.reference) || !Number.isFinite(p.reading)) {
      throw new Error("every reference load and reading must be a finite number");
    }
  }
  const minPoints = degree === 2 ? 4 : 3;
  if (points.length < minPoints) {
    throw new Error(`a ${degree === 2 ? "quadratic" : "straight-line"} fit needs at least ${minPoints} points`);
  }
  const distinct = new Set(points.map((p) => p.reference)).size;
  if (distinct < 2) throw new Error("all reference loads are equal: nothing to fit a line through");
  if (degree === 2 && distinct < 3) throw new Error("a quadratic fit needs at least three distinct reference loads");
  if (degree !== "auto") return leastSquares(points, degree);

  const line = leastSquares(points, 1);
  if (points.length < 4 || distinct < 3) return line;
  const quadratic = leastSquares(points, 2);
  const t = quadratic.coefficients[2]! / quadratic.standardErrors[2]!;
  const critical = tCritical(1 - QUADRATIC_SIGNIFICANCE, points.length - 3);
  return Math.abs(t) > critical ? quadratic : line;
}

function leastSquares(points: CalibrationPoint[], degree: 1 | 2): CalibrationFit {
  const n = points.length;
  const p = degree + 1;
  const xs = points.map((q) => q.reference);
  const ys = points.map((q) => q.reading);
  const mean = xs.reduce((s, x) => s + x, 0) / n;
  const scale = Math.sqrt(xs.reduce((s, x) => s + (x - mean) ** 2, 0) / n);

  // Columns of the design in the centred variable, stored column-major; y alongside.
  const a = Array.from({ length: p }, (_, j) => Float64Array.from(xs, (x) => ((x - mean) / scale) ** j));
  const qty = Float64Array.from(ys);
  householderQR(a, qty);

  // R is the upper triangle of a (a[j][i] for i ≤ j); back-substitute for the coefficients in z.
  const coefZ = new Array<number>(p).fill(0);
  for (let i = p - 1; i >= 0; i--) {
    let s = qty[i]!;
    for (let j = i + 1; j < p; j++) s -= a[j]![i]! * coefZ[j]!;
    coefZ[i] = s / a[i]![i]!;
  }
  // R⁻¹ (upper triangular), then (RᵀR)⁻¹ = R⁻¹R⁻ᵀ.
  const rInv = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (let i = 0; i < p; i++) {
    rInv[i]![i] = 1 / a[i]![i]!;
    for (let j = i + 1; j < p; j++) {
      let s = 0;
      for (let k = i; k < j; k++) s += rInv[i]![k]! * a[j]![k]!;
      rInv[i]![j] = -s / a[j]![j]!;
    }
  }

  const residuals = points.map((q) => {
    const z = (q.reference - mean) / scale;
    let fitted = 0;
    for (let j = p - 1; j >= 0; j--) fitted = fitted * z + coefZ[j]!;
    return { reference: q.reference, reading: q.reading, fitted, residual: q.reading - fitted };
  });
  const rss = residuals.reduce((s, r) => s + r.residual ** 2, 0);
  const yMean = ys.reduce((s, y) => s + y, 0) / n;
  const tss = ys.reduce((s, y) => s + (y - yMean) ** 2, 0);
  const sigma2 = rss / (n - p);

  // c = T·a maps the centred coefficients back: with u = 1/scale and m = mean,
  // c0 = a0 − a1·m·u + a2·m²u², c1 = a1·u − 2·a2·m·u², c2 = a2·u².
  const u = 1 / scale;
  const T =
    degree === 1
      ? [
          [1, -mean * u],
          [0, u],
        ]
      : [
          [1, -mean * u, mean * mean * u * u],
          [0, u, -2 * mean * u * u],
          [0, 0, u * u],
        ];
  const coefficients = T.map((row) => row.reduce((s, t, j) => s + t * coefZ[j]!, 0));
  // Var(c_i) = σ²·‖(T·R⁻¹)_i‖², a sum of squares, so no cancellation in the variance itself.
  const standardErrors = T.map((row) => {
    let ss = 0;
    for (let k = 0; k < p; k++) {
      let s = 0;
      for (let j = 0; j < p; j++) s += row[j]! * rInv[j]![k]!;
      ss += s * s;
    }
    return Math.sqrt(sigma2 * ss);
  });
  return {
    degree,
    coefficients,
    standardErrors,
    residualSD: Math.sqrt(sigma2),
    rSquared: 1 - rss / tss,
    n,
    residuals,
  };
}

/** In-place Householder QR of the column-major matrix `a`, applying the same reflections to `y`. */
function householderQR(a: Float64Array[], y: Float64Array) {
  const n = y.length;
  for (let k = 0; k < a.length; k++) {
    const col = a[k]!;
    let norm = 0;
    for (let i = k; i < n; i++) norm += col[i]! * col[i]!;
    norm = Math.sqrt(norm);
    if (norm === 0) throw new Error("the reference loads do not determine the fit (a singular design)");
    const alpha = col[k]! > 0 ? -norm : norm;
    const v = new Float64Array(n - k);
    for (let i = k; i < n; i++) v[i - k] = col[i]!;
    v[0] = v[0]! - alpha;
    let vv = 0;
    for (let i = 0; i < v.length; i++) vv += v[i]! * v[i]!;
    const reflect = (x: Float64Array) => {
      let s = 0;
      for (let i = k; i < n; i++) s += v[i - k]! * x[i]!;
      const f = (2 * s) / vv;
      for (let i = k; i < n; i++) x[i] = x[i]! - f * v[i - k]!;
    };
    for (let j = k; j < a.length; j++) reflect(a[j]!);
    reflect(y);
  }
}

/**
 * The reference load for a reading, by inverting the fit. A straight line inverts directly; a
 * quadratic has two roots (found by the cancellation-free form q = −(b + sign(b)·√disc)/2, roots
 * q/a and c/q; Press et al., Numerical Recipes, §5.6), and the one inside the calibrated range of
 * references is taken — or, for a reading outside that range, the root nearer to it.
 * Throws RangeError when no reference gives the reading (a flat line, or beyond a quadratic's vertex).
 */
export function readingToReference(fit: CalibrationFit, reading: number): number {
  const [c0 = 0, c1 = 0, c2 = 0] = fit.coefficients;
  if (fit.degree === 1 || c2 === 0) {
    if (c1 === 0) throw new RangeError("the calibration line is flat: a reading does not determine a load");
    return (reading - c0) / c1;
  }
  const c = c0 - reading;
  const disc = c1 * c1 - 4 * c2 * c;
  if (disc < 0) throw new RangeError("no reference load gives this reading on the calibration curve");
  const q = -0.5 * (c1 + (c1 >= 0 ? 1 : -1) * Math.sqrt(disc));
  const roots = [q / c2, q === 0 ? q / c2 : c / q];
  const refs = fit.residuals.map((r) => r.reference);
  const lo = Math.min(...refs);
  const hi = Math.max(...refs);
  const distance = (x: number) => (x < lo ? lo - x : x > hi ? x - hi : 0);
  return distance(roots[0]!) <= distance(roots[1]!) ? roots[0]! : roots[1]!;
}

export type CalibrationState = "current" | "unverified" | "expired";

/** Default age after which a calibration no longer counts, in months. */
export const CALIBRATION_MAX_AGE_MONTHS = 12;

/**
 * Whether a rig's calibration counts today. "expired" once `now` reaches calibratedOn plus
 * maxAgeMonths calendar months (UTC; the 31st of a month rolls back to the last day of a shorter
 * month), whatever its verification; otherwise "unverified" until a moderator has verified it, and
 * "current" after. The age limit is our rule (12 months by default), in line with the yearly
 * recalibration interval common for force measuring equipment (common practice).
 */
export function calibrationStatus({
  verifiedAt,
  calibratedOn,
  now,
  maxAgeMonths = CALIBRATION_MAX_AGE_MONTHS,
}: {
  verifiedAt: Date | null;
  calibratedOn: Date;
  now: Date;
  maxAgeMonths?: number;
}): { status: CalibrationState; expiresOn: Date } {
  if (Number.isNaN(calibratedOn.getTime()) || Number.isNaN(now.getTime())) throw new RangeError("invalid date");
  if (!Number.isInteger(maxAgeMonths) || maxAgeMonths < 1)
    throw new RangeError("maxAgeMonths must be a whole number ≥ 1");
  const expiresOn = addMonthsUTC(calibratedOn, maxAgeMonths);
  const status = now.getTime() >= expiresOn.getTime() ? "expired" : verifiedAt === null ? "unverified" : "current";
  return { status, expiresOn };
}

function addMonthsUTC(date: Date, months: number): Date {
  const y = date.getUTCFullYear();
  const m = date.getUTCMonth() + months;
  const lastDay = new Date(Date.UTC(y, m + 1, 0)).getUTCDate();
  const out = new Date(date.getTime());
  out.setUTCFullYear(y, m, Math.min(date.getUTCDate(), lastDay));
  return out;
}
