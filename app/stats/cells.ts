// One (tool model, job type) cell's figures from its accepted reports. Pure; the refresh job
// (refresh.server.ts) feeds it and stores the result.
import type { InletSource } from "~/domain";
import { bootstrapMedianInterval } from "./continuous";
import { logisticFit, logisticPredict } from "./logistic";
import { wilsonInterval } from "./proportions";

export const REFERENCE_INLET_KPA = 620.5; // 90 psi, the trade's rating point (common practice)
export const MIN_REPORTS_FOR_PRESSURE = 20;
export const MIN_PRESSURE_SPAN_KPA = 100; // 1 bar
export const FEW_REPORTS = 10;

export interface CellReport {
  freed: boolean;
  timeS: number;
  inletKpa: number;
  inletSource: InletSource;
}

export interface CellFigures {
  n: number;
  successes: number;
  estimate: number;
  lower: number;
  upper: number;
  time: { n: number; median: number; lower: number; upper: number } | null;
  adjusted: { estimate: number; lower: number; upper: number } | null;
  adjustedReason: string | null;
  fit: { intercept: number; slope: number; covariance: [[number, number], [number, number]]; minKpa: number; maxKpa: number } | null;
  measuredShare: number;
  estimatedShare: number;
}

/** The logistic fit works on x = inlet bar − 6.2 so the intercept is the rating-point logit. */
/** A stored cell's pressure-adjusted success at the reference inlet, or null where there is none. */
export function adjustedAtReference(cell: { adj_estimate: number | null; adj_lower: number | null; adj_upper: number | null }) {
  if (cell.adj_estimate == null || cell.adj_lower == null || cell.adj_upper == null) return null;
  return { inlet_kpa: REFERENCE_INLET_KPA, estimate: cell.adj_estimate, lower: cell.adj_lower, upper: cell.adj_upper };
}

export const pressureX = (kpa: number) => kpa / 100 - REFERENCE_INLET_KPA / 100;

export function cellFigures(reports: CellReport[], seed: string, resamples = 1000): CellFigures {
  const n = reports.length;
  const successes = reports.filter((r) => r.freed).length;
  const w = wilsonInterval(successes, n);
  const times = reports.filter((r) => r.freed).map((r) => r.timeS);
  const time = times.length >= 3
    ? (() => {
        const b = bootstrapMedianInterval(times, { resamples, seed });
        return { n: times.length, median: b.estimate, lower: b.lower, upper: b.upper };
      })()
    : null;

  let adjusted: CellFigures["adjusted"] = null;
  let adjustedReason: string | null = null;
  let fit: CellFigures["fit"] = null;
  const inlets = reports.map((r) => r.inletKpa);
  const minKpa = Math.min(...inlets);
  const maxKpa = Math.max(...inlets);
  if (n < MIN_REPORTS_FOR_PRESSURE) adjustedReason = `Only ${n} reports; the pressure adjustment needs ${MIN_REPORTS_FOR_PRESSURE}.`;
  else if (maxKpa - minKpa < MIN_PRESSURE_SPAN_KPA) adjustedReason = `Inlet pressures span only ${((maxKpa - minKpa) / 100).toFixed(2)} bar; the adjustment needs 1 bar.`;
  else if (successes === 0 || successes === n) adjustedReason = "Every report had the same outcome; there is no pressure effect to fit.";
  else {
    const f = logisticFit(reports.map((r) => pressureX(r.inletKpa)), reports.map((r) => (r.freed ? 1 : 0)));
    if (!f.converged || !Number.isFinite(f.interceptSE)) adjustedReason = "The outcomes split cleanly by pressure; no finite fit.";
    else {
      fit = { intercept: f.intercept, slope: f.slope, covariance: f.covariance, minKpa, maxKpa };
      adjusted = logisticPredict(f, 0);
    }
  }
  return {
    n, successes, estimate: w.estimate, lower: w.lower, upper: w.upper, time, adjusted, adjustedReason, fit,
    measuredShare: reports.filter((r) => r.inletSource === "measured_at_inlet").length / n,
    estimatedShare: reports.filter((r) => r.inletSource === "estimated").length / n,
  };
}

/** Predicted success at an inlet pressure from a stored fit, and whether that is outside the reports' pressures. */
export function predictAt(fit: NonNullable<CellFigures["fit"]>, inletKpa: number, confidence = 0.95) {
  const p = logisticPredict({ intercept: fit.intercept, slope: fit.slope, covariance: fit.covariance, interceptSE: 0, slopeSE: 0, converged: true, iterations: 0 }, pressureX(inletKpa), confidence);
  return { ...p, extrapolating: inletKpa < fit.minKpa || inletKpa > fit.maxKpa };
}
