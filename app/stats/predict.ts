// A model's predicted success at any inlet pressure from its stored share of the job's pooled fit.
// The compare and job pages run it in the browser as the shopper moves the pressure, so it imports
// nothing at run time: the fit itself (pressure.ts, pooled-logistic.ts) and jStat stay on the server.
import type { PressureFit } from "../../db/schema";
import type { Interval } from "./proportions";

export const REFERENCE_INLET_KPA = 620.5; // 90 psi, the trade's rating point (common practice)

/** x of the fit: inlet bar gauge − 6.205, so an intercept is the model's logit at 90 psi. */
export const pressureX = (kpa: number) => (kpa - REFERENCE_INLET_KPA) / 100;

/** The two-sided 95 % normal quantile, 1.959964 (published tables). */
export const Z_95 = 1.959963984540054;

/** A model's share of its job's pooled fit, as stats_cells.fit stores it. */
export type PooledCellFit = PressureFit;

/** Wald on the logit scale at the normal quantile `z`. */
export function predictWith(fit: PooledCellFit, inletKpa: number, z: number): Interval {
  const x = pressureX(inletKpa);
  const eta = fit.intercept + fit.slope * x;
  // Var(α + βx) in the arrowhead form: 1/d + (x − r)²/σ (pooled-logistic.ts).
  const se = Math.sqrt(1 / fit.d + (x - fit.r) ** 2 / fit.sigma);
  const expit = (e: number) => 1 / (1 + Math.exp(-e));
  return { estimate: expit(eta), lower: expit(eta - z * se), upper: expit(eta + z * se) };
}

/**
 * The predicted success at an inlet pressure with its 95 % interval, and whether that pressure is
 * outside the 10th–90th percentile of the model's reports.
 */
export function predictAt(fit: PooledCellFit, inletKpa: number) {
  return {
    ...predictWith(fit, inletKpa, Z_95),
    extrapolating: inletKpa < fit.p10Kpa || inletKpa > fit.p90Kpa,
  };
}
