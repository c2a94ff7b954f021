// The pressure-adjusted figures of one job type: ONE pooled logistic fit (an intercept per tool
// model, a common slope on inlet pressure, Firth-penalised; docs/decisions/010), and each model's
// figure at the rating point where its own reports reach it. Pure.
import { zCritical } from "./distributions";
import { pooledLogisticFitOfColumns } from "./pooled-logistic";
import { type PooledCellFit, pressureX, predictWith, REFERENCE_INLET_KPA, Z_95 } from "./predict";
import type { Interval } from "./proportions";

export { predictAt, pressureX, REFERENCE_INLET_KPA, type PooledCellFit } from "./predict";

/** Fewest reports with a known inlet pressure on a job for its pooled fit. */
export const MIN_FIT_REPORTS = 20;
const KPA_PER_PSI = 6.894757; // 1 psi = 6.894757 kPa (from the exact pound and inch)

export interface FitReport {
  model: number;
  inletKpa: number;
  freed: boolean;
}

/** One model's reports with a known inlet pressure on a job, as columns: pressure and outcome. */
export interface FitColumns {
  kpa: Float64Array;
  /** 1 freed, 0 not. */
  freed: Uint8Array;
}

export interface JobFit {
  /** Inlet-measured reports in the fit and the models they cover. */
  n: number;
  models: number;
  slope: number | null;
  slopeSE: number | null;
  converged: boolean;
  /** Why the job has no fit, when it has none. */
  reason: string | null;
  perModel: Map<number, { fit: PooledCellFit | null; adjusted: Interval | null; reason: string }>;
}

/** Linear-interpolation quantile (type 7) of sorted values. */
function quantile(sorted: ArrayLike<number>, p: number) {
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
}

const psi = (kpa: number) => Math.round(kpa / KPA_PER_PSI);

/**
 * One job's pooled fit from its reports with a known inlet pressure (already without the reports set aside),
 * and each model's pressure-adjusted figure at 620.5 kPa. A model gets a figure only where 620.5 kPa
 * lies between the 10th and 90th percentile of its own known inlet pressures on the job; the
 * `reason` says why not otherwise (or how the figure was got).
 * `models` lists every model with counted reports on the job, measured or not.
 */
export function jobPressureFit(reports: readonly FitReport[], models: readonly number[], confidence = 0.95): JobFit {
  const lists = new Map<number, { kpa: number[]; freed: number[] }>();
  for (const r of reports) {
    let list = lists.get(r.model);
    if (!list) lists.set(r.model, (list = { kpa: [], freed: [] }));
    list.kpa.push(r.inletKpa);
    list.freed.push(r.freed ? 1 : 0);
  }
  const byModel = new Map<number, FitColumns>();
  for (const [m, list] of lists)
    byModel.set(m, { kpa: Float64Array.from(list.kpa), freed: Uint8Array.from(list.freed) });
  return jobPressureFitOfColumns(byModel, models, confidence);
}

/**
 * jobPressureFit from each model's reports as columns (the stats refresh reads them so, without an
 * object per report). Models with no reports in `byModel` are skipped.
 */
export function jobPressureFitOfColumns(
  byModel: ReadonlyMap<number, FitColumns>,
  models: readonly number[],
  confidence = 0.95,
): JobFit {
  const perModel: JobFit["perModel"] = new Map();
  const fitted = [...byModel].filter(([, c]) => c.kpa.length > 0);
  const total = fitted.reduce((acc, [, c]) => acc + c.kpa.length, 0);
  const noFit = (reason: string): JobFit => {
    for (const m of models) perModel.set(m, { fit: null, adjusted: null, reason });
    return { n: total, models: fitted.length, slope: null, slopeSE: null, converged: false, reason, perModel };
  };
  if (total < MIN_FIT_REPORTS) {
    return noFit(
      `Only ${total} reports on this job have a known inlet pressure (measured at the inlet, or a regulator reading less the predicted line loss); the pressure fit needs ${MIN_FIT_REPORTS}.`,
    );
  }
  const spread = fitted.some(([, c]) => {
    let lo = Infinity;
    let hi = -Infinity;
    for (const k of c.kpa) {
      if (k < lo) lo = k;
      if (k > hi) hi = k;
    }
    return hi - lo >= 1;
  });
  if (!spread)
    return noFit(
      "No tool's reports with a known inlet pressure on this job differ in pressure; there is no pressure effect to fit.",
    );
  const gi = new Int32Array(total);
  const x = new Float64Array(total);
  const y = new Float64Array(total);
  let i = 0;
  fitted.forEach(([, c], k) => {
    for (let j = 0; j < c.kpa.length; j++, i++) {
      gi[i] = k;
      x[i] = pressureX(c.kpa[j]!);
      y[i] = c.freed[j]!;
    }
  });
  const fit = pooledLogisticFitOfColumns(
    fitted.map(([m]) => m),
    gi,
    x,
    y,
  );
  if (!fit.converged || !Number.isFinite(fit.slopeSE))
    return noFit("The job's pressure fit did not settle; no pressure-adjusted figures.");
  const z = zCritical(confidence);
  const { d, r, sigma } = fit.inverse;
  fit.groups.forEach((g, k) => {
    const kpas = Float64Array.from(fitted[k]![1].kpa);
    perModel.set(g.group as number, modelFigure(g.intercept, fit.slope, d[k]!, r[k]!, sigma, kpas, z));
  });
  for (const m of models) {
    if (!perModel.has(m))
      perModel.set(m, {
        fit: null,
        adjusted: null,
        reason:
          "None of its reports on this job has a known inlet pressure (measured at the inlet, or a regulator reading with its hose and couplers).",
      });
  }
  return {
    n: total,
    models: fitted.length,
    slope: fit.slope,
    slopeSE: fit.slopeSE,
    converged: true,
    reason: null,
    perModel,
  };
}

function modelFigure(
  intercept: number,
  slope: number,
  d: number,
  r: number,
  sigma: number,
  kpas: number[] | Float64Array,
  z: number,
) {
  kpas.sort((a, b) => a - b);
  const cell: PooledCellFit = {
    intercept,
    slope,
    d,
    r,
    sigma,
    n: kpas.length,
    p10Kpa: quantile(kpas, 0.1),
    p90Kpa: quantile(kpas, 0.9),
    minKpa: kpas[0]!,
    maxKpa: kpas[kpas.length - 1]!,
  };
  const inside = cell.p10Kpa <= REFERENCE_INLET_KPA && REFERENCE_INLET_KPA <= cell.p90Kpa;
  return {
    fit: cell,
    adjusted: inside ? predictWith(cell, REFERENCE_INLET_KPA, z) : null,
    reason: inside
      ? "From the job's pressure fit at 90 psi."
      : cell.p10Kpa === cell.p90Kpa
        ? `Its reports with a known inlet pressure on this job were all at ${psi(cell.p10Kpa)} psi; no figure at 90 psi.`
        : `Its reports with a known inlet pressure on this job ran at ${psi(cell.p10Kpa)}–${psi(cell.p90Kpa)} psi (10th–90th percentile); 90 psi is outside, so no figure there.`,
  };
}

/**
 * After an accept, one model's share of its job's fit without refitting the job: its intercept by
 * Firth-penalised Newton steps with the job's slope β and slope term σ held (the arrowhead form of
 * pooledLogisticFit for one group: modified score Σ(y − p + h(½ − p)), hᵢ = wᵢ(1/d + (xᵢ − r)²/σ)),
 * and its d, r there. The other models' figures and the slope wait for the job's next full refit.
 */
export function modelAtJobSlope(
  reports: readonly FitReport[],
  job: { slope: number; sigma: number },
  confidence = 0.95,
) {
  if (reports.length === 0)
    return {
      fit: null,
      adjusted: null,
      reason:
        "None of its reports on this job has a known inlet pressure (measured at the inlet, or a regulator reading with its hose and couplers).",
    };
  const x = reports.map((r) => pressureX(r.inletKpa));
  const y = reports.map((r) => (r.freed ? 1 : 0));
  const s = y.reduce((a: number, b) => a + b, 0);
  let alpha = Math.log((s + 0.5) / (reports.length - s + 0.5));
  let d = 0,
    r = 0;
  for (let it = 0; it < 50; it++) {
    d = 0;
    let c = 0;
    const p = x.map((xi) => 1 / (1 + Math.exp(-(alpha + job.slope * xi))));
    p.forEach((pi, i) => {
      const w = pi * (1 - pi);
      d += w;
      c += w * x[i]!;
    });
    r = c / d;
    let u = 0;
    p.forEach((pi, i) => {
      const w = pi * (1 - pi);
      u += y[i]! - pi + w * (1 / d + (x[i]! - r) ** 2 / job.sigma) * (0.5 - pi);
    });
    const step = Math.max(-5, Math.min(5, u / d));
    alpha += step;
    if (Math.abs(step) < 1e-8) break;
  }
  return modelFigure(
    alpha,
    job.slope,
    d,
    r,
    job.sigma,
    reports.map((q) => q.inletKpa),
    zFor(confidence),
  );
}

// 1.959964 for 95 % (published normal quantile); other levels from the library.
const zFor = (confidence: number) => (confidence === 0.95 ? Z_95 : zCritical(confidence));
