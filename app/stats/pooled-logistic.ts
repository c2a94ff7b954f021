// One logistic model per job type: a success rate per tool model, one common pressure slope.
import { checkConfidence, zCritical } from "./distributions";
import type { Interval } from "./proportions";

export interface PooledRow {
  /** The tool model (any key that compares with ===). */
  group: string | number;
  /** The predictor, e.g. inlet pressure in bar − 6.205, so an intercept is the logit at 90 psi. */
  x: number;
  /** 1 = success, 0 = failure. */
  y: number;
}

export interface PooledLogisticFit {
  groups: { group: string | number; intercept: number; se: number; n: number }[];
  slope: number;
  slopeSE: number;
  /**
   * Covariance of (intercept of each group in `groups` order, then the slope): (G+1)×(G+1), built
   * on first read from `inverse` (so a job with many models does not pay for it unless asked).
   */
  readonly covariance: number[][];
  /**
   * The same covariance in arrowhead form, O(G): V = diag(1/d, 0) + (r, −1)(r, −1)ᵀ/σ, i.e.
   * V_jk = [j = k]/d_j + r_j·r_k/σ, V_jβ = −r_j/σ, V_ββ = 1/σ.
   */
  inverse: { d: number[]; r: number[]; sigma: number };
  firth: boolean;
  converged: boolean;
  iterations: number;
}

const expit = (eta: number) => 1 / (1 + Math.exp(-eta));
const logit = (p: number) => Math.log(p / (1 - p));

/**
 * Logistic regression logit P(y = 1) = α(group) + β·x: one intercept per group, one common slope.
 *
 * With `firth` (the default), Firth's penalised likelihood ℓ(θ) + ½·log det I(θ) (Firth 1993,
 * Biometrika 80:27–38), which keeps the estimates finite under separation (Heinze & Schemper 2002,
 * Statistics in Medicine 21:2409–2419): Newton–Raphson on the modified score
 * Uⱼ* = Σᵢ (yᵢ − pᵢ + hᵢ(½ − pᵢ))·xᵢⱼ, hᵢ the diagonal of the hat matrix W½X(XᵀWX)⁻¹XᵀW½, with each
 * step capped at 5 and halved until the penalised likelihood does not fall (as R's logistf does).
 * Without it, ordinary maximum likelihood by the same iteration. Standard errors and covariance are
 * the inverse of the information XᵀWX at the estimate.
 *
 * The information is an arrowhead matrix (diagonal in the intercepts, one dense row and column for
 * the slope), so its inverse, determinant and the hat values come from the Schur complement of the
 * slope: O(n + G) per iteration, hundreds of models in one job cost no more than a few.
 * Throws when x does not vary within any group (the slope is then not estimable).
 */
export function pooledLogisticFit(
  rows: readonly PooledRow[],
  { firth = true, maxIterations = 100 } = {},
): PooledLogisticFit {
  // pooledLogisticFitOfColumns checks the values (none, y not 0 or 1, x not finite).
  const index = new Map<string | number, number>();
  const gi = Int32Array.from(rows, (r) => {
    let k = index.get(r.group);
    if (k === undefined) index.set(r.group, (k = index.size));
    return k;
  });
  return pooledLogisticFitOfColumns(
    [...index.keys()],
    gi,
    Float64Array.from(rows, (r) => r.x),
    Float64Array.from(rows, (r) => r.y),
    { firth, maxIterations },
  );
}

/**
 * pooledLogisticFit from columns, without a row object per observation (the stats refresh fits
 * hundreds of thousands of reports): `groups[gi[i]]` is row i's group, `x[i]` its predictor,
 * `y[i]` its outcome (0 or 1). Every group must have at least one row.
 */
export function pooledLogisticFitOfColumns(
  groups: readonly (string | number)[],
  gi: Int32Array,
  x: Float64Array,
  y: Float64Array,
  { firth = true, maxIterations = 100 } = {},
): PooledLogisticFit {
  const G = groups.length;
  const N = gi.length;
  if (N === 0) throw new RangeError("need at least one row");
  if (x.length !== N || y.length !== N) throw new RangeError("gi, x and y must have the same length");
  for (let i = 0; i < N; i++) {
    if (y[i] !== 0 && y[i] !== 1) throw new RangeError("y must be 0 or 1");
    if (!Number.isFinite(x[i]!)) throw new RangeError("x must be finite");
    if (!(gi[i]! >= 0 && gi[i]! < G)) throw new RangeError("gi must index groups");
  }
  const n = new Array<number>(G).fill(0);
  const s = new Array<number>(G).fill(0);
  const xMin = new Array<number>(G).fill(Infinity);
  const xMax = new Array<number>(G).fill(-Infinity);
  for (let i = 0; i < N; i++) {
    const k = gi[i]!;
    n[k]!++;
    s[k]! += y[i]!;
    xMin[k] = Math.min(xMin[k]!, x[i]!);
    xMax[k] = Math.max(xMax[k]!, x[i]!);
  }
  if (n.some((nk) => nk === 0)) throw new RangeError("every group needs at least one row");
  if (!n.some((_, k) => xMax[k]! > xMin[k]!)) throw new RangeError("x must vary within at least one group");

  // Information at θ = (α, β): d = Σ w per group, c = Σ w·x per group, q = Σ w·x².
  // Its inverse: V_ββ = 1/σ, σ = q − Σ c²/d; V_αβ = −(c/d)/σ; V_αα = diag(1/d) + (c/d)(c/d)ᵀ/σ.
  // The same pass gathers the (modified) score at θ, so an accepted trial needs no further pass:
  // with hᵢ = wᵢ(1/d + (xᵢ − r)²/σ), Σ hᵢ(½ − pᵢ)·xᵢᵐ expands into per-group sums of
  // wᵢ(½ − pᵢ)·xᵢʲ (j = 0…3) once d, r and σ are known.
  const information = (alpha: ArrayLike<number>, beta: number) => {
    const d = new Float64Array(G);
    const c = new Float64Array(G);
    const resid = new Float64Array(G); // Σ (y − p) per group
    const m0 = new Float64Array(G); // Σ w(½ − p)·xʲ per group, j = 0…3
    const m1 = new Float64Array(G);
    const m2 = new Float64Array(G);
    const m3 = new Float64Array(G);
    let residX = 0;
    let q = 0;
    let loglik = 0;
    for (let i = 0; i < N; i++) {
      const k = gi[i]!;
      const xi = x[i]!;
      const eta = alpha[k]! + beta * xi;
      // One exp and one log1p give both p and the log-likelihood, without losing precision for large |η|.
      const e = Math.exp(-Math.abs(eta));
      const l1p = Math.log1p(e);
      const pi = eta >= 0 ? 1 / (1 + e) : e / (1 + e);
      const yi = y[i]!;
      loglik -= yi === 1 ? (eta >= 0 ? l1p : l1p - eta) : eta >= 0 ? eta + l1p : l1p;
      const w = pi * (1 - pi);
      const wx = w * xi;
      d[k]! += w;
      c[k]! += wx;
      q += wx * xi;
      const rr = yi - pi;
      resid[k]! += rr;
      residX += rr * xi;
      if (firth) {
        const v = w * (0.5 - pi);
        const vx = v * xi;
        const vxx = vx * xi;
        m0[k]! += v;
        m1[k]! += vx;
        m2[k]! += vxx;
        m3[k]! += vxx * xi;
      }
    }
    const r = Array.from(c, (ck, k) => ck / d[k]!);
    let sigma = q;
    for (let k = 0; k < G; k++) sigma -= c[k]! * r[k]!;
    let logDet = 0;
    for (let k = 0; k < G; k++) logDet += Math.log(d[k]!);
    logDet += Math.log(sigma);
    const uA = Array.from(resid);
    let uB = residX;
    if (firth) {
      for (let k = 0; k < G; k++) {
        const rk = r[k]!;
        // Σ h(½ − p) = Σ v/d + Σ v(x − r)²/σ, and the same times x for the slope.
        uA[k]! += m0[k]! / d[k]! + (m2[k]! - 2 * rk * m1[k]! + rk * rk * m0[k]!) / sigma;
        uB += m1[k]! / d[k]! + (m3[k]! - 2 * rk * m2[k]! + rk * rk * m1[k]!) / sigma;
      }
    }
    return {
      d: Array.from(d),
      r,
      sigma,
      uA,
      uB,
      loglik,
      penalised: firth ? loglik + 0.5 * logDet : loglik,
    };
  };

  let alpha = s.map((sk, k) => logit((sk + 0.5) / (n[k]! + 1)));
  let beta = 0;
  let state = information(alpha, beta);
  let converged = false;
  let iterations = 0;
  let previousStep = Infinity;
  for (; iterations < maxIterations; iterations++) {
    // Modified score (plain score when firth is off), gathered with the information.
    const { d, r, sigma, uA, uB } = state;
    // Step V·U by the block inverse.
    const stepB = (uB - uA.reduce((acc, u, k) => acc + r[k]! * u, 0)) / sigma;
    const stepA = uA.map((u, k) => u / d[k]! - r[k]! * stepB);
    const largest = Math.max(Math.abs(stepB), ...stepA.map(Math.abs));
    if (!Number.isFinite(largest)) break; // information singular: ML under separation
    // UᵀVU: a step s·V·U gains (s − s²/2)·UᵀVU on the quadratic model of the (penalised) likelihood.
    const curvatureGain = stepA.reduce((acc, step, k) => acc + step * uA[k]!, stepB * uB);
    // Where a small step promises less than the (penalised) likelihood can be summed to over all
    // rows (a few units in its 13th digit), no line search can judge it: the step is taken whole
    // (Newton's own quadratic convergence) until it stops shrinking — the estimate is then at the
    // optimum to the precision its score can be summed to. (A large step promising nothing is ML
    // drifting off under separation: that goes on to the line search below, which gives up.)
    if (largest < 1e-5 && curvatureGain / 2 < 1e-13 * (1 + Math.abs(state.penalised))) {
      alpha = alpha.map((v, j) => v + stepA[j]!);
      beta += stepB;
      state = information(alpha, beta);
      const stalled = largest > previousStep / 4;
      previousStep = largest;
      if (largest < 1e-8 || stalled) {
        converged = Number.isFinite(state.penalised);
        iterations++;
        break;
      }
      continue;
    }
    previousStep = largest;
    let scale = largest > 5 ? 5 / largest : 1;
    let accepted = false;
    const tryScale = (k: number) => {
      const a = alpha.map((v, j) => v + k * stepA[j]!);
      const b = beta + k * stepB;
      return { a, b, next: information(a, b) };
    };
    for (let halving = 0; halving < 30 && !accepted; halving++, scale /= 2) {
      let trial = tryScale(scale);
      if (!(Number.isFinite(trial.next.penalised) && trial.next.penalised >= state.penalised - 1e-12)) continue;
      // The expected information can overshoot the penalised likelihood's curvature by up to 2× (a
      // model seen in one report: the step then flips back and forth); take the half step if better.
      // Where the step gained at least 2/3 of what the quadratic model promised, the curvature is
      // under 4/3 of the model's and the half step cannot gain more, so it is not tried.
      const gain = trial.next.penalised - state.penalised;
      if (!(gain >= (2 / 3) * (scale - (scale * scale) / 2) * curvatureGain)) {
        const half = tryScale(scale / 2);
        if (half.next.penalised > trial.next.penalised) trial = half;
      }
      [alpha, beta, state, accepted] = [trial.a, trial.b, trial.next, true];
    }
    if (!accepted) break;
    if (largest < 1e-8) {
      converged = true;
      iterations++;
      break;
    }
  }

  const { d, r, sigma } = state;
  const fit = {
    groups: groups.map((group, k) => ({
      group,
      intercept: alpha[k]!,
      se: Math.sqrt(1 / d[k]! + (r[k]! * r[k]!) / sigma),
      n: n[k]!,
    })),
    slope: beta,
    slopeSE: Math.sqrt(1 / sigma),
    inverse: { d, r, sigma },
    firth,
    converged,
    iterations,
  };
  let dense: number[][] | undefined;
  return Object.defineProperty(fit, "covariance", {
    enumerable: true,
    get: () => (dense ??= denseCovariance(d, r, sigma)),
  }) as PooledLogisticFit;
}

function denseCovariance(d: number[], r: number[], sigma: number): number[][] {
  const G = d.length;
  const covariance = Array.from({ length: G + 1 }, () => new Array<number>(G + 1).fill(0));
  for (let a = 0; a < G; a++) {
    for (let b = 0; b < G; b++) covariance[a]![b] = (r[a]! * r[b]!) / sigma + (a === b ? 1 / d[a]! : 0);
    covariance[a]![G] = covariance[G]![a] = -r[a]! / sigma;
  }
  covariance[G]![G] = 1 / sigma;
  return covariance;
}

/** P(y = 1) for `group` at x, with a Wald interval on the logit scale mapped back. */
export function pooledPredict(fit: PooledLogisticFit, group: string | number, x: number, confidence = 0.95): Interval {
  checkConfidence(confidence);
  const k = fit.groups.findIndex((row) => row.group === group);
  if (k < 0) throw new RangeError(`no group ${String(group)} in this fit`);
  const { d, r, sigma } = fit.inverse;
  const eta = fit.groups[k]!.intercept + fit.slope * x;
  // V_kk + 2x·V_kβ + x²·V_ββ, which the arrowhead form reduces to 1/d_k + (x − r_k)²/σ.
  const se = Math.sqrt(1 / d[k]! + (x - r[k]!) ** 2 / sigma);
  const z = zCritical(confidence);
  return { estimate: expit(eta), lower: expit(eta - z * se), upper: expit(eta + z * se) };
}
