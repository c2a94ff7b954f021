// The force a job takes: field success on one job type against the tool's bench force, by logistic
// regression, and the force at which half the reports free the job (the ED50). Pure.
import { logisticFit, logisticPredict, pooledLogisticFit, type Interval, type LogisticFit } from "~/stats";
import { checkConfidence, zCritical } from "~/stats/distributions";

/** One field report: the tool's bench force (at the report's inlet pressure) and whether it freed the job. */
export interface ForceRow {
  force: number;
  y: 0 | 1;
}

/** Reports grouped by force: `successes` of `trials` freed the job. */
export interface ForceGroup {
  force: number;
  successes: number;
  trials: number;
}

export interface ForceFit extends LogisticFit {
  /** Force at which the fitted chance of success is ½: −intercept/slope. */
  ed50: number;
  /** The headline interval for the ED50 (by `method`); null where it has no finite bounds. */
  ed50Lower: number | null;
  ed50Upper: number | null;
  /** Fieller's interval; null when g ≥ 1 (the slope is not clearly non-zero, so the set is unbounded). */
  fiellerLower: number | null;
  fiellerUpper: number | null;
  /** Fieller's g = z²·Var(slope)/slope². */
  g: number;
  /** Delta-method interval ED50 ± z·SE. */
  deltaLower: number;
  deltaUpper: number;
  ed50SE: number;
  method: "Fieller" | "delta";
  firth: boolean;
  confidence: number;
}

export interface ForceOptions {
  /** Firth's penalised likelihood, for data with (quasi-)separation. */
  firth?: boolean;
  /** Which interval fills ed50Lower/ed50Upper. */
  interval?: "Fieller" | "delta";
}

/**
 * Logistic regression of success on force, logit P(y = 1) = a + b·force, by maximum likelihood
 * (Newton–Raphson, `logisticFit` of the stats module), or with `firth` by Firth's penalised likelihood
 * (Firth 1993, Biometrika 80:27–38; `pooledLogisticFit` with one group), which stays finite when
 * the reports separate by force. Force is centred at its mean for the fit and the estimates mapped back.
 *
 * ED50 = −a/b. Its intervals, both with the normal quantile z (no overdispersion factor):
 * - Fieller (Fieller 1954, JRSS B 16:175–185; Finney, Probit Analysis, 3rd ed. 1971 — both cited
 *   from memory): the forces x with (a + b·x)² ≤ z²·(V_aa + 2x·V_ab + x²·V_bb), bounded only when
 *   g = z²·V_bb/b² < 1; otherwise null bounds, since the data do not pin the force down.
 * - delta method: SE² = (V_aa + 2·ED50·V_ab + ED50²·V_bb)/b².
 * `interval` (default Fieller) picks which fills ed50Lower/ed50Upper; `method` says which.
 * Throws with fewer than 3 rows, non-finite force, or force that does not vary. A fit that does not
 * converge (separation without Firth) is returned with converged = false.
 */
export function forceForJob(
  rows: readonly ForceRow[],
  confidence = 0.95,
  { firth = false, interval = "Fieller" }: ForceOptions = {},
): ForceFit {
  checkConfidence(confidence);
  if (rows.length < 3) throw new RangeError("need at least 3 rows");
  if (rows.some((r) => !Number.isFinite(r.force))) throw new RangeError("force must be finite");
  if (rows.some((r) => r.y !== 0 && r.y !== 1)) throw new RangeError("y must be 0 or 1");
  const centre = rows.reduce((a, r) => a + r.force, 0) / rows.length;
  if (rows.every((r) => r.force === rows[0]!.force)) throw new RangeError("force must vary");
  const x = rows.map((r) => r.force - centre);
  const y = rows.map((r) => r.y);

  let a: number, b: number, vaa: number, vab: number, vbb: number, converged: boolean, iterations: number;
  if (firth) {
    const fit = pooledLogisticFit(
      x.map((xi, i) => ({ group: 0, x: xi, y: y[i]! })),
      { firth: true },
    );
    const { d, r, sigma } = fit.inverse;
    [a, b] = [fit.groups[0]!.intercept, fit.slope];
    [vaa, vab, vbb] = [1 / d[0]! + r[0]! ** 2 / sigma, -r[0]! / sigma, 1 / sigma];
    [converged, iterations] = [fit.converged, fit.iterations];
  } else {
    const fit = logisticFit(x, y);
    [a, b] = [fit.intercept, fit.slope];
    [[vaa, vab], [, vbb]] = fit.covariance;
    [converged, iterations] = [fit.converged, fit.iterations];
  }
  // Back from centred force: a' = a − b·c; Var(a') = Vaa − 2c·Vab + c²·Vbb; Cov(a', b) = Vab − c·Vbb.
  const intercept = a - b * centre;
  const v00 = vaa - 2 * centre * vab + centre * centre * vbb;
  const v01 = vab - centre * vbb;
  const v11 = vbb;

  const z = zCritical(confidence);
  // ED50 and its intervals on the centred scale (better conditioned), shifted back.
  const m = -a / b;
  const ed50SE = Math.sqrt(vaa + 2 * m * vab + m * m * vbb) / Math.abs(b);
  const g = (z * z * vbb) / (b * b);
  let fiellerLower: number | null = null;
  let fiellerUpper: number | null = null;
  if (g < 1) {
    // (b² − z²Vbb)·x² + 2(ab − z²Vab)·x + (a² − z²Vaa) ≤ 0; the leading coefficient is > 0 when g < 1.
    const qa = b * b - z * z * vbb;
    const qb = a * b - z * z * vab;
    const qc = a * a - z * z * vaa;
    const root = Math.sqrt(Math.max(0, qb * qb - qa * qc));
    fiellerLower = (-qb - root) / qa + centre;
    fiellerUpper = (-qb + root) / qa + centre;
  }
  const ed50 = m + centre;
  const deltaLower = ed50 - z * ed50SE;
  const deltaUpper = ed50 + z * ed50SE;

  return {
    intercept,
    slope: b,
    interceptSE: Math.sqrt(v00),
    slopeSE: Math.sqrt(v11),
    covariance: [
      [v00, v01],
      [v01, v11],
    ],
    converged,
    iterations,
    ed50,
    ed50Lower: interval === "Fieller" ? fiellerLower : deltaLower,
    ed50Upper: interval === "Fieller" ? fiellerUpper : deltaUpper,
    fiellerLower,
    fiellerUpper,
    g,
    deltaLower,
    deltaUpper,
    ed50SE,
    method: interval,
    firth,
    confidence,
  };
}

/**
 * The same fit from grouped reports (binomial counts, as dose–response data are usually printed):
 * each group is expanded into its successes and failures, which gives the same likelihood.
 */
export function forceForJobGrouped(groups: readonly ForceGroup[], confidence = 0.95, options: ForceOptions = {}) {
  const rows: ForceRow[] = [];
  for (const gr of groups) {
    const { force, successes, trials } = gr;
    if (!Number.isInteger(successes) || !Number.isInteger(trials) || successes < 0 || successes > trials) {
      throw new RangeError("need whole numbers with 0 ≤ successes ≤ trials");
    }
    for (let i = 0; i < trials; i++) rows.push({ force, y: i < successes ? 1 : 0 });
  }
  return forceForJob(rows, confidence, options);
}

/** Chance of success at a force, with a Wald interval on the logit scale mapped back (`logisticPredict`). */
export function chanceAtForce(fit: LogisticFit, force: number, confidence = 0.95): Interval {
  if (!Number.isFinite(force)) throw new RangeError("force must be finite");
  return logisticPredict(fit, force, confidence);
}

/** The fitted curve with its pointwise band at `steps` + 1 forces from `fromForce` to `toForce`, for drawing. */
export function forceCurve(fit: LogisticFit, fromForce: number, toForce: number, steps = 50, confidence = 0.95) {
  if (!Number.isFinite(fromForce) || !Number.isFinite(toForce)) throw new RangeError("forces must be finite");
  if (!(Number.isInteger(steps) && steps >= 1)) throw new RangeError("steps must be a whole number ≥ 1");
  return Array.from({ length: steps + 1 }, (_, i) => {
    const force = fromForce + ((toForce - fromForce) * i) / steps;
    return { force, ...chanceAtForce(fit, force, confidence) };
  });
}
