// Logistic regression of success on one predictor (here: inlet pressure). Pure functions.
import { checkConfidence, zCritical } from "./distributions";
import type { Interval } from "./proportions";

export interface LogisticFit {
  intercept: number;
  slope: number;
  interceptSE: number;
  slopeSE: number;
  /** Covariance of (intercept, slope): [[v00, v01], [v01, v11]]. */
  covariance: [[number, number], [number, number]];
  converged: boolean;
  iterations: number;
}

const expit = (eta: number) => 1 / (1 + Math.exp(-eta));

/**
 * Maximum-likelihood fit of logit P(y = 1) = a + b·x by iteratively reweighted least squares
 * (Newton–Raphson on the log-likelihood; McCullagh & Nelder 1989). The covariance is the inverse
 * of the information matrix XᵀWX at the optimum. Stops when the step is below 1e-10.
 */
export function logisticFit(x: readonly number[], y: readonly number[], maxIterations = 50): LogisticFit {
  if (x.length !== y.length || x.length < 3) throw new RangeError("need matching x and y with at least 3 points");
  if (y.some((v) => v !== 0 && v !== 1)) throw new RangeError("y must be 0 or 1");
  let a = 0,
    b = 0;
  let converged = false;
  let iterations = 0;
  let info: [number, number, number] = [0, 0, 0];
  for (; iterations < maxIterations; iterations++) {
    let g0 = 0,
      g1 = 0,
      h00 = 0,
      h01 = 0,
      h11 = 0;
    for (let i = 0; i < x.length; i++) {
      const p = expit(a + b * x[i]!);
      const w = p * (1 - p);
      g0 += y[i]! - p;
      g1 += (y[i]! - p) * x[i]!;
      h00 += w;
      h01 += w * x[i]!;
      h11 += w * x[i]! * x[i]!;
    }
    const det = h00 * h11 - h01 * h01;
    if (!(det > 1e-300)) break; // separated or constant x: no finite maximum
    const da = (h11 * g0 - h01 * g1) / det;
    const db = (-h01 * g0 + h00 * g1) / det;
    a += da;
    b += db;
    info = [h00, h01, h11];
    if (Math.abs(da) < 1e-10 && Math.abs(db) < 1e-10) {
      converged = true;
      iterations++;
      break;
    }
  }
  const det = info[0] * info[2] - info[1] * info[1];
  const v00 = info[2] / det,
    v01 = -info[1] / det,
    v11 = info[0] / det;
  return {
    intercept: a,
    slope: b,
    interceptSE: Math.sqrt(v00),
    slopeSE: Math.sqrt(v11),
    covariance: [
      [v00, v01],
      [v01, v11],
    ],
    converged,
    iterations,
  };
}

/** Predicted P(y = 1) at x with a Wald interval on the logit scale, mapped back. */
export function logisticPredict(fit: LogisticFit, x: number, confidence = 0.95): Interval {
  checkConfidence(confidence);
  const eta = fit.intercept + fit.slope * x;
  const [[v00, v01], [, v11]] = fit.covariance;
  const se = Math.sqrt(v00 + 2 * x * v01 + x * x * v11);
  const z = zCritical(confidence);
  return { estimate: expit(eta), lower: expit(eta - z * se), upper: expit(eta + z * se) };
}
